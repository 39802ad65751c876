// Ruler: a straight line between two points; its length in centimetres with the analysis's calibration.
import { distancePx, distanceToSegmentPx, lengthCm, translatePoint } from "../geometry";
import type { ShapeKind } from "./types";

export const ruler: ShapeKind<"ruler"> = {
  kind: "ruler",
  hitTest: (g, p, tolerancePx) => distanceToSegmentPx(p, g.a, g.b) <= tolerancePx,
  translate: (g, dx, dy) => ({ ...g, a: translatePoint(g.a, dx, dy), b: translatePoint(g.b, dx, dy) }),
  measure(g, { metresPerPixel }) {
    const px = distancePx(g.a, g.b);
    if (metresPerPixel === null) return { value: px, unit: "px", label: `${px.toFixed(0)} px` };
    const cm = lengthCm(px, metresPerPixel);
    return { value: cm, unit: "cm", label: `${cm.toFixed(1)} cm` };
  },
  anchor: (g) => ({ x: (g.a.x + g.b.x) / 2, y: (g.a.y + g.b.y) / 2 }),
};
