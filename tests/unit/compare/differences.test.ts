// The difference table: each rep against the first, flagged past the (editable) threshold.
import { describe, expect, it } from "vitest";
import { COMPARE_MEASURES, defaultThresholds, differenceTable, type RepMeasures } from "@/lib/compare/differences";
import { kindDisplay } from "@/lib/compare/units";

function measures(values: Partial<RepMeasures>): RepMeasures {
  return { ...(Object.fromEntries(COMPARE_MEASURES.map((m) => [m.key, null])) as RepMeasures), ...values };
}

describe("differenceTable", () => {
  const first = measures({ meanConcentricVelocityMps: 0.5, torsoAngleAtStartDeg: 40, maxHorizontalDeviationCm: 3 });
  const last = measures({ meanConcentricVelocityMps: 0.38, torsoAngleAtStartDeg: 43, maxHorizontalDeviationCm: null });

  it("lists measures some rep has, with differences against the first rep", () => {
    const rows = differenceTable([first, last], defaultThresholds());
    expect(rows.map((r) => r.measure.key)).toEqual(["meanConcentricVelocityMps", "maxHorizontalDeviationCm", "torsoAngleAtStartDeg"]);
    const speed = rows[0];
    expect(speed.reference).toBe(0.5);
    expect(speed.others[0].difference).toBeCloseTo(-0.12, 12);
    expect(speed.others[0].pastThreshold).toBe(true);
    expect(rows[1].others[0]).toEqual({ value: null, difference: null, pastThreshold: false });
    expect(rows[2].others[0].pastThreshold).toBe(false);
  });

  it("uses the thresholds it is given", () => {
    const rows = differenceTable([first, last], { ...defaultThresholds(), torsoAngleAtStartDeg: 2, meanConcentricVelocityMps: 0.2 });
    expect(rows[0].others[0].pastThreshold).toBe(false);
    expect(rows[2].others[0].pastThreshold).toBe(true);
  });

  it("states where every default threshold comes from", () => {
    for (const m of COMPARE_MEASURES) expect(m.thresholdSource).toMatch(/common practice|et al\.|\d{4}/);
  });

  it("converts lengths for imperial readers (1 in = 2.54 cm exactly, 1959 agreement)", () => {
    expect(kindDisplay("lengthCm", { mass: "lb", length: "imperial" }).factor * 2.54).toBeCloseTo(1, 12);
    expect(kindDisplay("lengthM", { mass: "kg", length: "metric" }).factor).toBe(100);
  });
});
