// Load–velocity fit and the 1RM it implies, against values computed with SciPy 1.17.1
// (scipy.stats.linregress and scipy.stats.t.ppf) for the small data set below.
import { describe, expect, it } from "vitest";
import { estimateOneRepMax, fitLoadVelocity, tCritical975 } from "@/lib/trends/load-velocity";
import { MINIMUM_VELOCITY_THRESHOLD_MPS } from "@/lib/analysis/references";

// Five squat sets, invented: velocity falls 0.0058 m/s per kg.
const points = [
  { loadKg: 100, velocityMps: 0.82 },
  { loadKg: 120, velocityMps: 0.71 },
  { loadKg: 140, velocityMps: 0.6 },
  { loadKg: 160, velocityMps: 0.47 },
  { loadKg: 180, velocityMps: 0.36 },
];

describe("fitLoadVelocity", () => {
  it("matches scipy.stats.linregress", () => {
    const fit = fitLoadVelocity(points);
    if (!fit) throw new Error("no fit");
    expect(fit.slopeMpsPerKg).toBeCloseTo(-0.0058, 12); // SciPy linregress slope
    expect(fit.interceptMps).toBeCloseTo(1.404, 10); // SciPy linregress intercept
    expect(fit.rSquared).toBeCloseTo(0.999108999108999, 10); // SciPy rvalue ** 2
    expect(fit.residualStandardErrorMps).toBeCloseTo(0.006324555320336764, 12); // sqrt(SSE / (n - 2)) with NumPy
    expect(fit.n).toBe(5);
  });

  it("needs two distinct loads and ignores unusable points", () => {
    expect(fitLoadVelocity([{ loadKg: 100, velocityMps: 0.8 }, { loadKg: 100, velocityMps: 0.7 }])).toBeNull();
    expect(fitLoadVelocity([...points, { loadKg: 0, velocityMps: 1 }, { loadKg: 150, velocityMps: Number.NaN }])?.n).toBe(5);
  });
});

describe("estimateOneRepMax", () => {
  it("extrapolates to the squat's minimum velocity threshold with a 95 % band", () => {
    const fit = fitLoadVelocity(points);
    if (!fit) throw new Error("no fit");
    expect(MINIMUM_VELOCITY_THRESHOLD_MPS.squat.valueMps).toBe(0.23); // Helms et al. 2017, as quoted in lib/analysis/references.ts
    const estimate = estimateOneRepMax(fit, 0.23);
    if (!estimate) throw new Error("no estimate");
    expect(estimate.valueKg).toBeCloseTo(202.41379310344828, 9); // (0.23 - intercept) / slope, SciPy fit
    // SciPy: t.ppf(0.975, 3) = 3.18245; the table holds 3.182, so the band agrees to about a gram.
    expect(estimate.lowKg).toBeCloseTo(197.29721143167254, 2);
    expect(estimate.highKg).toBeCloseTo(207.53037477522403, 2);
  });

  it("gives no band with two sets and no estimate when speed does not fall with load", () => {
    const two = fitLoadVelocity(points.slice(0, 2));
    if (!two) throw new Error("no fit");
    const estimate = estimateOneRepMax(two, 0.23);
    expect(estimate?.lowKg).toBeNull();
    expect(estimate?.valueKg).toBeCloseTo((0.23 - 1.37) / -0.0055, 9); // line through (100, 0.82) and (120, 0.71), by hand
    const rising = fitLoadVelocity([{ loadKg: 100, velocityMps: 0.5 }, { loadKg: 120, velocityMps: 0.6 }]);
    expect(rising && estimateOneRepMax(rising, 0.23)).toBeNull();
  });

  it("tabulates Student's t like scipy.stats.t.ppf(0.975, df) to three decimals", () => {
    // SciPy 1.17.1: 12.706, 4.303, 3.182, 2.571, 2.228, 2.086, 2.042, 2.021, 2.0, 1.98
    const scipy: [number, number][] = [[1, 12.706], [2, 4.303], [3, 3.182], [5, 2.571], [10, 2.228], [20, 2.086], [30, 2.042], [40, 2.021], [60, 2.0], [120, 1.98]];
    for (const [df, t] of scipy) expect(tCritical975(df)).toBeCloseTo(t, 3);
    expect(tCritical975(1000)).toBe(1.96);
    expect(() => tCritical975(0)).toThrow(RangeError);
  });
});
