// Finds the plate's outer rim around a tap, for calibration (a full-size plate is 450 mm across):
// edges along rays from the tap, circles through edge triples voted by the other rays, then the
// largest well-supported circle concentric with the strongest one, refined by least squares.
import { z } from "zod";
import { fitCircle, circleThroughPoints, type Circle, type Point } from "./circle-fit";
import { assertRgbaFrame, FrameInputError, sampleLuma, type RgbaFrame } from "./frame";

export interface PlateCircle {
  cx: number;
  cy: number;
  radiusPx: number;
  /** Share of rays (0..1) that found an edge on the circle. */
  score: number;
}

export interface PlateCircleOptions {
  minRadiusPx?: number;
  maxRadiusPx?: number;
}

/** Tuning (`common practice` for ray-cast circle detection, tuned on the synthetic clips). */
const RAYS = 96;
const STEP_PX = 0.5;
const SMOOTHING_SIGMA_PX = 0.6;
/** Edges per ray that seed circle hypotheses, and that may vote for one. */
const SEED_EDGES_PER_RAY = 5;
const VOTING_EDGES_PER_RAY = 16;
const MIN_EDGE_GREY_PER_PX = 3;
const MIN_SUPPORT = 0.5;

const optionsSchema = z.object({
  tapX: z.number().finite(),
  tapY: z.number().finite(),
  minRadiusPx: z.number().finite().positive().optional(),
  maxRadiusPx: z.number().finite().positive().optional(),
});

interface Ray {
  cos: number;
  sin: number;
  /** Distance along the ray that was sampled. */
  lengthPx: number;
  /** Edge distances from the tap, strongest first. */
  edges: number[];
}

interface Candidate extends Circle {
  support: number;
}

export function suggestPlateCircle(
  frame: RgbaFrame,
  tapX: number,
  tapY: number,
  options: PlateCircleOptions = {},
): PlateCircle | null {
  assertRgbaFrame(frame);
  const parsed = optionsSchema.safeParse({ tapX, tapY, ...options });
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    throw new FrameInputError(`${issue.path.join(".")}: ${issue.message}`);
  }
  if (tapX < 0 || tapY < 0 || tapX > frame.width - 1 || tapY > frame.height - 1) {
    throw new FrameInputError(`tapX/tapY: (${tapX}, ${tapY}) lies outside the ${frame.width}x${frame.height} frame`);
  }
  const shortSide = Math.min(frame.width, frame.height);
  const minRadiusPx = parsed.data.minRadiusPx ?? 4;
  const maxRadiusPx = parsed.data.maxRadiusPx ?? 0.45 * shortSide;
  const tap = { x: tapX, y: tapY };
  const rays = castRays(frame, tap, maxRadiusPx);
  const candidates = voteCircles(rays, tap, minRadiusPx, maxRadiusPx);
  const chosen = choosePlate(candidates);
  if (!chosen) return null;
  return refinePlate(rays, tap, chosen);
}

function castRays(frame: RgbaFrame, tap: Point, maxRadiusPx: number): Ray[] {
  const rays: Ray[] = [];
  for (let k = 0; k < RAYS; k++) {
    const angle = (2 * Math.PI * k) / RAYS;
    const cos = Math.cos(angle);
    const sin = Math.sin(angle);
    const profile: number[] = [];
    for (let s = 0; s <= maxRadiusPx; s += STEP_PX) {
      const x = tap.x + s * cos;
      const y = tap.y + s * sin;
      if (x < 0 || y < 0 || x > frame.width - 1 || y > frame.height - 1) break;
      profile.push(sampleLuma(frame, x, y));
    }
    rays.push({ cos, sin, lengthPx: (profile.length - 1) * STEP_PX, edges: findEdges(smooth(profile)) });
  }
  return rays;
}

function smooth(profile: number[]): number[] {
  const sigma = SMOOTHING_SIGMA_PX / STEP_PX;
  const reach = Math.ceil(3 * sigma);
  const kernel = Array.from({ length: 2 * reach + 1 }, (_, i) => Math.exp(-((i - reach) ** 2) / (2 * sigma * sigma)));
  return profile.map((_, i) => {
    let sum = 0;
    let weight = 0;
    for (let k = -reach; k <= reach; k++) {
      const j = i + k;
      if (j < 0 || j >= profile.length) continue;
      sum += kernel[k + reach] * profile[j];
      weight += kernel[k + reach];
    }
    return sum / weight;
  });
}

/** Local maxima of the gradient magnitude, sub-sample by a parabola, strongest first. */
function findEdges(profile: number[]): number[] {
  const gradient = profile.map((_, i) =>
    i === 0 || i === profile.length - 1 ? 0 : Math.abs(profile[i + 1] - profile[i - 1]) / (2 * STEP_PX),
  );
  const peak = Math.max(0, ...gradient);
  const threshold = Math.max(MIN_EDGE_GREY_PER_PX, 0.15 * peak);
  const edges: { s: number; strength: number }[] = [];
  for (let i = 2; i < gradient.length - 2; i++) {
    const g = gradient[i];
    if (g < threshold || g < gradient[i - 1] || g <= gradient[i + 1]) continue;
    const curvature = gradient[i - 1] - 2 * g + gradient[i + 1];
    const offset = curvature < 0 ? (gradient[i - 1] - gradient[i + 1]) / (2 * curvature) : 0;
    edges.push({ s: (i + offset) * STEP_PX, strength: g });
  }
  return edges
    .sort((a, b) => b.strength - a.strength)
    .slice(0, VOTING_EDGES_PER_RAY)
    .map((e) => e.s);
}

