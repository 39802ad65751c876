// Per-sample body measures from the smoothed joints: side-view joint and segment angles, squat
// depth margin and mid-foot; front-view knee projection angles, stance and left–right balance.
// NaN marks samples where a needed joint was not seen.
import { angleToVerticalDeg, frontalPlaneProjectionAngleDeg, interiorAngleDeg, tiltDeg, type Point } from "./angles";
import type { JointName } from "./joints";
import type { Kinematics } from "./kinematics";
import { sideJoint, type Signal } from "./orientation";

export interface SideAngles {
  kneeDeg: number[];
  hipDeg: number[];
  ankleDeg: number[];
  torsoDeg: number[];
  shinDeg: number[];
  /** Knee joint centre height minus hip joint centre height, metres (positive: hip below the knee). */
  depthMarginM: number[];
  /** Horizontal mid-foot position (metres, same axis as the bar) and how it was found. */
  midFootX: number[];
  midFootFromHeelToe: boolean[];
}

/**
 * Mid-foot sits about a quarter foot length in front of the ankle; with the foot about 0.152 and
 * the shank about 0.246 of stature (Winter, Biomechanics and Motor Control of Human Movement,
 * segment lengths; from memory) that is 0.155 shank lengths.
 */
export const MID_FOOT_AHEAD_OF_ANKLE_PER_SHANK = 0.155;

type PointAt = (i: number) => Point | null;

function pointAt(signal: Signal | undefined): PointAt {
  return (i) => (signal && signal.valid[i] ? { x: signal.x[i], y: signal.y[i] } : null);
}

function track(n: number, f: (i: number) => number | null): number[] {
  const out = new Array<number>(n);
  for (let i = 0; i < n; i++) out[i] = f(i) ?? NaN;
  return out;
}

function both<T>(a: Point | null, b: Point | null, f: (a: Point, b: Point) => T): T | null {
  return a && b ? f(a, b) : null;
}

function all3(a: Point | null, b: Point | null, c: Point | null, f: (a: Point, b: Point, c: Point) => number | null): number | null {
  return a && b && c ? f(a, b, c) : null;
}

export function sideAngles(kin: Kinematics): SideAngles | null {
  if (!kin.side) return null;
  const j = (name: string) => pointAt(sideJoint(kin.joints, kin.side!, name));
  const [shoulder, hip, knee, ankle, heel, toe] = ["shoulder", "hip", "knee", "ankle", "heel", "foot_index"].map(j);
  const n = kin.times.length;
  const heelToe = (i: number) => both(heel(i), toe(i), (h, t) => (h.x + t.x) / 2);
  const fromAnkle = (i: number) =>
    both(ankle(i), knee(i), (a, k) => a.x + MID_FOOT_AHEAD_OF_ANKLE_PER_SHANK * Math.hypot(k.x - a.x, k.y - a.y));
  return {
    kneeDeg: track(n, (i) => all3(hip(i), knee(i), ankle(i), interiorAngleDeg)),
    hipDeg: track(n, (i) => all3(shoulder(i), hip(i), knee(i), interiorAngleDeg)),
    ankleDeg: track(n, (i) => all3(knee(i), ankle(i), toe(i), interiorAngleDeg)),
    torsoDeg: track(n, (i) => both(hip(i), shoulder(i), angleToVerticalDeg)),
    shinDeg: track(n, (i) => both(ankle(i), knee(i), angleToVerticalDeg)),
    depthMarginM: track(n, (i) => both(knee(i), hip(i), (k, h) => k.y - h.y)),
    midFootX: track(n, (i) => heelToe(i) ?? fromAnkle(i)),
    midFootFromHeelToe: Array.from({ length: n }, (_, i) => heelToe(i) !== null),
  };
}

export interface FrontMeasures {
  kneeProjectionLeftDeg: number[];
  kneeProjectionRightDeg: number[];
  stanceToShoulderWidth: number[];
  /** Mid-hip minus mid-ankle, horizontally (metres, + image right). */
  hipShiftM: number[];
  shoulderTiltDeg: number[];
  /** Left wrist height minus right wrist height (metres). */
  wristHeightDiffM: number[];
}

/**
 * The projection angle is only read while the thigh is seen at length: deep in a squat the thigh
 * points at the camera, its image shrinks and the angle stops meaning anything (common practice).
 */
export const MIN_THIGH_TO_SHANK_IMAGE_RATIO = 0.6;

function projectionAngle(hip: Point, knee: Point, ankle: Point, midHipX: number): number | null {
  const thigh = Math.hypot(hip.x - knee.x, hip.y - knee.y);
  const shank = Math.hypot(ankle.x - knee.x, ankle.y - knee.y);
  if (thigh < MIN_THIGH_TO_SHANK_IMAGE_RATIO * shank || midHipX === hip.x) return null;
  return frontalPlaneProjectionAngleDeg(hip, knee, ankle, midHipX > hip.x ? 1 : -1);
}

export function frontMeasures(kin: Kinematics): FrontMeasures {
  const j = (name: JointName) => pointAt(kin.joints[name]);
  const L = { shoulder: j("left_shoulder"), hip: j("left_hip"), knee: j("left_knee"), ankle: j("left_ankle"), wrist: j("left_wrist") };
  const R = { shoulder: j("right_shoulder"), hip: j("right_hip"), knee: j("right_knee"), ankle: j("right_ankle"), wrist: j("right_wrist") };
  const n = kin.times.length;
  const midHipX = (i: number) => both(L.hip(i), R.hip(i), (a, b) => (a.x + b.x) / 2);
  const fppa = (s: typeof L) => (i: number) => {
    const mid = midHipX(i);
    return mid === null ? null : all3(s.hip(i), s.knee(i), s.ankle(i), (h, k, a) => projectionAngle(h, k, a, mid));
  };
  return {
    kneeProjectionLeftDeg: track(n, fppa(L)),
    kneeProjectionRightDeg: track(n, fppa(R)),
    stanceToShoulderWidth: track(n, (i) => {
      const stance = both(L.ankle(i), R.ankle(i), (a, b) => Math.abs(a.x - b.x));
      const shoulders = both(L.shoulder(i), R.shoulder(i), (a, b) => Math.abs(a.x - b.x));
      return stance !== null && shoulders ? stance / shoulders : null;
    }),
    hipShiftM: track(n, (i) => {
      const hips = midHipX(i);
      const ankles = both(L.ankle(i), R.ankle(i), (a, b) => (a.x + b.x) / 2);
      return hips !== null && ankles !== null ? hips - ankles : null;
    }),
    shoulderTiltDeg: track(n, (i) => both(L.shoulder(i), R.shoulder(i), tiltDeg)),
    wristHeightDiffM: track(n, (i) => both(L.wrist(i), R.wrist(i), (a, b) => a.y - b.y)),
  };
}
