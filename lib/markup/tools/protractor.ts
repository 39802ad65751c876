// Three-point protractor: drag from the first point to the vertex, release, then click the third point.
// Until that click the second ray follows the pointer, so the angle reads live while aiming.
import { distancePx, type Point } from "../geometry";
import type { MarkupGeometry } from "@/lib/validation/markup";
import { MIN_SHAPE_PX, type ToolDefinition } from "./types";

interface ProtractorDraft {
  a: Point;
  vertex: Point;
  /** Null until the first ray is drawn. */
  b: Point | null;
}

function geometry({ a, vertex, b }: ProtractorDraft): MarkupGeometry {
  return b ? { kind: "protractor", mode: "three-point", a, vertex, b } : { kind: "protractor", mode: "vertical", vertex, a };
}

export const protractorTool: ToolDefinition<ProtractorDraft> = {
  kind: "protractor",
  begin: (p) => ({ a: p, vertex: p, b: null }),
  drag: (draft, p) => ({ ...draft, vertex: p }),
  release: (draft) => (distancePx(draft.a, draft.vertex) >= MIN_SHAPE_PX ? { type: "place", draft: { ...draft, b: draft.vertex } } : { type: "cancel" }),
  tap: () => ({ type: "cancel" }),
  hover: (draft, p) => ({ ...draft, b: p }),
  place(draft, p) {
    if (distancePx(draft.vertex, p) < MIN_SHAPE_PX) return { type: "cancel" };
    return { type: "commit", geometry: geometry({ ...draft, b: p }) };
  },
  preview: (draft) => (distancePx(draft.a, draft.vertex) > 0 ? geometry(draft) : null),
};
