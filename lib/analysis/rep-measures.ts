// Per-rep measures: bar speed and range (Sánchez-Medina et al. 2010 for the propulsive phase),
// bar path, and the body angles and positions the camera view allows. Unmeasurable fields are null.
import type { Kinematics } from "./kinematics";
import { sideJoint } from "./orientation";
import type { FrontMeasures, SideAngles } from "./posture";
import { turningPoints, type RepPhases } from "./reps";
import type { RepResult } from "./result";
import { indexRange, nearestIndex, valueAt, windowValues } from "./timeline";
import type { CameraView, Lift } from "./track";

export interface RepContext {
  kin: Kinematics;
  lift: Lift;
  view: CameraView;
  side: SideAngles | null;
  front: FrontMeasures | null;
}

export type RepMeasures = Omit<RepResult, "index" | "flags" | "series">;

/** Standard gravity: the propulsive phase ends where the bar decelerates faster than free fall (Sánchez-Medina et al. 2010, Int J Sports Med 31:123-129). */
export const GRAVITY_MPS2 = 9.81;
/** A sticking dip must fall and recover by at least this much (m/s, and share of the peak): above filtered noise (common practice). */
const STICKING_MIN_SWING_MPS = 0.05;
const STICKING_MIN_SWING_FRACTION = 0.1;
/** Hip-rise window: from the bottom until the bar has covered this share of the drive (common practice: "early in the drive"). */
const HIP_RISE_WINDOW_FRACTION = 1 / 3;
/** Shoulders must rise at least this much in the window for the ratio to mean anything. */
const HIP_RISE_MIN_SHOULDER_RISE_M = 0.01;

const orNull = (v: number): number | null => (Number.isFinite(v) ? v : null);
const cm = (m: number | null): number | null => (m === null ? null : 100 * m);

function maxFinite(values: number[]): number | null {
  let best: number | null = null;
  for (const v of values) if (Number.isFinite(v) && (best === null || v > best)) best = v;
  return best;
}

/** Samples (with interpolated ends) of a window, as [time, value] pairs. */
function windowSamples(times: readonly number[], values: readonly number[], startS: number, endS: number): [number, number][] {
  const [first, last] = indexRange(times, startS, endS);
  const out: [number, number][] = [[startS, valueAt(times, values, startS)]];
  for (let i = first; i <= last; i++) if (times[i] > startS && times[i] < endS) out.push([times[i], values[i]]);
  out.push([endS, valueAt(times, values, endS)]);
  return out;
}

function propulsive(kin: Kinematics, p: RepPhases): { endS: number; meanVelocityMps: number } {
  const { times, bar } = kin;
  const accel = windowSamples(times, bar.ay, p.concentricStartS, p.concentricEndS);
  let endS = p.concentricEndS;
  for (let k = 1; k < accel.length; k++) {
    const [t0, a0] = accel[k - 1];
    const [t1, a1] = accel[k];
    if (a1 < -GRAVITY_MPS2 && a0 >= -GRAVITY_MPS2) {
      endS = t0 + ((a0 + GRAVITY_MPS2) / (a0 - a1)) * (t1 - t0);
      break;
    }
  }
  const risenM = valueAt(times, bar.y, endS) - valueAt(times, bar.y, p.concentricStartS);
  return { endS, meanVelocityMps: endS > p.concentricStartS ? risenM / (endS - p.concentricStartS) : 0 };
}

/**
 * Lowest speed after the first velocity peak of the drive: the first dip between two peaks, each
 * side of it at least the minimum swing above it, so filtered noise does not make one.
 */
function stickingPoint(kin: Kinematics, p: RepPhases, peakMps: number): RepResult["stickingPoint"] {
  const v = windowSamples(kin.times, kin.bar.vy, p.concentricStartS, p.concentricEndS);
  const swing = Math.max(STICKING_MIN_SWING_MPS, STICKING_MIN_SWING_FRACTION * peakMps);
  const turns = turningPoints(v.map(([, value]) => value), swing);
  const k = turns.findIndex((e, i) => e.kind === "min" && i > 0 && i < turns.length - 1 && turns[i - 1].kind === "max");
  if (k < 0) return null;
  const [timeS, velocityMps] = v[turns[k].i];
  const heightM = valueAt(kin.times, kin.bar.y, timeS) - valueAt(kin.times, kin.bar.y, p.concentricStartS);
  return { timeS, heightM, velocityMps };
}

