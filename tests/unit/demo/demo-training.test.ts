// The demo's training plan: loads in the working range, bar speed on each lifter's load–velocity line,
// velocity lost across each set, faults where scripted, and the same plan on every run.
import { describe, expect, it } from "vitest";
import { MINIMUM_VELOCITY_THRESHOLD_MPS } from "@/lib/analysis/references";
import { Prng } from "@/lib/synthetic/prng";
import {
  DEMO_WEEKS,
  pickClipSets,
  planDemoTraining,
  repsPossible,
  repVelocitiesMps,
  VELOCITY_AT_60_PCT_MPS,
  velocityAtMps,
  type DemoLifterInput,
} from "@/dev/demo/demo-training";

const lifters: DemoLifterInput[] = [
  { athleteId: "demo-athlete-tobin", statureM: 1.83, oneRepMaxesKg: { squat: 210, bench: 140, deadlift: 245 } },
  { athleteId: "demo-athlete-noor", statureM: 1.66, oneRepMaxesKg: { squat: 135, bench: 72.5, deadlift: 160 } },
  { athleteId: "someone-else", statureM: 1.7, oneRepMaxesKg: { squat: 100 } },
];

describe("load–velocity line", () => {
  it("runs from the common 60 % speed down to the lift's velocity at 1RM", () => {
    for (const lift of ["squat", "bench", "deadlift"] as const) {
      expect(velocityAtMps(lift, 0.6, 1)).toBeCloseTo(VELOCITY_AT_60_PCT_MPS[lift], 12);
      expect(velocityAtMps(lift, 1, 1)).toBeCloseTo(MINIMUM_VELOCITY_THRESHOLD_MPS[lift].valueMps, 12);
      expect(velocityAtMps(lift, 0.9, 1)).toBeLessThan(velocityAtMps(lift, 0.8, 1));
    }
  });

  it("inverts Epley's formula for the reps possible", () => {
    // Epley 1985 (from memory): 1RM = load × (1 + reps / 30), so 75 % of 1RM allows 10 reps.
    expect(repsPossible(0.75)).toBeCloseTo(10, 12);
  });

  it("slows each set rep by rep, more when near failure", () => {
    const easy = repVelocitiesMps("squat", 0.72, 5, 1, new Prng(1));
    const hard = repVelocitiesMps("squat", 0.9, 3, 1, new Prng(1));
    const loss = (v: number[]) => 1 - v.at(-1)! / v[0];
    expect(easy.at(-1)!).toBeLessThan(easy[0]);
    expect(loss(hard)).toBeGreaterThan(loss(easy));
  });
});

describe("planDemoTraining", () => {
  const plan = planDemoTraining(lifters);

  it("plans only lifters with a style, over eight weeks, with every lift", () => {
    expect(new Set(plan.map((p) => p.athleteId))).toEqual(new Set(["demo-athlete-tobin", "demo-athlete-noor"]));
    expect(new Set(plan.map((p) => p.week)).size).toBe(DEMO_WEEKS);
    expect(plan.map((p) => p.ordinal)).toEqual(plan.map((_, i) => i));
  });

  it("keeps loads at 70–92 % of the known 1RM (give or take the 2.5 kg rounding) with RPE 6–10", () => {
    for (const p of plan) {
      const share = p.loadKg / lifters.find((l) => l.athleteId === p.athleteId)!.oneRepMaxesKg[p.lift]!;
      expect(share).toBeGreaterThan(0.68);
      expect(share).toBeLessThan(0.935);
      expect(p.rpe).toBeGreaterThanOrEqual(6);
      expect(p.rpe).toBeLessThanOrEqual(10);
      expect(p.motion.velocitiesMps).toHaveLength(p.reps);
    }
  });

  it("trains each lift one or two days a week with two to four sets a day", () => {
    for (const athleteId of ["demo-athlete-tobin", "demo-athlete-noor"]) {
      for (const lift of ["squat", "bench", "deadlift"] as const) {
        for (let week = 0; week < DEMO_WEEKS; week++) {
          const mine = plan.filter((p) => p.athleteId === athleteId && p.lift === lift && p.week === week);
          const days = new Set(mine.map((p) => p.daysAgo));
          expect(days.size).toBeGreaterThanOrEqual(1);
          expect(days.size).toBeLessThanOrEqual(2);
          for (const day of days) {
            const count = mine.filter((p) => p.daysAgo === day).length;
            expect(count).toBeGreaterThanOrEqual(2);
            expect(count).toBeLessThanOrEqual(4);
          }
        }
      }
    }
  });

  it("scripts the faults of each lifter's style", () => {
    expect(plan.some((p) => p.athleteId === "demo-athlete-tobin" && p.motion.hipsRiseEarlyReps.length > 0)).toBe(true);
    expect(plan.some((p) => p.athleteId === "demo-athlete-noor" && p.motion.shallowRep !== null)).toBe(true);
  });

  it("is the same plan every time, and picks the newest top sets for clips", () => {
    expect(planDemoTraining(lifters)).toEqual(plan);
    const picked = pickClipSets(plan);
    expect(picked.map((p) => `${p.athleteId} ${p.lift}`)).toEqual(["demo-athlete-tobin squat", "demo-athlete-noor squat", "demo-athlete-noor bench"]);
    for (const p of picked) {
      const newer = plan.filter((q) => q.athleteId === p.athleteId && q.lift === p.lift && q.topSet && q.daysAgo < p.daysAgo);
      expect(newer).toEqual([]);
    }
  });
});
