// A drawing tool is a small state machine driven by pointer events in video pixels:
// idle -> pointing (pressed, not yet moved) -> dragging -> back to idle with a finished geometry,
// or -> placing (a further click is needed, as for the protractor's third point).
import type { MarkupGeometry, MarkupKind } from "@/lib/validation/markup";
import type { Point } from "../geometry";

export type ToolState<D> =
  | { name: "idle" }
  | { name: "pointing"; origin: Point; draft: D }
  | { name: "dragging"; origin: Point; draft: D }
  | { name: "placing"; draft: D };

/** What a tool does when a gesture ends: finish a shape, wait for another click, or drop it. */
export type ToolStep<D> = { type: "commit"; geometry: MarkupGeometry } | { type: "place"; draft: D } | { type: "cancel" };

export interface ToolDefinition<D> {
  kind: MarkupKind;
  /** Pointer pressed while idle. */
  begin(p: Point): D;
  /** Pointer moved while pressed (dragging). */
  drag(draft: D, p: Point): D;
  /** Pointer released after a drag. */
  release(draft: D, p: Point): ToolStep<D>;
  /** Pointer released without moving (a tap or click). */
  tap(draft: D, p: Point): ToolStep<D>;
  /** Pointer moved while waiting for a further click. */
  hover(draft: D, p: Point): D;
  /** Pointer pressed while waiting for a further click. */
  place(draft: D, p: Point): ToolStep<D>;
  /** What to draw for the shape in progress. */
  preview(draft: D): MarkupGeometry | null;
}

/** A gesture shorter than this (in screen pixels, scaled to video pixels by the caller) is a tap. */
export const DRAG_THRESHOLD_SCREEN_PX = 4;
/** Shapes smaller than this (video pixels) are slips of the hand, not drawings (common practice). */
export const MIN_SHAPE_PX = 3;
