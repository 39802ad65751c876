// Plane geometry for markup in video pixel coordinates (x right, y down): distances, angles and hit tests.
import type { MarkupPoint } from "@/lib/validation/markup";

export type Point = MarkupPoint;

const DEG_PER_RAD = 180 / Math.PI;

export function distancePx(a: Point, b: Point): number {
  return Math.hypot(b.x - a.x, b.y - a.y);
}

/** Shortest distance from p to the segment a–b. */
export function distanceToSegmentPx(p: Point, a: Point, b: Point): number {
  const dx = b.x - a.x;
  const dy = b.y - a.y;
  const lengthSq = dx * dx + dy * dy;
  if (lengthSq === 0) return distancePx(p, a);
  const t = Math.max(0, Math.min(1, ((p.x - a.x) * dx + (p.y - a.y) * dy) / lengthSq));
  return Math.hypot(p.x - (a.x + t * dx), p.y - (a.y + t * dy));
}

/** Shortest distance from p to a polyline (a pen stroke). */
export function distanceToPolylinePx(p: Point, points: readonly Point[]): number {
  if (points.length === 1) return distancePx(p, points[0]);
  let best = Infinity;
  for (let i = 1; i < points.length; i++) best = Math.min(best, distanceToSegmentPx(p, points[i - 1], points[i]));
  return best;
}

/** Interior angle at `vertex` between the rays to a and b, 0°..180°; null when a ray has no length. */
export function threePointAngleDeg(a: Point, vertex: Point, b: Point): number | null {
  const ux = a.x - vertex.x;
  const uy = a.y - vertex.y;
  const vx = b.x - vertex.x;
  const vy = b.y - vertex.y;
  const lengths = Math.hypot(ux, uy) * Math.hypot(vx, vy);
  if (!(lengths > 0)) return null;
  return Math.acos(Math.max(-1, Math.min(1, (ux * vx + uy * vy) / lengths))) * DEG_PER_RAD;
}

/**
 * The acute angle between the line through `from` and `to` and the vertical (the plumb line), 0°..90°:
 * 0° for a vertical line, 90° for a level one. The direction of the line does not matter.
 */
export function angleToVerticalDeg(from: Point, to: Point): number | null {
  const dx = Math.abs(to.x - from.x);
  const dy = Math.abs(to.y - from.y);
  if (dx === 0 && dy === 0) return null;
  return Math.atan2(dx, dy) * DEG_PER_RAD;
}

/** A length in pixels as centimetres, with the analysis's calibration (metres per pixel). */
export function lengthCm(lengthPx: number, metresPerPixel: number): number {
  return lengthPx * metresPerPixel * 100;
}

/**
 * Distance from p to the outline of an axis-aligned ellipse, approximated by scaling the radial
 * offset with the smaller radius (exact for a circle); good enough to pick a ring under the pointer.
 */
export function distanceToEllipsePx(p: Point, center: Point, radiusXPx: number, radiusYPx: number): number {
  const nx = (p.x - center.x) / radiusXPx;
  const ny = (p.y - center.y) / radiusYPx;
  return Math.abs(Math.hypot(nx, ny) - 1) * Math.min(radiusXPx, radiusYPx);
}

export function translatePoint(p: Point, dx: number, dy: number): Point {
  return { x: p.x + dx, y: p.y + dy };
}
