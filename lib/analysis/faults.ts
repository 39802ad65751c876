// Fault flags: each states its rule, the threshold (editable per team through the options) and
// where the threshold comes from — a published source or "common practice".
import type { Flag, RepResult, SetResult } from "./result";
import type { CameraView, Lift } from "./track";

export const FAULT_CODES = [
  "depth-not-reached",
  "shallow-rep",
  "bar-drift",
  "hips-rise-first",
  "start-position-inconsistent",
  "start-torso-angle-inconsistent",
  "knees-inside-feet",
  "velocity-loss",
] as const;
export type FaultCode = (typeof FAULT_CODES)[number];

export interface FaultThreshold {
  value: number;
  unit: string;
  rule: string;
  source: string;
}

export const DEFAULT_FAULT_THRESHOLDS: Readonly<Record<FaultCode, FaultThreshold>> = {
  "depth-not-reached": {
    value: 0,
    unit: "cm",
    rule: "Squat, side view: the hip joint must end up below the top of the knee; flagged when the depth margin is at or under the threshold.",
    source:
      "IPF Technical Rules, back squat: the top surface of the legs at the hip joint lower than the top of the knees (approximated here from hip and knee keypoints)",
  },
  "shallow-rep": {
    value: 85,
    unit: "% of the set's median range",
    rule: "A rep whose bar range of motion is below this share of the set's median range is counted but flagged.",
    source: "common practice",
  },
  "bar-drift": {
    value: 5,
    unit: "cm",
    rule: "Squat and deadlift, side view: largest horizontal distance of the bar from where it was at the rep's start.",
    source: "common practice",
  },
  "hips-rise-first": {
    value: 1.5,
    unit: "ratio",
    rule: "Squat and deadlift, side view: hip rise divided by shoulder rise over the first third of the drive.",
    source: "common practice",
  },
  "start-position-inconsistent": {
    value: 5,
    unit: "cm",
    rule: "Distance of a rep's starting bar position from the set's median starting position.",
    source: "common practice",
  },
  "start-torso-angle-inconsistent": {
    value: 8,
    unit: "deg",
    rule: "Side view: difference of a rep's torso angle at the start from the set's median.",
    source: "common practice",
  },
  "knees-inside-feet": {
    value: 10,
    unit: "deg",
    rule: "Front view: largest frontal-plane projection angle of either knee toward the midline (valgus) during the rep.",
    source: "common practice; angle as defined by Munro, Herrington & Carolan 2012, J Sport Rehabil 21:7-11",
  },
  "velocity-loss": {
    value: 20,
    unit: "%",
    rule: "Loss of mean concentric velocity from the set's best rep to its last.",
    source:
      "Pareja-Blanco et al. 2017, Scand J Med Sci Sports 27:724-735 (20 % against 40 % velocity loss in the squat: the larger loss brought more fatigue)",
  },
};

export type FaultThresholdOverrides = Partial<Record<FaultCode, number>>;

/** Defaults with a team's own values; an edited threshold says so and keeps the default's source. */
export function resolveThresholds(overrides: FaultThresholdOverrides = {}): Record<FaultCode, FaultThreshold> {
  const out = {} as Record<FaultCode, FaultThreshold>;
  for (const code of FAULT_CODES) {
    const base = DEFAULT_FAULT_THRESHOLDS[code];
    const value = overrides[code];
    out[code] =
      value === undefined || value === base.value
        ? { ...base }
        : { ...base, value, source: `team setting (default ${base.value} ${base.unit}: ${base.source})` };
  }
  return out;
}

export interface FlagContext {
  lift: Lift;
  view: CameraView;
  thresholds: Record<FaultCode, FaultThreshold>;
  /** Median bar range of motion of the set (null with fewer than two reps). */
  medianRomM: number | null;
  /** Each rep's distance from the set's median start position (cm), and torso angle difference (deg). */
  startDistanceCm: (number | null)[];
  startTorsoDiffDeg: (number | null)[];
}

