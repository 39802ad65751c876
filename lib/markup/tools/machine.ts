// The shared state machine every drawing tool runs under: pure transitions, so tests drive it with
// plain points and the canvas component only forwards pointer events and draws the preview.
import { distancePx, type Point } from "../geometry";
import type { MarkupGeometry } from "@/lib/validation/markup";
import type { ToolDefinition, ToolState, ToolStep } from "./types";

export interface Transition<D> {
  state: ToolState<D>;
  /** Set when the gesture finished a shape. */
  commit?: MarkupGeometry;
}

export const IDLE = { name: "idle" } as const;

function finish<D>(step: ToolStep<D>): Transition<D> {
  if (step.type === "commit") return { state: IDLE, commit: step.geometry };
  if (step.type === "place") return { state: { name: "placing", draft: step.draft } };
  return { state: IDLE };
}

export function pointerDown<D>(tool: ToolDefinition<D>, state: ToolState<D>, p: Point): Transition<D> {
  if (state.name === "placing") return finish(tool.place(state.draft, p));
  return { state: { name: "pointing", origin: p, draft: tool.begin(p) } };
}

/** `dragThresholdPx` is in video pixels: the caller scales the screen threshold by the zoom. */
export function pointerMove<D>(tool: ToolDefinition<D>, state: ToolState<D>, p: Point, dragThresholdPx: number): Transition<D> {
  switch (state.name) {
    case "idle":
      return { state };
    case "placing":
      return { state: { name: "placing", draft: tool.hover(state.draft, p) } };
    case "pointing":
      if (distancePx(state.origin, p) < dragThresholdPx) return { state };
      return { state: { name: "dragging", origin: state.origin, draft: tool.drag(state.draft, p) } };
    case "dragging":
      return { state: { ...state, draft: tool.drag(state.draft, p) } };
  }
}

export function pointerUp<D>(tool: ToolDefinition<D>, state: ToolState<D>, p: Point): Transition<D> {
  switch (state.name) {
    case "pointing":
      return finish(tool.tap(state.draft, p));
    case "dragging":
      return finish(tool.release(tool.drag(state.draft, p), p));
    default:
      return { state };
  }
}

/** Escape or a tool change drops whatever was in progress. */
export function cancel<D>(): Transition<D> {
  return { state: IDLE };
}

export function previewOf<D>(tool: ToolDefinition<D>, state: ToolState<D>): MarkupGeometry | null {
  return state.name === "idle" ? null : tool.preview(state.draft);
}
