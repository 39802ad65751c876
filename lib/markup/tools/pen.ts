// Pen: a free stroke. Points closer than a pixel to the last one add nothing but bytes, so they are skipped,
// and a stroke stops growing at the stored limit.
import { distancePx, type Point } from "../geometry";
import { MAX_PEN_POINTS } from "@/lib/validation/markup";
import type { ToolDefinition } from "./types";

/** Minimum spacing between stored points, in video pixels (common practice for free-hand capture). */
export const PEN_MIN_SPACING_PX = 1.5;

interface Stroke {
  points: Point[];
}

export const penTool: ToolDefinition<Stroke> = {
  kind: "pen",
  begin: (p) => ({ points: [p] }),
  drag(draft, p) {
    const last = draft.points[draft.points.length - 1];
    if (distancePx(last, p) < PEN_MIN_SPACING_PX || draft.points.length >= MAX_PEN_POINTS) return draft;
    return { points: [...draft.points, p] };
  },
  release: (draft) => (draft.points.length >= 2 ? { type: "commit", geometry: { kind: "pen", points: draft.points } } : { type: "cancel" }),
  tap: () => ({ type: "cancel" }),
  hover: (draft) => draft,
  place: () => ({ type: "cancel" }),
  preview: (draft) => (draft.points.length >= 2 ? { kind: "pen", points: draft.points } : null),
};
