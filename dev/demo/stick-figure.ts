// Draws the demo's side-view lifter into plain RGBA frames: a textured gym wall and floor, a stick
// figure from the synthetic keypoints (the far side dimmer) and the barbell's plate. No canvas
// package: anti-aliased capsules and discs over a byte buffer are all a stick figure needs.
import type { JointName } from "@/lib/analysis/joints";
import { Prng } from "@/lib/synthetic/prng";

export type Rgb = readonly [number, number, number];

export interface Frame {
  width: number;
  height: number;
  /** RGBA, row by row, alpha always 255. */
  data: Uint8Array;
}

export interface FigurePose {
  keypoints: Record<JointName, { x: number; y: number }>;
  bar: { x: number; y: number };
}

export function createFrame(width: number, height: number): Frame {
  const data = new Uint8Array(width * height * 4);
  for (let i = 3; i < data.length; i += 4) data[i] = 255;
  return { width, height, data };
}

/** Coverage (0..1) of a pixel at `distancePx` from a shape's centre line, for a shape of `radiusPx`. */
export function coverage(radiusPx: number, distancePx: number): number {
  const c = radiusPx - distancePx + 0.5;
  return c <= 0 ? 0 : c >= 1 ? 1 : c;
}

function blend(frame: Frame, x: number, y: number, colour: Rgb, alpha: number): void {
  if (alpha <= 0) return;
  const p = 4 * (y * frame.width + x);
  const d = frame.data;
  d[p] += (colour[0] - d[p]) * alpha;
  d[p + 1] += (colour[1] - d[p + 1]) * alpha;
  d[p + 2] += (colour[2] - d[p + 2]) * alpha;
}

/** Distance from (px, py) to the segment a–b. */
export function distanceToSegment(px: number, py: number, ax: number, ay: number, bx: number, by: number): number {
  const dx = bx - ax;
  const dy = by - ay;
  const lengthSq = dx * dx + dy * dy;
  const t = lengthSq === 0 ? 0 : Math.max(0, Math.min(1, ((px - ax) * dx + (py - ay) * dy) / lengthSq));
  return Math.hypot(px - (ax + t * dx), py - (ay + t * dy));
}

/** A line with round ends, `widthPx` thick, anti-aliased at its edge. */
export function drawCapsule(frame: Frame, a: { x: number; y: number }, b: { x: number; y: number }, widthPx: number, colour: Rgb, opacity = 1): void {
  const r = widthPx / 2;
  const x0 = Math.max(0, Math.floor(Math.min(a.x, b.x) - r - 1));
  const x1 = Math.min(frame.width - 1, Math.ceil(Math.max(a.x, b.x) + r + 1));
  const y0 = Math.max(0, Math.floor(Math.min(a.y, b.y) - r - 1));
  const y1 = Math.min(frame.height - 1, Math.ceil(Math.max(a.y, b.y) + r + 1));
  for (let y = y0; y <= y1; y++) {
    for (let x = x0; x <= x1; x++) {
      blend(frame, x, y, colour, opacity * coverage(r, distanceToSegment(x + 0.5, y + 0.5, a.x, a.y, b.x, b.y)));
    }
  }
}

/** A filled disc, anti-aliased at its edge. */
export function drawDisc(frame: Frame, c: { x: number; y: number }, radiusPx: number, colour: Rgb, opacity = 1): void {
  drawCapsule(frame, c, c, 2 * radiusPx, colour, opacity);
}

/** Smooth random field in [-1, 1]: random values on a grid, interpolated bilinearly. */
function valueNoise(width: number, height: number, cellPx: number, rng: Prng): Float32Array {
  const gw = Math.ceil(width / cellPx) + 2;
  const grid = Float32Array.from({ length: gw * (Math.ceil(height / cellPx) + 2) }, () => rng.uniform(-1, 1));
  const field = new Float32Array(width * height);
  for (let y = 0; y < height; y++) {
    const gy = y / cellPx;
    const y0 = Math.floor(gy);
    const fy = gy - y0;
    for (let x = 0; x < width; x++) {
      const gx = x / cellPx;
      const x0 = Math.floor(gx);
      const fx = gx - x0;
      const top = grid[y0 * gw + x0] * (1 - fx) + grid[y0 * gw + x0 + 1] * fx;
      const bottom = grid[(y0 + 1) * gw + x0] * (1 - fx) + grid[(y0 + 1) * gw + x0 + 1] * fx;
      field[y * width + x] = top * (1 - fy) + bottom * fy;
    }
  }
  return field;
}

