// Tools drawn by one drag from a first point to a second: ruler, arrow and the protractor's
// angle-to-vertical mode (from the vertex along the segment).
import { distancePx, type Point } from "../geometry";
import type { MarkupGeometry } from "@/lib/validation/markup";
import { MIN_SHAPE_PX, type ToolDefinition } from "./types";

interface Segment {
  a: Point;
  b: Point;
}

function twoPointTool(kind: "ruler" | "arrow" | "protractor", build: (s: Segment) => MarkupGeometry): ToolDefinition<Segment> {
  return {
    kind,
    begin: (p) => ({ a: p, b: p }),
    drag: (draft, p) => ({ ...draft, b: p }),
    release: (draft) => (distancePx(draft.a, draft.b) >= MIN_SHAPE_PX ? { type: "commit", geometry: build(draft) } : { type: "cancel" }),
    tap: () => ({ type: "cancel" }),
    hover: (draft) => draft,
    place: () => ({ type: "cancel" }),
    preview: (draft) => build(draft),
  };
}

export const rulerTool = twoPointTool("ruler", ({ a, b }) => ({ kind: "ruler", a, b }));
export const arrowTool = twoPointTool("arrow", ({ a, b }) => ({ kind: "arrow", from: a, to: b }));
export const verticalProtractorTool = twoPointTool("protractor", ({ a, b }) => ({ kind: "protractor", mode: "vertical", vertex: a, a: b }));
