// Published load–velocity and repetition references the set measures quote:
// %1RM from bar speed, velocity at 1RM, rep-based 1RM formulas and reps in
// reserve. Every output carries its source; values recalled rather than
// checked against the paper say "from memory" in that source.
import type { Lift } from "./track";

export interface ReferenceValue {
  value: number;
  source: string;
}

const HELMS_2017 =
  "Helms et al. 2017, J Strength Cond Res 31(2):292-297: average concentric velocity at 1RM 0.23 (squat), 0.10 (bench press), 0.14 (deadlift) m/s in powerlifters";

/** Mean concentric velocity at 1RM (minimum velocity threshold) per lift, from competitive powerlifters. */
export const MINIMUM_VELOCITY_THRESHOLD_MPS: Record<Lift, { valueMps: number; source: string }> = {
  squat: { valueMps: 0.23, source: HELMS_2017 },
  bench: { valueMps: 0.1, source: HELMS_2017 },
  deadlift: { valueMps: 0.14, source: HELMS_2017 },
};

interface LoadVelocityEquation {
  /** %1RM = a v^2 + b v + c */
  a: number;
  b: number;
  c: number;
  source: string;
}

/**
 * General load–velocity equations. No deadlift entry: Benavides-Ubric et al.
 * 2020 (J Sports Sci Med 19:452-459) fitted general first-order equations of
 * %1RM on MV, MPV and peak velocity over 30-100 % 1RM (R² 0.91-0.93), but
 * their coefficients could not be read in the paper itself, only as a
 * second-hand quote; Ruf et al. 2018 (J Strength Cond Res 32(3):681-689) give
 * individual profiles only. An unchecked equation would be worse than none.
 */
export const LOAD_VELOCITY_EQUATIONS: Partial<Record<Lift, LoadVelocityEquation>> = {
  squat: {
    a: -5.961,
    b: -50.71,
    c: 117,
    source:
      "Sánchez-Medina et al. 2017, Sports Med Int Open 1(2):E80-E88, full back squat: %1RM = -5.961 MV² - 50.71 MV + 117 (coefficients from memory; the paper reports MV at 1RM of 0.32 m/s)",
  },
  bench: {
    a: 8.4326,
    b: -73.501,
    c: 112.33,
    source:
      "González-Badillo & Sánchez-Medina 2010, Int J Sports Med 31:347-352, bench press: %1RM = 8.4326 MPV² - 73.501 MPV + 112.33 (coefficients from memory). Fitted on mean propulsive velocity, which equals mean concentric velocity above about 75 % 1RM; at lighter loads this overestimates %1RM",
  },
};

/** Equations are used only between 30 % and 100 % 1RM, the span the studies tested. */
const MIN_PERCENT = 30;
const MAX_PERCENT = 100;

/** %1RM a rep's mean concentric velocity corresponds to, or null when no equation covers the lift or the speed is out of range. */
export function estimatePercentOneRepMax(lift: Lift, meanConcentricVelocityMps: number): { percent: number; source: string } | null {
  const equation = LOAD_VELOCITY_EQUATIONS[lift];
  if (!equation || !Number.isFinite(meanConcentricVelocityMps) || meanConcentricVelocityMps <= 0) return null;
  const v = meanConcentricVelocityMps;
  const percent = equation.a * v * v + equation.b * v + equation.c;
  if (percent < MIN_PERCENT || percent > MAX_PERCENT) return null;
  return { percent, source: equation.source };
}

/** 1RM implied by one set's load and its best rep's speed through the general equation. */
export function estimateOneRepMaxFromVelocity(lift: Lift, loadKg: number, meanConcentricVelocityMps: number): ReferenceValue | null {
  assertLoad(loadKg);
  const estimate = estimatePercentOneRepMax(lift, meanConcentricVelocityMps);
  if (!estimate) return null;
  return { value: (loadKg * 100) / estimate.percent, source: estimate.source };
}

/**
 * 1RM from an athlete's own load–velocity points (e.g. the best rep of sets
 * across sessions): least-squares line of velocity on load, extrapolated to
 * the lift's velocity at 1RM. Needs two or more distinct loads and a falling line.
 */
