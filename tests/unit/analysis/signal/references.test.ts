import { describe, expect, it } from "vitest";
import {
  brzyckiOneRepMax,
  epleyOneRepMax,
  estimateOneRepMaxFromProfile,
  estimateOneRepMaxFromVelocity,
  estimatePercentOneRepMax,
  estimateRepsInReserve,
  MINIMUM_VELOCITY_THRESHOLD_MPS,
} from "@/lib/analysis/references";

describe("MINIMUM_VELOCITY_THRESHOLD_MPS", () => {
  it("holds the velocities at 1RM per lift", () => {
    // Helms et al. 2017, J Strength Cond Res 31(2):292-297, abstract: 0.23, 0.10, 0.14 m/s.
    expect(MINIMUM_VELOCITY_THRESHOLD_MPS.squat.valueMps).toBe(0.23);
    expect(MINIMUM_VELOCITY_THRESHOLD_MPS.bench.valueMps).toBe(0.1);
    expect(MINIMUM_VELOCITY_THRESHOLD_MPS.deadlift.valueMps).toBe(0.14);
    expect(MINIMUM_VELOCITY_THRESHOLD_MPS.squat.source).toMatch(/Helms et al\. 2017/);
  });
});

describe("estimatePercentOneRepMax", () => {
  it("squat: Sánchez-Medina et al. 2017 equation (coefficients from memory)", () => {
    // -5.961 × 0.6² - 50.71 × 0.6 + 117 = 84.43 %1RM (worked by hand from the equation).
    const estimate = estimatePercentOneRepMax("squat", 0.6);
    expect(estimate?.percent).toBeCloseTo(84.43, 2);
    expect(estimate?.source).toMatch(/Sánchez-Medina et al\. 2017/);
    // The paper reports MV at 1RM of 0.32 m/s; the equation gives about 100 % there.
    expect(estimatePercentOneRepMax("squat", 0.325)?.percent).toBeCloseTo(99.9, 0);
  });

  it("bench press: González-Badillo & Sánchez-Medina 2010 equation (coefficients from memory)", () => {
    // 8.4326 × 0.5² - 73.501 × 0.5 + 112.33 = 77.69 %1RM.
    const estimate = estimatePercentOneRepMax("bench", 0.5);
    expect(estimate?.percent).toBeCloseTo(77.69, 2);
    expect(estimate?.source).toMatch(/González-Badillo & Sánchez-Medina 2010/);
  });

  it("has no deadlift equation and refuses speeds outside 30-100 % 1RM", () => {
    expect(estimatePercentOneRepMax("deadlift", 0.5)).toBeNull();
    expect(estimatePercentOneRepMax("squat", 0.2)).toBeNull();
    expect(estimatePercentOneRepMax("bench", 1.6)).toBeNull();
    expect(estimatePercentOneRepMax("squat", Number.NaN)).toBeNull();
  });
});

describe("estimateOneRepMaxFromVelocity", () => {
  it("divides the load by the estimated fraction of 1RM", () => {
    // 100 kg moved at 0.6 m/s in the squat = 84.43 %1RM (Sánchez-Medina et al. 2017, from memory) -> 118.4 kg.
    expect(estimateOneRepMaxFromVelocity("squat", 100, 0.6)?.value).toBeCloseTo(118.44, 1);
    expect(estimateOneRepMaxFromVelocity("deadlift", 100, 0.6)).toBeNull();
  });
});

describe("estimateOneRepMaxFromProfile", () => {
  it("extrapolates the athlete's own load-velocity line to the velocity at 1RM", () => {
    // Points on v = 1.23 - 0.01 load; at Helms et al. 2017's 0.23 m/s the load is 100 kg.
    const points = [60, 80, 90].map((loadKg) => ({ loadKg, velocityMps: 1.23 - 0.01 * loadKg }));
    expect(estimateOneRepMaxFromProfile("squat", points)?.value).toBeCloseTo(100, 9);
  });

  it("needs two loads and a falling line", () => {
    expect(estimateOneRepMaxFromProfile("squat", [{ loadKg: 80, velocityMps: 0.5 }, { loadKg: 80, velocityMps: 0.6 }])).toBeNull();
    expect(estimateOneRepMaxFromProfile("squat", [{ loadKg: 60, velocityMps: 0.5 }, { loadKg: 80, velocityMps: 0.6 }])).toBeNull();
  });
});

describe("rep-based 1RM formulas", () => {
  it("Epley 1985: 100 kg × 5 reps = 116.7 kg", () => {
    // 100 × (1 + 5/30) = 116.67 (Epley's formula).
    expect(epleyOneRepMax(100, 5)?.value).toBeCloseTo(116.67, 2);
    expect(epleyOneRepMax(100, 1)?.value).toBe(100);
    expect(epleyOneRepMax(100, 5)?.source).toMatch(/Epley 1985/);
  });

  it("Brzycki 1993: 100 kg × 5 reps = 112.5 kg", () => {
    // 100 × 36 / (37 - 5) = 112.5 (Brzycki's formula).
    expect(brzyckiOneRepMax(100, 5)?.value).toBeCloseTo(112.5, 9);
    expect(brzyckiOneRepMax(100, 1)?.value).toBe(100);
  });

  it("stops past ten reps and rejects nonsense", () => {
    expect(epleyOneRepMax(100, 11)).toBeNull();
    expect(brzyckiOneRepMax(100, 12)).toBeNull();
    expect(() => epleyOneRepMax(-5, 3)).toThrow(/loadKg/);
    expect(() => brzyckiOneRepMax(100, 2.5)).toThrow(/reps/);
  });
});

describe("estimateRepsInReserve", () => {
  it("extends the per-rep slowing to the velocity at 1RM", () => {
    // Bench: 0.05 m/s lost per rep, last rep 0.25 m/s, 1RM velocity 0.10 m/s (Helms et al. 2017): 3 reps left.
    const bench = estimateRepsInReserve("bench", [0.4, 0.35, 0.3, 0.25]);
    expect(bench?.reps).toBe(3);
    expect(bench?.source).toMatch(/Helms et al\. 2017/);
    // Squat: 0.06 m/s per rep, last 0.35 m/s, 1RM velocity 0.23 m/s: 2 reps left.
    expect(estimateRepsInReserve("squat", [0.53, 0.47, 0.41, 0.35])?.reps).toBe(2);
  });

  it("starts from the fastest rep (often the second)", () => {
    // From 0.45 the slope is -0.05 per rep; last 0.30 -> (0.30 - 0.10) / 0.05 = 4.
    expect(estimateRepsInReserve("bench", [0.42, 0.45, 0.4, 0.35, 0.3])?.reps).toBe(4);
  });

  it("says 0 at or below the 1RM velocity and null when it cannot tell", () => {
    expect(estimateRepsInReserve("deadlift", [0.3, 0.2, 0.12])?.reps).toBe(0);
    expect(estimateRepsInReserve("squat", [0.5])).toBeNull();
    expect(estimateRepsInReserve("squat", [0.5, 0.5, 0.51])).toBeNull();
    expect(estimateRepsInReserve("squat", [0.8, 0.79, 0.78])).toBeNull();
  });
});
