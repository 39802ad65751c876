// Smoothed bar and joint motion in metres (y up, x toward the athlete's feet when known) on the
// uniform grid: zero-lag low-pass, then Savitzky–Golay derivatives for bar velocity and acceleration.
import type { Scale } from "./calibration";
import { butter, filtfilt, savitzkyGolay } from "./filters";
import type { JointName } from "./joints";
import { facing, sideJoint, type Facing, type Side, type Signal } from "./orientation";
import type { Channel, UniformTrack } from "./resample";
import type { CameraView, Lift } from "./track";

export type BarSource = "tracked" | "pose-estimate";

export interface BarMotion extends Signal {
  /** Height before smoothing (metres, up), for fitting phase edges. */
  yRaw: number[];
  /** Samples where the bar (or the joint standing in for it) was seen rather than bridged across a gap. */
  seen: boolean[];
  vx: number[];
  vy: number[];
  ay: number[];
}

export interface Kinematics {
  times: number[];
  sampleRateHz: number;
  cutoffHz: number;
  savgolWindow: number;
  bar: BarMotion;
  barSource: BarSource;
  joints: Partial<Record<JointName, Signal>>;
  side: Side | null;
  facing: Facing;
}

/** Butterworth order designed per pass (run forward and back by filtfilt). */
export const FILTER_ORDER = 4;
/** Savitzky–Golay derivative: cubic fit over about 0.1 s; the positions are already low-passed, so the fit only needs to differentiate, not smooth further. */
export const SAVGOL_POLY_ORDER = 3;
const SAVGOL_WINDOW_S = 0.1;
/** A cutoff must stay below the Nyquist frequency; 0.4 × the sample rate keeps the design stable. */
const MAX_CUTOFF_FRACTION = 0.4;
/** Fewer samples than this are not filtered (filtfilt needs padding room) and yield no reps. */
export const MIN_SAMPLES = 16;

export function savgolWindowFor(sampleRateHz: number): number {
  const n = Math.max(5, Math.round(SAVGOL_WINDOW_S * sampleRateHz));
  return n % 2 === 1 ? n : n + 1;
}

export function effectiveCutoffHz(cutoffHz: number, sampleRateHz: number): number {
  return Math.min(cutoffHz, MAX_CUTOFF_FRACTION * sampleRateHz);
}

type Smoother = (values: number[]) => number[];

/** Zero-lag Butterworth low-pass (the same filter as lowPassZeroLag, designed once for all channels). */
function smoother(sampleRateHz: number, cutoffHz: number): Smoother {
  const { b, a } = butter(FILTER_ORDER, cutoffHz, sampleRateHz);
  return (values) => (values.length >= MIN_SAMPLES ? filtfilt(b, a, values) : [...values]);
}

function toMetres(c: Channel, mpp: number, smooth: Smoother): Signal {
  return { x: smooth(c.x.map((v) => v * mpp)), y: smooth(c.y.map((v) => -v * mpp)), valid: [...c.valid] };
}

/** Side view: the nearer side's leg and trunk (or the other side's where never seen), and the head for orientation. */
const SIDE_VIEW_JOINTS = ["shoulder", "hip", "knee", "ankle", "heel", "foot_index", "ear"];
const FRONT_VIEW_JOINTS = ["shoulder", "hip", "knee", "ankle", "wrist"];

/** Joints the measures read; only these are smoothed. */
function usedJoints(uniform: UniformTrack, view: CameraView, side: Side | null): JointName[] {
  if (view === "front" || side === null) {
    return FRONT_VIEW_JOINTS.flatMap((j) => [`left_${j}`, `right_${j}`] as JointName[]);
  }
  const other = side === "left" ? "right" : "left";
  const names = SIDE_VIEW_JOINTS.map((j) => (uniform.joints[`${side}_${j}` as JointName] ? `${side}_${j}` : `${other}_${j}`) as JointName);
  return [...names, "nose"];
}

