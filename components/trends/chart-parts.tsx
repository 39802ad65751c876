"use client";
// Shared pieces of the trends charts: a labelled figure with a fixed, phone-friendly height, axis label
// styles and the date tick format.
import type { ReactNode } from "react";
import { formatDay } from "@/components/ui/date-text";

export const AXIS = { stroke: "var(--pl-ink-faint)", tick: { fontSize: 11 } } as const;
export const TOOLTIP_STYLE = { background: "var(--pl-surface)", borderColor: "var(--pl-line)", fontSize: 12 } as const;
export const GRID = { stroke: "var(--pl-line)", strokeDasharray: "2 4" } as const;

export function xLabel(value: string) {
  return { value, position: "insideBottom" as const, offset: -14, fontSize: 11, fill: "var(--pl-ink-muted)" };
}

export function yLabel(value: string) {
  return { value, angle: -90, position: "insideLeft" as const, fontSize: 11, fill: "var(--pl-ink-muted)", style: { textAnchor: "middle" as const } };
}

export const dayTick = (ms: number) => formatDay(new Date(ms));

export function ChartFigure({ id, title, note, children }: { id: string; title: ReactNode; note?: ReactNode; children: ReactNode }) {
  return (
    <figure data-testid={id} className="grid gap-1">
      <figcaption className="text-sm font-medium text-ink">{title}</figcaption>
      <div className="h-64 w-full">{children}</div>
      {note ? <p className="text-xs text-ink-muted">{note}</p> : null}
    </figure>
  );
}