function barMeasures(ctx: RepContext, p: RepPhases) {
  const { times, bar } = ctx.kin;
  const at = (values: number[], t: number) => valueAt(times, values, t);
  const romM = at(bar.y, p.concentricEndS) - at(bar.y, p.concentricStartS);
  const concentricDurationS = p.concentricEndS - p.concentricStartS;
  const peakConcentricVelocityMps = Math.max(...windowValues(times, bar.vy, p.concentricStartS, p.concentricEndS));
  const prop = propulsive(ctx.kin, p);
  const x0 = at(bar.x, p.startS);
  const xs = windowValues(times, bar.x, p.startS, p.endS);
  const ys = windowValues(times, bar.y, p.startS, p.endS);
  let pathLengthM = 0;
  for (let k = 1; k < xs.length; k++) pathLengthM += Math.hypot(xs[k] - xs[k - 1], ys[k] - ys[k - 1]);
  const [first, last] = indexRange(times, p.startS, p.endS);
  const seen = bar.valid.slice(Math.max(0, first), last + 1);
  return {
    romM,
    meanConcentricVelocityMps: romM / concentricDurationS,
    peakConcentricVelocityMps,
    meanPropulsiveVelocityMps: prop.meanVelocityMps,
    propulsiveDurationS: prop.endS - p.concentricStartS,
    concentricDurationS,
    eccentricDurationS: p.eccentricEndS - p.eccentricStartS,
    pauseDurationS: p.pauseDurationS,
    stickingPoint: stickingPoint(ctx.kin, p, peakConcentricVelocityMps),
    maxHorizontalDeviationCm: 100 * Math.max(...xs.map((x) => Math.abs(x - x0))),
    netHorizontalDriftCm: 100 * (at(bar.x, p.endS) - x0),
    pathLengthM,
    benchPathShapeCm: ctx.lift === "bench" && ctx.view === "side" ? benchPathShapeCm(ctx, p) : null,
    barCoverage: seen.length > 0 ? seen.filter(Boolean).length / seen.length : 0,
  };
}

/** Largest horizontal travel back toward the shoulders during the press (the bar's J-curve). */
function benchPathShapeCm(ctx: RepContext, p: RepPhases): number {
  const { times, bar } = ctx.kin;
  const x0 = valueAt(times, bar.x, p.concentricStartS);
  // With the body's orientation known, the shoulders lie toward −x; otherwise toward where the press ends.
  const towardShoulders = ctx.kin.facing.axis === "toward-feet" ? -1 : Math.sign(valueAt(times, bar.x, p.concentricEndS) - x0) || 1;
  const xs = windowValues(times, bar.x, p.concentricStartS, p.concentricEndS);
  return 100 * Math.max(0, ...xs.map((x) => towardShoulders * (x - x0)));
}

const ANGLE_FIELDS = ["knee", "hip", "ankle", "torso", "shin"] as const;
type AngleField = `${(typeof ANGLE_FIELDS)[number]}Angle${"AtStart" | "AtBottom" | "AtLockout"}Deg`;

/** The five side-view angles at start, bottom and lockout, read from per-sample angle tracks. */
function anglesAtPhases(times: readonly number[], a: SideAngles | null, p: RepPhases): Record<AngleField, number | null> {
  const tracks = a ? { knee: a.kneeDeg, hip: a.hipDeg, ankle: a.ankleDeg, torso: a.torsoDeg, shin: a.shinDeg } : null;
  const out = {} as Record<AngleField, number | null>;
  for (const name of ANGLE_FIELDS) {
    const at = (t: number) => (tracks ? orNull(valueAt(times, tracks[name], t)) : null);
    out[`${name}AngleAtStartDeg`] = at(p.startS);
    out[`${name}AngleAtBottomDeg`] = at(p.bottomS);
    out[`${name}AngleAtLockoutDeg`] = at(p.concentricEndS);
  }
  return out;
}

const NULL_SIDE_EXTRAS = {
  hipRiseIndex: null,
  depthReached: null,
  depthMarginCm: null,
  barOverMidFootOffsetCm: null,
  barOverMidFootMethod: null,
} as const;

function sideMeasures(ctx: RepContext, p: RepPhases) {
  const a = ctx.view === "side" ? ctx.side : null;
  const angles = anglesAtPhases(ctx.kin.times, a, p);
  if (!a) return { ...angles, ...NULL_SIDE_EXTRAS };
  const depthMarginM =
    ctx.lift === "squat" ? maxFinite(windowValues(ctx.kin.times, a.depthMarginM, p.eccentricEndS, p.concentricStartS)) : null;
  return {
    ...angles,
    hipRiseIndex: ctx.lift === "bench" ? null : hipRiseIndex(ctx, p),
    depthReached: depthMarginM === null ? null : depthMarginM > 0,
    depthMarginCm: cm(depthMarginM),
    ...barOverMidFoot(ctx, a, p),
  };
}

/** Hip rise over shoulder rise from the bottom until a third of the drive: above 1 the hips lead. */
function hipRiseIndex(ctx: RepContext, p: RepPhases): number | null {
  const { kin } = ctx;
  const hip = sideJoint(kin.joints, kin.side!, "hip");
  const shoulder = sideJoint(kin.joints, kin.side!, "shoulder");
  if (!hip || !shoulder) return null;
  const y0 = valueAt(kin.times, kin.bar.y, p.concentricStartS);
  const target = y0 + HIP_RISE_WINDOW_FRACTION * (valueAt(kin.times, kin.bar.y, p.concentricEndS) - y0);
  const [first, last] = indexRange(kin.times, p.concentricStartS, p.concentricEndS);
  let i1 = last;
  for (let i = first; i <= last; i++) {
    if (kin.bar.y[i] >= target) {
      i1 = i;
      break;
    }
  }
  const i0 = nearestIndex(kin.times, p.concentricStartS);
  if (![i0, i1].every((i) => hip.valid[i] && shoulder.valid[i])) return null;
  const shoulderRiseM = shoulder.y[i1] - shoulder.y[i0];
  return shoulderRiseM >= HIP_RISE_MIN_SHOULDER_RISE_M ? (hip.y[i1] - hip.y[i0]) / shoulderRiseM : null;
}

