// The athlete's load–velocity profile: an ordinary least-squares line of mean concentric velocity on load
// over their sets, and the 1RM it implies at the lift's minimum velocity threshold, with a 95 % band.
import { linearRegression, rSquared } from "simple-statistics";

export interface LoadVelocityPoint {
  loadKg: number;
  velocityMps: number;
}

export interface LoadVelocityFit {
  n: number;
  slopeMpsPerKg: number;
  interceptMps: number;
  rSquared: number;
  /** Residual standard error of the regression, s = sqrt(SSE / (n − 2)); null with fewer than 3 points. */
  residualStandardErrorMps: number | null;
  meanLoadKg: number;
  /** Sum of squared load deviations from their mean. */
  sxxKg2: number;
}

/**
 * Two-sided 95 % critical values of Student's t by degrees of freedom (standard table, e.g. the NIST/SEMATECH
 * e-Handbook of Statistical Methods, 1.3.6.7.2); checked against SciPy's t.ppf(0.975, df).
 */
const T_975: Record<number, number> = {
  1: 12.706, 2: 4.303, 3: 3.182, 4: 2.776, 5: 2.571, 6: 2.447, 7: 2.365, 8: 2.306, 9: 2.262, 10: 2.228,
  11: 2.201, 12: 2.179, 13: 2.16, 14: 2.145, 15: 2.131, 16: 2.12, 17: 2.11, 18: 2.101, 19: 2.093, 20: 2.086,
  21: 2.08, 22: 2.074, 23: 2.069, 24: 2.064, 25: 2.06, 26: 2.056, 27: 2.052, 28: 2.048, 29: 2.045, 30: 2.042,
};
const T_975_LARGE: [number, number][] = [[40, 2.021], [60, 2.0], [120, 1.98]];

/** t(0.975, df), rounded up to the next tabulated value (conservative) past 30 degrees of freedom. */
export function tCritical975(df: number): number {
  if (!Number.isInteger(df) || df < 1) throw new RangeError("degrees of freedom must be a positive integer");
  if (df <= 30) return T_975[df];
  for (const [upTo, t] of T_975_LARGE) if (df <= upTo) return t;
  return 1.96;
}

/** Least-squares fit, or null without two distinct loads. */
export function fitLoadVelocity(points: readonly LoadVelocityPoint[]): LoadVelocityFit | null {
  const usable = points.filter((p) => Number.isFinite(p.loadKg) && p.loadKg > 0 && Number.isFinite(p.velocityMps) && p.velocityMps > 0);
  if (new Set(usable.map((p) => p.loadKg)).size < 2) return null;
  const pairs = usable.map((p) => [p.loadKg, p.velocityMps]);
  const { m, b } = linearRegression(pairs);
  const line = (x: number) => m * x + b;
  const n = usable.length;
  const meanLoadKg = usable.reduce((s, p) => s + p.loadKg, 0) / n;
  const sxxKg2 = usable.reduce((s, p) => s + (p.loadKg - meanLoadKg) ** 2, 0);
  const sse = usable.reduce((s, p) => s + (p.velocityMps - line(p.loadKg)) ** 2, 0);
  return {
    n,
    slopeMpsPerKg: m,
    interceptMps: b,
    rSquared: rSquared(pairs, line),
    residualStandardErrorMps: n >= 3 ? Math.sqrt(sse / (n - 2)) : null,
    meanLoadKg,
    sxxKg2,
  };
}

export interface OneRepMaxEstimate {
  valueKg: number;
  /** 95 % band; null with fewer than three sets. */
  lowKg: number | null;
  highKg: number | null;
  method: string;
}

export const ONE_REP_MAX_BAND_METHOD =
  "95 % inverse-prediction band: load ± t(0.975, n−2) · s / |slope| · √(1 + 1/n + (load − mean load)² / Sxx), " +
  "s the residual standard error of the fit (the usual first-order approximation for reading x from a fitted line; common practice)";

/** Load at which the fitted line reaches the minimum velocity threshold; null unless velocity falls with load. */
export function estimateOneRepMax(fit: LoadVelocityFit, minimumVelocityMps: number): OneRepMaxEstimate | null {
  if (!(fit.slopeMpsPerKg < 0) || !(minimumVelocityMps > 0)) return null;
  const valueKg = (minimumVelocityMps - fit.interceptMps) / fit.slopeMpsPerKg;
  if (!(valueKg > 0)) return null;
  if (fit.residualStandardErrorMps === null) return { valueKg, lowKg: null, highKg: null, method: ONE_REP_MAX_BAND_METHOD };
  const half =
    ((tCritical975(fit.n - 2) * fit.residualStandardErrorMps) / Math.abs(fit.slopeMpsPerKg)) *
    Math.sqrt(1 + 1 / fit.n + (valueKg - fit.meanLoadKg) ** 2 / fit.sxxKg2);
  return { valueKg, lowKg: Math.max(0, valueKg - half), highKg: valueKg + half, method: ONE_REP_MAX_BAND_METHOD };
}