/** Distance from the tap along a ray to where it leaves the circle (tap inside the circle). */
function exitDistance(ray: Ray, tap: Point, circle: Circle): number {
  const ox = tap.x - circle.cx;
  const oy = tap.y - circle.cy;
  const b = ox * ray.cos + oy * ray.sin;
  const c = ox * ox + oy * oy - circle.radius * circle.radius;
  return -b + Math.sqrt(b * b - c);
}

function tolerancePx(radius: number): number {
  return Math.max(1, 0.015 * radius);
}

/** Share of the rays long enough to reach the circle that have an edge on it; 0 with too few rays. */
function support(rays: Ray[], tap: Point, circle: Circle, tolerance: number): number {
  let valid = 0;
  let hits = 0;
  for (const ray of rays) {
    const s = exitDistance(ray, tap, circle);
    if (s > ray.lengthPx) continue;
    valid++;
    if (ray.edges.some((e) => Math.abs(e - s) <= tolerance)) hits++;
    // More misses than half the rays can never reach the minimum support: stop early.
    else if (valid - hits > RAYS * (1 - MIN_SUPPORT)) return 0;
  }
  return valid >= RAYS / 2 ? hits / valid : 0;
}

function edgePoint(ray: Ray, tap: Point, s: number): Point {
  return { x: tap.x + s * ray.cos, y: tap.y + s * ray.sin };
}

/** Circles through edges on ray triples spread round the tap, kept when enough rays agree. */
function voteCircles(rays: Ray[], tap: Point, minRadiusPx: number, maxRadiusPx: number): Candidate[] {
  const candidates: Candidate[] = [];
  const third = RAYS / 3;
  for (const spread of [0, 3]) {
    for (let i = 0; i < third; i++) {
      const triple = [rays[i], rays[(i + third + spread) % RAYS], rays[(i + 2 * third - spread) % RAYS]];
      const [seedsA, seedsB, seedsC] = triple.map((ray) => ray.edges.slice(0, SEED_EDGES_PER_RAY));
      for (const sa of seedsA) {
        for (const sb of seedsB) {
          for (const sc of seedsC) {
            const circle = circleThroughPoints(
              edgePoint(triple[0], tap, sa),
              edgePoint(triple[1], tap, sb),
              edgePoint(triple[2], tap, sc),
            );
            if (!circle || circle.radius < minRadiusPx || circle.radius > maxRadiusPx) continue;
            // The user taps on the plate, well inside its rim.
            if (Math.hypot(tap.x - circle.cx, tap.y - circle.cy) > 0.8 * circle.radius) continue;
            const share = support(rays, tap, circle, tolerancePx(circle.radius));
            if (share >= MIN_SUPPORT) candidates.push({ ...circle, support: share });
          }
        }
      }
    }
  }
  return candidates;
}

/** The plate is the largest well-supported circle concentric with the best-supported one
 * (the sleeve end, hub and inner rim edges share the plate's centre). */
function choosePlate(candidates: Candidate[]): Candidate | null {
  if (candidates.length === 0) return null;
  const anchor = candidates.reduce((best, c) => (c.support > best.support ? c : best));
  const concentric = candidates.filter(
    (c) => Math.hypot(c.cx - anchor.cx, c.cy - anchor.cy) <= Math.max(2, 0.08 * c.radius) && c.support >= 0.6 * anchor.support,
  );
  return concentric.reduce((best, c) => (c.radius > best.radius ? c : best), anchor);
}

/** Least-squares fit on the edges near the chosen circle, repeated as the inliers settle. */
function refinePlate(rays: Ray[], tap: Point, start: Candidate): PlateCircle | null {
  let circle: Circle = start;
  for (let round = 0; round < 3; round++) {
    const tolerance = tolerancePx(circle.radius);
    const inliers: Point[] = [];
    for (const ray of rays) {
      const s = exitDistance(ray, tap, circle);
      if (s > ray.lengthPx) continue;
      const nearest = ray.edges.reduce((best, e) => (Math.abs(e - s) < Math.abs(best - s) ? e : best), Infinity);
      if (Math.abs(nearest - s) <= tolerance) inliers.push(edgePoint(ray, tap, nearest));
    }
    const fitted = fitCircle(inliers);
    if (!fitted) break;
    circle = fitted;
  }
  const score = support(rays, tap, circle, tolerancePx(circle.radius));
  if (score < MIN_SUPPORT) return null;
  return { cx: circle.cx, cy: circle.cy, radiusPx: circle.radius, score };
}
