"use client";
// The coach's markup tools: which tool, colour and stroke, how long a shape stays on screen, undo/redo
// and delete. Applies to new shapes and to the selected one.
import { clsx } from "clsx";
import type { ToolName } from "@/lib/markup/tools";
import { MARKUP_COLOURS, MARKUP_STROKES, type MarkupStyle } from "@/lib/validation/markup";
import { COLOUR_SWATCHES } from "./style";

export const TOOL_LABELS: Record<ToolName, { label: string; key: string }> = {
  select: { label: "Select", key: "V" },
  ruler: { label: "Ruler", key: "R" },
  protractor: { label: "Protractor", key: "A" },
  "protractor-vertical": { label: "Angle to vertical", key: "P" },
  arrow: { label: "Arrow", key: "W" },
  ring: { label: "Ring", key: "O" },
  pen: { label: "Pen", key: "D" },
  note: { label: "Note", key: "T" },
};

export type SpanChoice = "frame" | "rep" | "clip";
const SPAN_LABELS: Record<SpanChoice, string> = { frame: "This frame", rep: "To rep end", clip: "To clip end" };
const STROKE_LABELS = { fine: "Fine", medium: "Medium", heavy: "Heavy" } as const;

const chip = (active: boolean) =>
  clsx(
    "inline-flex h-8 items-center rounded px-2.5 text-sm font-medium",
    active ? "bg-action text-on-action" : "border border-line-strong bg-surface text-ink hover:bg-sunken",
  );

export function MarkupToolbar({
  tool,
  onTool,
  style,
  onStyle,
  span,
  onSpan,
  canUndo,
  canRedo,
  onUndo,
  onRedo,
  hasSelection,
  onDelete,
  pendingCount,
}: {
  tool: ToolName;
  onTool: (tool: ToolName) => void;
  style: MarkupStyle;
  onStyle: (style: MarkupStyle) => void;
  span: SpanChoice;
  onSpan: (span: SpanChoice) => void;
  canUndo: boolean;
  canRedo: boolean;
  onUndo: () => void;
  onRedo: () => void;
  hasSelection: boolean;
  onDelete: () => void;
  pendingCount: number;
}) {
  return (
    <div className="grid gap-2" data-testid="markup-toolbar">
      <div role="toolbar" aria-label="Markup tools" className="flex flex-wrap gap-1">
        {(Object.keys(TOOL_LABELS) as ToolName[]).map((name) => (
          <button
            key={name}
            type="button"
            className={chip(tool === name)}
            aria-pressed={tool === name}
            title={`${TOOL_LABELS[name].label} (${TOOL_LABELS[name].key})`}
            onClick={() => onTool(name)}
          >
            {TOOL_LABELS[name].label}
          </button>
        ))}
      </div>
      <div className="flex flex-wrap items-center gap-3">
        <div role="radiogroup" aria-label="Colour" className="flex gap-1">
          {MARKUP_COLOURS.map((colour) => (
            <button
              key={colour}
              type="button"
              role="radio"
              aria-checked={style.colour === colour}
              aria-label={COLOUR_SWATCHES[colour].label}
              title={COLOUR_SWATCHES[colour].label}
              className={clsx(
                "size-7 rounded-full border border-line-strong",
                COLOUR_SWATCHES[colour].className,
                style.colour === colour && "outline-2 outline-offset-2 outline-focus",
              )}
              onClick={() => onStyle({ ...style, colour })}
            />
          ))}
        </div>
        <div role="radiogroup" aria-label="Stroke" className="flex gap-1">
          {MARKUP_STROKES.map((stroke) => (
            <button key={stroke} type="button" role="radio" aria-checked={style.stroke === stroke} className={chip(style.stroke === stroke)} onClick={() => onStyle({ ...style, stroke })}>
              {STROKE_LABELS[stroke]}
            </button>
          ))}
        </div>
        <div role="radiogroup" aria-label="Show for" className="flex gap-1">
          {(Object.keys(SPAN_LABELS) as SpanChoice[]).map((choice) => (
            <button key={choice} type="button" role="radio" aria-checked={span === choice} className={chip(span === choice)} onClick={() => onSpan(choice)}>
              {SPAN_LABELS[choice]}
            </button>
          ))}
        </div>
        <div className="flex gap-1">
          <button type="button" className={chip(false)} disabled={!canUndo} onClick={onUndo} title="Undo (Ctrl+Z)">
            Undo
          </button>
          <button type="button" className={chip(false)} disabled={!canRedo} onClick={onRedo} title="Redo (Ctrl+Shift+Z)">
            Redo
          </button>
          <button type="button" className={chip(false)} disabled={!hasSelection} onClick={onDelete} title="Delete the selected shape (Delete)">
            Delete
          </button>
        </div>
        <span className="text-xs text-ink-faint" data-testid="markup-sync" data-pending={pendingCount} aria-live="polite">
          {pendingCount === 0 ? "Markup saved" : `Saving ${pendingCount} change${pendingCount === 1 ? "" : "s"}…`}
        </span>
      </div>
    </div>
  );
}