/** Average of the channels that are valid at each sample (pixels). */
function meanChannel(channels: (Channel | undefined)[]): Channel | null {
  const seen = channels.filter((c): c is Channel => c !== undefined);
  if (seen.length === 0) return null;
  const n = seen[0].x.length;
  const out: Channel = { x: new Array(n), y: new Array(n), valid: new Array(n) };
  for (let i = 0; i < n; i++) {
    const valid = seen.filter((c) => c.valid[i]);
    const use = valid.length > 0 ? valid : seen;
    out.x[i] = use.reduce((s, c) => s + c.x[i], 0) / use.length;
    out.y[i] = use.reduce((s, c) => s + c.y[i], 0) / use.length;
    out.valid[i] = valid.length > 0;
  }
  return out;
}

/**
 * Without a tracked bar, the bar moves with the hands (bench, deadlift) or sits on the upper back
 * just above the shoulder joints (squat); labelled as an estimate in the result.
 */
function poseBarChannel(uniform: UniformTrack, lift: Lift, view: CameraView, side: Side | null): Channel | null {
  const joint = lift === "squat" ? "shoulder" : "wrist";
  if (view === "side" && side) return sideJoint(uniform.joints, side, joint) ?? null;
  return meanChannel([uniform.joints[`left_${joint}`], uniform.joints[`right_${joint}`]]);
}

function mirror(s: Signal): Signal {
  return { x: s.x.map((v) => -v), y: s.y, valid: s.valid };
}

export interface KinematicsInput {
  uniform: UniformTrack;
  scale: Scale;
  lift: Lift;
  view: CameraView;
  side: Side | null;
  cutoffHz: number;
  /** The same track before gaps were bridged; without it every valid sample counts as seen. */
  observed?: UniformTrack;
}

export function buildKinematics({ uniform, scale, lift, view, side, cutoffHz: requested, observed }: KinematicsInput): Kinematics {
  const { sampleRateHz, times } = uniform;
  const cutoffHz = effectiveCutoffHz(requested, sampleRateHz);
  const mpp = scale.metresPerPixel;
  const tracked = uniform.bar.valid.some(Boolean);
  const barPx = tracked ? uniform.bar : poseBarChannel(uniform, lift, view, side);
  const barSeen = observed ? (tracked ? observed.bar : poseBarChannel(observed, lift, view, side)) : barPx;
  const smooth = smoother(sampleRateHz, cutoffHz);
  let joints: Partial<Record<JointName, Signal>> = {};
  for (const name of usedJoints(uniform, view, side)) {
    const channel = uniform.joints[name];
    if (channel) joints[name] = toMetres(channel, mpp, smooth);
  }
  const orientation = facing(lift, view, joints, side);
  let bar = barPx ? toMetres(barPx, mpp, smooth) : { x: times.map(() => 0), y: times.map(() => 0), valid: times.map(() => false) };
  if (orientation.sign < 0) {
    bar = mirror(bar);
    joints = Object.fromEntries(Object.entries(joints).map(([k, s]) => [k, mirror(s as Signal)]));
  }
  const savgolWindow = savgolWindowFor(sampleRateHz);
  const dt = 1 / sampleRateHz;
  const derive = (v: number[]) =>
    v.length >= savgolWindow ? savitzkyGolay(v, savgolWindow, SAVGOL_POLY_ORDER, 1, dt) : v.map(() => 0);
  const vy = derive(bar.y);
  return {
    times,
    sampleRateHz,
    cutoffHz,
    savgolWindow,
    bar: { ...bar, yRaw: barPx ? barPx.y.map((v) => -v * mpp) : bar.y, seen: barSeen ? [...barSeen.valid] : [...bar.valid], vx: derive(bar.x), vy, ay: derive(vy) },
    barSource: tracked ? "tracked" : "pose-estimate",
    joints,
    side,
    facing: orientation,
  };
}
