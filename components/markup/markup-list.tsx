"use client";
// The markup on the frame on screen, as text: kind, measure and note text. It is what a screen reader
// gets of the canvas, and a way to select a shape without pointing at it.
import { clsx } from "clsx";
import { measureOf } from "@/lib/markup/kinds";
import type { Shape } from "@/lib/markup/shape";

const KIND_LABELS = { ruler: "Ruler", protractor: "Protractor", arrow: "Arrow", ring: "Ring", pen: "Pen", note: "Note" } as const;

export function MarkupList({
  shapes,
  metresPerPixel,
  selectedId,
  onSelect,
}: {
  shapes: Shape[];
  metresPerPixel: number | null;
  selectedId: string | null;
  onSelect?: (shapeId: string) => void;
}) {
  if (shapes.length === 0) return <p className="text-xs text-ink-faint">No markup on this frame.</p>;
  return (
    <ul className="flex flex-wrap gap-1.5" aria-label="Markup on this frame" data-testid="markup-list">
      {shapes.map((shape) => {
        const measure = measureOf(shape.geometry, { metresPerPixel });
        const text = shape.geometry.kind === "note" ? `“${shape.geometry.text}”` : measure?.label;
        return (
          <li
            key={shape.id}
            data-testid="markup-shape"
            data-shape-id={shape.id}
            data-kind={shape.geometry.kind}
            data-frame-index={shape.frameIndex}
            data-measure={measure ? measure.value.toFixed(2) : undefined}
          >
            <button
              type="button"
              disabled={!onSelect}
              onClick={() => onSelect?.(shape.id)}
              className={clsx(
                "nums rounded border px-2 py-0.5 text-xs",
                shape.id === selectedId ? "border-action bg-action-soft text-ink" : "border-line bg-surface text-ink-muted",
              )}
            >
              {KIND_LABELS[shape.geometry.kind]}
              {text ? ` · ${text}` : ""}
            </button>
          </li>
        );
      })}
    </ul>
  );
}
