// Arrow: points at something, from the tail to the head.
import { distanceToSegmentPx, translatePoint } from "../geometry";
import type { ShapeKind } from "./types";

export const arrow: ShapeKind<"arrow"> = {
  kind: "arrow",
  hitTest: (g, p, tolerancePx) => distanceToSegmentPx(p, g.from, g.to) <= tolerancePx,
  translate: (g, dx, dy) => ({ ...g, from: translatePoint(g.from, dx, dy), to: translatePoint(g.to, dx, dy) }),
  measure: () => null,
  anchor: (g) => g.to,
};