const fmt = (v: number, digits = 1) => v.toFixed(digits);

function flag(ctx: FlagContext, code: FaultCode, rep: number | null, value: number, message: string): Flag {
  const t = ctx.thresholds[code];
  return { code, rep, message, threshold: t.value, value, unit: t.unit, source: t.source };
}

type RepInput = Omit<RepResult, "flags" | "series">;

/** Flags for one rep; `k` is its position in the set (0-based). */
export function repFlags(ctx: FlagContext, rep: RepInput, k: number): Flag[] {
  const th = (code: FaultCode) => ctx.thresholds[code].value;
  const n = rep.index;
  const out: Flag[] = [];
  if (rep.depthMarginCm !== null && rep.depthMarginCm <= th("depth-not-reached")) {
    const above = -rep.depthMarginCm;
    out.push(flag(ctx, "depth-not-reached", n, rep.depthMarginCm, `Rep ${n}: depth not reached — hip joint ${fmt(Math.abs(above))} cm ${above >= 0 ? "above" : "below"} the top of the knee (estimated from keypoints).`));
  }
  if (ctx.medianRomM !== null && ctx.medianRomM > 0) {
    const pct = (100 * rep.romM) / ctx.medianRomM;
    if (pct < th("shallow-rep")) {
      out.push(flag(ctx, "shallow-rep", n, pct, `Rep ${n}: shallow — range of motion ${fmt(rep.romM * 100, 0)} cm is ${fmt(pct, 0)} % of the set's median.`));
    }
  }
  if (ctx.view === "side" && ctx.lift !== "bench" && rep.maxHorizontalDeviationCm > th("bar-drift")) {
    out.push(flag(ctx, "bar-drift", n, rep.maxHorizontalDeviationCm, `Rep ${n}: bar moved ${fmt(rep.maxHorizontalDeviationCm)} cm horizontally from where it started.`));
  }
  if (rep.hipRiseIndex !== null && rep.hipRiseIndex > th("hips-rise-first")) {
    out.push(flag(ctx, "hips-rise-first", n, rep.hipRiseIndex, `Rep ${n}: hips rose ${fmt(rep.hipRiseIndex, 2)} times as far as the shoulders early in the drive.`));
  }
  const startCm = ctx.startDistanceCm[k];
  if (startCm !== null && startCm > th("start-position-inconsistent")) {
    out.push(flag(ctx, "start-position-inconsistent", n, startCm, `Rep ${n}: bar started ${fmt(startCm)} cm from the set's usual start position.`));
  }
  const torsoDeg = ctx.startTorsoDiffDeg[k];
  if (torsoDeg !== null && Math.abs(torsoDeg) > th("start-torso-angle-inconsistent")) {
    out.push(flag(ctx, "start-torso-angle-inconsistent", n, torsoDeg, `Rep ${n}: torso angle at the start differs by ${fmt(torsoDeg)}° from the set's usual start.`));
  }
  if (rep.kneeProjectionAngleDeg !== null && rep.kneeProjectionAngleDeg > th("knees-inside-feet")) {
    const side = rep.kneeProjectionAngleDeg === rep.kneeProjectionAngleLeftDeg ? "left" : "right";
    out.push(flag(ctx, "knees-inside-feet", n, rep.kneeProjectionAngleDeg, `Rep ${n}: ${side} knee travelled inside the line from hip to foot (frontal-plane projection angle ${fmt(rep.kneeProjectionAngleDeg, 0)}°).`));
  }
  return out;
}

export function setFlags(ctx: FlagContext, set: Omit<SetResult, "flags">): Flag[] {
  const limit = ctx.thresholds["velocity-loss"].value;
  if (set.velocityLossPct === null || set.velocityLossPct <= limit) return [];
  return [flag(ctx, "velocity-loss", null, set.velocityLossPct, `Velocity loss of ${fmt(set.velocityLossPct, 0)} % from the best rep to the last.`)];
}
