// The select tool: press on a shape to select it, drag to move it; press on nothing to clear the selection.
// It runs the same idle -> pointing -> dragging states as the drawing tools.
import { hitTest, translateGeometry } from "../kinds";
import type { Point } from "../geometry";
import { distancePx } from "../geometry";
import type { Shape } from "../shape";
import type { MarkupGeometry } from "@/lib/validation/markup";

export type SelectState =
  | { name: "idle" }
  | { name: "pointing"; origin: Point; shapeId: string | null }
  | { name: "dragging"; origin: Point; shapeId: string; offset: Point };

export interface SelectTransition {
  state: SelectState;
  /** The selection after this event (undefined: unchanged). */
  select?: string | null;
  /** A finished move: the shape's new geometry. */
  move?: { shapeId: string; geometry: MarkupGeometry };
}

/** The topmost visible shape under p (shapes later in the list are drawn on top). */
export function shapeAt(shapes: readonly Shape[], p: Point, tolerancePx: number): Shape | null {
  for (let i = shapes.length - 1; i >= 0; i--) if (hitTest(shapes[i].geometry, p, tolerancePx)) return shapes[i];
  return null;
}

export function selectDown(visible: readonly Shape[], p: Point, tolerancePx: number): SelectTransition {
  const hit = shapeAt(visible, p, tolerancePx);
  return { state: { name: "pointing", origin: p, shapeId: hit?.id ?? null }, select: hit?.id ?? null };
}

export function selectMove(state: SelectState, p: Point, dragThresholdPx: number): SelectTransition {
  if (state.name === "pointing") {
    if (!state.shapeId || distancePx(state.origin, p) < dragThresholdPx) return { state };
    return { state: { name: "dragging", origin: state.origin, shapeId: state.shapeId, offset: { x: p.x - state.origin.x, y: p.y - state.origin.y } } };
  }
  if (state.name === "dragging") return { state: { ...state, offset: { x: p.x - state.origin.x, y: p.y - state.origin.y } } };
  return { state };
}

export function selectUp(state: SelectState, shapes: readonly Shape[], p: Point): SelectTransition {
  if (state.name !== "dragging") return { state: { name: "idle" } };
  const shape = shapes.find((s) => s.id === state.shapeId);
  if (!shape) return { state: { name: "idle" } };
  const geometry = translateGeometry(shape.geometry, p.x - state.origin.x, p.y - state.origin.y);
  return { state: { name: "idle" }, move: { shapeId: shape.id, geometry } };
}

/** The geometry to draw for a shape while it is being dragged. */
export function draggedGeometry(state: SelectState, shape: Shape): MarkupGeometry {
  if (state.name !== "dragging" || state.shapeId !== shape.id) return shape.geometry;
  return translateGeometry(shape.geometry, state.offset.x, state.offset.y);
}
