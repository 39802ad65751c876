// Ring: an ellipse around something (the knees, the bar); picked on its outline or inside it.
import { distanceToEllipsePx, translatePoint } from "../geometry";
import type { ShapeKind } from "./types";

export const ring: ShapeKind<"ring"> = {
  kind: "ring",
  hitTest(g, p, tolerancePx) {
    const inside = ((p.x - g.center.x) / g.radiusXPx) ** 2 + ((p.y - g.center.y) / g.radiusYPx) ** 2 <= 1;
    return inside || distanceToEllipsePx(p, g.center, g.radiusXPx, g.radiusYPx) <= tolerancePx;
  },
  translate: (g, dx, dy) => ({ ...g, center: translatePoint(g.center, dx, dy) }),
  measure: () => null,
  anchor: (g) => ({ x: g.center.x, y: g.center.y - g.radiusYPx }),
};
