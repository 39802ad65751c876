// Ring: drag across the thing to circle; the ellipse fills the box from the press to the pointer.
import type { Point } from "../geometry";
import type { MarkupGeometry } from "@/lib/validation/markup";
import { MIN_SHAPE_PX, type ToolDefinition } from "./types";

interface Box {
  from: Point;
  to: Point;
}

function ellipse({ from, to }: Box): MarkupGeometry {
  return {
    kind: "ring",
    center: { x: (from.x + to.x) / 2, y: (from.y + to.y) / 2 },
    radiusXPx: Math.max(Math.abs(to.x - from.x) / 2, 0.5),
    radiusYPx: Math.max(Math.abs(to.y - from.y) / 2, 0.5),
  };
}

export const ringTool: ToolDefinition<Box> = {
  kind: "ring",
  begin: (p) => ({ from: p, to: p }),
  drag: (draft, p) => ({ ...draft, to: p }),
  release(draft) {
    const big = Math.abs(draft.to.x - draft.from.x) >= MIN_SHAPE_PX && Math.abs(draft.to.y - draft.from.y) >= MIN_SHAPE_PX;
    return big ? { type: "commit", geometry: ellipse(draft) } : { type: "cancel" };
  },
  tap: () => ({ type: "cancel" }),
  hover: (draft) => draft,
  place: () => ({ type: "cancel" }),
  preview: ellipse,
};
