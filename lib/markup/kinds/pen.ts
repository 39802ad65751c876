// Pen: a free stroke, kept as the points the pointer passed through.
import { distanceToPolylinePx, translatePoint } from "../geometry";
import type { ShapeKind } from "./types";

export const pen: ShapeKind<"pen"> = {
  kind: "pen",
  hitTest: (g, p, tolerancePx) => distanceToPolylinePx(p, g.points) <= tolerancePx,
  translate: (g, dx, dy) => ({ ...g, points: g.points.map((q) => translatePoint(q, dx, dy)) }),
  measure: () => null,
  anchor: (g) => g.points[0],
};