export function estimateOneRepMaxFromProfile(lift: Lift, points: readonly { loadKg: number; velocityMps: number }[]): ReferenceValue | null {
  const usable = points.filter((p) => p.loadKg > 0 && Number.isFinite(p.loadKg) && Number.isFinite(p.velocityMps) && p.velocityMps > 0);
  if (new Set(usable.map((p) => p.loadKg)).size < 2) return null;
  const { slope, intercept } = leastSquaresLine(usable.map((p) => p.loadKg), usable.map((p) => p.velocityMps));
  if (!(slope < 0)) return null;
  const threshold = MINIMUM_VELOCITY_THRESHOLD_MPS[lift];
  return {
    value: (threshold.valueMps - intercept) / slope,
    source: `Individual linear load–velocity profile extrapolated to the velocity at 1RM (common practice); ${threshold.source}`,
  };
}

function leastSquaresLine(x: number[], y: number[]): { slope: number; intercept: number } {
  const n = x.length;
  const meanX = x.reduce((s, v) => s + v, 0) / n;
  const meanY = y.reduce((s, v) => s + v, 0) / n;
  let sxy = 0;
  let sxx = 0;
  for (let i = 0; i < n; i++) {
    sxy += (x[i] - meanX) * (y[i] - meanY);
    sxx += (x[i] - meanX) ** 2;
  }
  const slope = sxy / sxx;
  return { slope, intercept: meanY - slope * meanX };
}

/** Rep-based formulas lose accuracy past about ten reps (LeSuer et al. 1997, from memory). */
const MAX_FORMULA_REPS = 10;

function assertLoad(loadKg: number): void {
  if (!(loadKg > 0) || !Number.isFinite(loadKg)) throw new RangeError(`loadKg must be a finite number above 0, got ${loadKg}`);
}

function checkReps(loadKg: number, reps: number): boolean {
  assertLoad(loadKg);
  if (!Number.isInteger(reps) || reps < 1) throw new RangeError(`reps must be a whole number of at least 1, got ${reps}`);
  return reps <= MAX_FORMULA_REPS;
}

/** Epley (1985): 1RM = load (1 + reps / 30), in kg; a single is its own 1RM; null past ten reps. */
export function epleyOneRepMax(loadKg: number, reps: number): ReferenceValue | null {
  if (!checkReps(loadKg, reps)) return null;
  return {
    value: reps === 1 ? loadKg : loadKg * (1 + reps / 30),
    source: "Epley 1985, Poundage Chart, Boyd Epley Workout (publication details from memory): 1RM = load × (1 + reps / 30)",
  };
}

/** Brzycki (1993): 1RM = load × 36 / (37 − reps), in kg; null past ten reps. */
export function brzyckiOneRepMax(loadKg: number, reps: number): ReferenceValue | null {
  if (!checkReps(loadKg, reps)) return null;
  return {
    value: (loadKg * 36) / (37 - reps),
    source: "Brzycki 1993, J Phys Educ Recreat Dance 64(1):88-90 (publication details from memory): 1RM = load × 36 / (37 − reps)",
  };
}

/** Beyond this many reps left, a straight-line extrapolation says little (common practice). */
const MAX_REPS_IN_RESERVE = 10;

/**
 * Reps left before failure from the set's per-rep mean concentric velocities
 * (in order): the velocity loss per rep, fitted from the fastest rep to the
 * last, is extended until the speed reaches the lift's velocity at 1RM,
 * because the last rep before failure is about as slow as a 1RM. Null with
 * fewer than two reps, no measurable slowing, or more than ten reps left.
 * Velocity falls faster near failure in the squat, so early in a set this
 * tends to overestimate the reps left.
 */
export function estimateRepsInReserve(lift: Lift, meanVelocitiesMps: readonly number[]): { reps: number; source: string } | null {
  if (meanVelocitiesMps.some((v) => !Number.isFinite(v) || v <= 0)) return null;
  const fastest = meanVelocitiesMps.indexOf(Math.max(...meanVelocitiesMps));
  const tail = meanVelocitiesMps.slice(fastest);
  if (tail.length < 2) return null;
  const { slope } = leastSquaresLine(tail.map((_, i) => i), [...tail]);
  if (!(slope < 0)) return null;
  const threshold = MINIMUM_VELOCITY_THRESHOLD_MPS[lift];
  const reps = Math.max(0, Math.round((tail[tail.length - 1] - threshold.valueMps) / -slope));
  if (reps > MAX_REPS_IN_RESERVE) return null;
  return {
    reps,
    source:
      "Velocity loss within a set tracks the share of possible reps done (Sánchez-Medina & González-Badillo 2011, Med Sci Sports Exerc 43(9):1725-1734; Rodríguez-Rosell et al. 2020, J Strength Cond Res 34(9):2537-2547; details from memory), " +
      `extended in a straight line to the velocity at 1RM (our model, common practice); ${threshold.source}`,
  };
}