/** A gym: mottled wall, two rack uprights with holes, a planked floor from `floorY` down. */
export function gymBackground(width: number, height: number, floorY: number, seed: number): Frame {
  const rng = new Prng(seed);
  const coarse = valueNoise(width, height, 0.13 * height, rng);
  const fine = valueNoise(width, height, Math.max(2, 0.02 * height), rng);
  const uprights = [0.12 * width, 0.88 * width];
  const halfWidth = 0.012 * width;
  const holePitch = 0.045 * height;
  const plankPx = Math.max(4, 0.03 * height);
  const frame = createFrame(width, height);
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      const p = y * width + x;
      const texture = 18 * coarse[p] + 8 * fine[p];
      const shade = 20 * (y / height);
      let colour: Rgb = [150 - shade + texture, 144 - shade + texture, 132 - shade + texture];
      const upright = uprights.find((u) => Math.abs(x - u) <= halfWidth);
      if (y > floorY) {
        const seam = (y - floorY) % plankPx < 1 ? -22 : 0;
        colour = [96 + texture + seam, 78 + texture + seam, 60 + texture + seam];
      } else if (upright !== undefined) {
        const hole = Math.hypot(x - upright, (y % holePitch) - holePitch / 2) < 0.35 * halfWidth;
        colour = hole ? [24, 24, 26] : [62 + texture / 4, 64 + texture / 4, 70 + texture / 4];
      }
      frame.data[4 * p] = Math.max(0, Math.min(255, colour[0]));
      frame.data[4 * p + 1] = Math.max(0, Math.min(255, colour[1]));
      frame.data[4 * p + 2] = Math.max(0, Math.min(255, colour[2]));
    }
  }
  return frame;
}

type Side = "left" | "right";
const LIMBS: [string, string][] = [
  ["shoulder", "elbow"],
  ["elbow", "wrist"],
  ["hip", "knee"],
  ["knee", "ankle"],
  ["heel", "foot_index"],
  ["ankle", "heel"],
  ["ankle", "foot_index"],
];

/** Bones drawn for one side, as pairs of keypoint names; the torso joins shoulder and hip. */
export function bonesFor(side: Side): [JointName, JointName][] {
  return [["shoulder", "hip"], ...LIMBS].map(([a, b]) => [`${side}_${a}`, `${side}_${b}`] as [JointName, JointName]);
}

const COLOURS = {
  far: [92, 98, 108],
  near: [236, 232, 222],
  head: [222, 206, 186],
  bar: [200, 200, 204],
  plate: [34, 36, 40],
  rim: [180, 182, 176],
  hub: [210, 210, 214],
  bench: [70, 44, 40],
} as const satisfies Record<string, Rgb>;

export interface FigureStyle {
  nearSide: Side;
  /** Body scale: pixels per metre, which sets line widths and the head. */
  pxPerM: number;
  plateRadiusPx: number;
  /** Bench press: draw the bench under the lifter. */
  bench: boolean;
}

/** Draws the lifter and the bar over the frame (which already holds the background). */
export function drawLifter(frame: Frame, pose: FigurePose, style: FigureStyle): void {
  const k = pose.keypoints;
  const far: Side = style.nearSide === "left" ? "right" : "left";
  const limbPx = Math.max(2, 0.045 * style.pxPerM);
  if (style.bench) {
    const shoulder = k[`${style.nearSide}_shoulder`];
    const hip = k[`${style.nearSide}_hip`];
    const topY = Math.max(shoulder.y, hip.y) + limbPx;
    const beyondHeadPx = 0.2 * style.pxPerM * Math.sign(shoulder.x - hip.x);
    drawCapsule(frame, { x: shoulder.x + beyondHeadPx, y: topY }, { x: hip.x, y: topY }, limbPx * 1.6, COLOURS.bench);
  }
  for (const [a, b] of bonesFor(far)) drawCapsule(frame, k[a], k[b], limbPx * 0.8, COLOURS.far);
  drawCapsule(frame, k[`${far}_shoulder`], k[`${style.nearSide}_shoulder`], limbPx, COLOURS.far);
  for (const [a, b] of bonesFor(style.nearSide)) drawCapsule(frame, k[a], k[b], limbPx, COLOURS.near);
  const ear = k[`${style.nearSide}_ear`];
  const headCentre = { x: (ear.x + k.nose.x) / 2, y: (ear.y + k.nose.y) / 2 };
  drawDisc(frame, headCentre, 0.1 * style.pxPerM, COLOURS.head);
  drawDisc(frame, pose.bar, style.plateRadiusPx, COLOURS.rim);
  drawDisc(frame, pose.bar, 0.86 * style.plateRadiusPx, COLOURS.plate);
  drawDisc(frame, pose.bar, 0.2 * style.plateRadiusPx, COLOURS.hub);
}
