// Protractor: the angle at a vertex between two rays (three points), or the angle of one line against
// the vertical (two points) — the plumb line's question, "how far off vertical is this segment?".
import { angleToVerticalDeg, distanceToSegmentPx, threePointAngleDeg, translatePoint } from "../geometry";
import type { GeometryOf } from "@/lib/validation/markup";
import type { ShapeKind } from "./types";

export function protractorAngleDeg(g: GeometryOf<"protractor">): number | null {
  return g.mode === "three-point" ? threePointAngleDeg(g.a, g.vertex, g.b) : angleToVerticalDeg(g.vertex, g.a);
}

export const protractor: ShapeKind<"protractor"> = {
  kind: "protractor",
  hitTest(g, p, tolerancePx) {
    const legA = distanceToSegmentPx(p, g.vertex, g.a);
    const legB = g.mode === "three-point" ? distanceToSegmentPx(p, g.vertex, g.b) : Infinity;
    return Math.min(legA, legB) <= tolerancePx;
  },
  translate(g, dx, dy) {
    const vertex = translatePoint(g.vertex, dx, dy);
    const a = translatePoint(g.a, dx, dy);
    return g.mode === "three-point" ? { ...g, vertex, a, b: translatePoint(g.b, dx, dy) } : { ...g, vertex, a };
  },
  measure(g) {
    const angle = protractorAngleDeg(g);
    if (angle === null) return null;
    const label = g.mode === "three-point" ? `${angle.toFixed(1)}°` : `${angle.toFixed(1)}° to vertical`;
    return { value: angle, unit: "°", label };
  },
  anchor: (g) => g.vertex,
};
