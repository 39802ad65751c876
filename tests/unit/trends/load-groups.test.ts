// Grouping sets by load for the speed-at-load chart.
import { describe, expect, it } from "vitest";
import { groupByLoad, rampStep } from "@/lib/trends/load-groups";

const kg = { mass: "kg", length: "metric" } as const;
const lb = { mass: "lb", length: "imperial" } as const;

describe("groupByLoad", () => {
  it("merges loads within a plate step and keeps the most frequent, lightest first", () => {
    const points = [100, 101, 100, 140, 140, 140, 120, 160].map((loadKg, i) => ({ loadKg, i }));
    const groups = groupByLoad(points, kg, 3);
    expect(groups.map((g) => g.load)).toEqual([100, 140, 160]);
    expect(groups[0].points.map((p) => p.i)).toEqual([0, 1, 2]);
  });

  it("groups in pounds for lb readers (1 lb = 0.45359237 kg, 1959 agreement)", () => {
    // 102.06 kg = 225.0 lb; 100 kg = 220.46 lb, rounded to the 5 lb step: 220.
    const groups = groupByLoad([{ loadKg: 102.0582 }, { loadKg: 100 }], lb, 4);
    expect(groups.map((g) => g.load)).toEqual([220, 225]);
  });
});

describe("rampStep", () => {
  it("spreads groups from step 3 to 8", () => {
    expect([0, 1, 2, 3].map((i) => rampStep(i, 4))).toEqual([3, 5, 6, 8]);
    expect(rampStep(0, 1)).toBe(6);
  });
});