/** Squat: at the bottom; deadlift: at the start of the pull. Positive: bar ahead of mid-foot, toward the toes. */
function barOverMidFoot(ctx: RepContext, a: SideAngles, p: RepPhases) {
  if (ctx.lift === "bench") return { barOverMidFootOffsetCm: null, barOverMidFootMethod: null };
  const t = ctx.lift === "squat" ? p.bottomS : p.concentricStartS;
  const i = nearestIndex(ctx.kin.times, t);
  const fromHeelToe = a.midFootFromHeelToe[i];
  // The ankle-based estimate needs to know which way the toes point.
  if (!fromHeelToe && ctx.kin.facing.axis !== "toward-feet") return { barOverMidFootOffsetCm: null, barOverMidFootMethod: null };
  const offset = orNull(valueAt(ctx.kin.times, ctx.kin.bar.x, t) - valueAt(ctx.kin.times, a.midFootX, t));
  return {
    barOverMidFootOffsetCm: cm(offset),
    barOverMidFootMethod: offset === null ? null : fromHeelToe ? ("heel-toe" as const) : ("ankle-estimate" as const),
  };
}

const NULL_FRONT = {
  kneeProjectionAngleDeg: null,
  kneeProjectionAngleLeftDeg: null,
  kneeProjectionAngleRightDeg: null,
  stanceToShoulderWidthRatio: null,
  leftRightAsymmetry: null,
} as const;

function largestMagnitude(values: number[]): number | null {
  let best: number | null = null;
  for (const v of values) if (Number.isFinite(v) && (best === null || Math.abs(v) > Math.abs(best))) best = v;
  return best;
}

/**
 * Peak of a noisy angle over a window, read from its moving average over about PEAK_SMOOTHING_S:
 * the peak of the raw samples would mostly measure keypoint jitter (common practice).
 */
const PEAK_SMOOTHING_S = 0.2;

function smoothedPeak(times: readonly number[], values: readonly number[], startS: number, endS: number): number | null {
  const [first, last] = indexRange(times, startS, endS);
  const half = Math.max(1, Math.round(PEAK_SMOOTHING_S / 2 / (times[1] - times[0])));
  let best: number | null = null;
  for (let i = Math.max(0, first); i <= last; i++) {
    if (!Number.isFinite(values[i])) continue;
    let sum = 0;
    let n = 0;
    for (let k = Math.max(0, i - half); k <= Math.min(values.length - 1, i + half); k++) {
      if (Number.isFinite(values[k])) {
        sum += values[k];
        n++;
      }
    }
    if (best === null || sum / n > best) best = sum / n;
  }
  return best;
}

function frontMeasuresForRep(ctx: RepContext, p: RepPhases) {
  const f = ctx.front;
  if (!f || ctx.view !== "front") return NULL_FRONT;
  const { times } = ctx.kin;
  const legs = ctx.lift !== "bench";
  const left = legs ? smoothedPeak(times, f.kneeProjectionLeftDeg, p.startS, p.endS) : null;
  const right = legs ? smoothedPeak(times, f.kneeProjectionRightDeg, p.startS, p.endS) : null;
  const worst = left === null ? right : right === null ? left : Math.max(left, right);
  return {
    kneeProjectionAngleDeg: worst,
    kneeProjectionAngleLeftDeg: left,
    kneeProjectionAngleRightDeg: right,
    stanceToShoulderWidthRatio: legs ? orNull(valueAt(times, f.stanceToShoulderWidth, p.startS)) : null,
    leftRightAsymmetry: {
      kneeProjectionDiffDeg: left !== null && right !== null ? left - right : null,
      hipShiftCm: legs ? cm(orNull(valueAt(times, f.hipShiftM, p.bottomS))) : null,
      shoulderTiltDeg: orNull(valueAt(times, f.shoulderTiltDeg, p.bottomS)),
      wristHeightDiffCm: cm(largestMagnitude(windowValues(times, f.wristHeightDiffM, p.concentricStartS, p.concentricEndS))),
    },
  };
}

export function measureRep(ctx: RepContext, p: RepPhases): RepMeasures {
  return {
    startS: p.startS,
    endS: p.endS,
    eccentricStartS: p.eccentricStartS,
    eccentricEndS: p.eccentricEndS,
    concentricStartS: p.concentricStartS,
    concentricEndS: p.concentricEndS,
    bottomS: p.bottomS,
    ...barMeasures(ctx, p),
    ...sideMeasures(ctx, p),
    ...frontMeasuresForRep(ctx, p),
  };
}
