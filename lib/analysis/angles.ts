// Planar joint and segment angles. Points are in a y-up frame (metres after calibration);
// interior angles do not depend on the axes' direction, segment-to-vertical angles do.

export interface Point {
  x: number;
  y: number;
}

const DEG_PER_RAD = 180 / Math.PI;

/** Interior angle at `vertex` between the rays to `a` and `c`: 180° straight, 0° folded; null if a ray has no length. */
export function interiorAngleDeg(a: Point, vertex: Point, c: Point): number | null {
  const ux = a.x - vertex.x;
  const uy = a.y - vertex.y;
  const vx = c.x - vertex.x;
  const vy = c.y - vertex.y;
  const lengths = Math.hypot(ux, uy) * Math.hypot(vx, vy);
  if (!(lengths > 0)) return null;
  const cos = (ux * vx + uy * vy) / lengths;
  return Math.acos(Math.max(-1, Math.min(1, cos))) * DEG_PER_RAD;
}

/** Angle of the segment from → to against straight up (y up): 0° pointing up, 90° level, 180° pointing down. */
export function angleToVerticalDeg(from: Point, to: Point): number | null {
  const dx = to.x - from.x;
  const dy = to.y - from.y;
  if (dx === 0 && dy === 0) return null;
  return Math.atan2(Math.abs(dx), dy) * DEG_PER_RAD;
}

/**
 * Frontal-plane projection angle of the knee (Munro, Herrington & Carolan 2012, J Sport Rehabil
 * 21:7-11): the deviation from a straight line of the hip–knee and knee–ankle segments seen from
 * the front, positive when the knee lies toward the midline of the hip–ankle line (valgus),
 * negative when it lies outside (varus). `medialSign` is +1 when the body's midline is toward +x.
 */
export function frontalPlaneProjectionAngleDeg(hip: Point, knee: Point, ankle: Point, medialSign: 1 | -1): number | null {
  const interior = interiorAngleDeg(hip, knee, ankle);
  if (interior === null || hip.y === ankle.y) return null;
  const lineX = hip.x + ((ankle.x - hip.x) * (knee.y - hip.y)) / (ankle.y - hip.y);
  const towardMidline = (knee.x - lineX) * medialSign > 0;
  return towardMidline ? 180 - interior : interior - 180;
}

/** Tilt of the line from `right` to `left` against level, positive when `left` is higher. */
export function tiltDeg(left: Point, right: Point): number | null {
  const dx = Math.abs(left.x - right.x);
  const dy = left.y - right.y;
  if (dx === 0 && dy === 0) return null;
  return Math.atan2(dy, dx) * DEG_PER_RAD;
}
