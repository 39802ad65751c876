import { describe, expect, it } from "vitest";
import { detectReps, turningPoints } from "@/lib/analysis/reps";

const RATE_HZ = 100;

/** A bar height made of scripted moves (half-sine velocity, as a lifted bar speeds up and slows down) and holds. */
function script(steps: ({ hold: number } | { move: number; by: number })[]) {
  const t: number[] = [];
  const y: number[] = [];
  const v: number[] = [];
  const edges: number[] = [];
  let level = 0;
  let now = 0;
  for (const step of steps) {
    const duration = "hold" in step ? step.hold : step.move;
    const n = Math.round(duration * RATE_HZ);
    for (let i = 0; i < n; i++) {
      const tau = i / n;
      t.push(now + i / RATE_HZ);
      if ("hold" in step) {
        y.push(level);
        v.push(0);
      } else {
        y.push(level + (step.by * (1 - Math.cos(Math.PI * tau))) / 2);
        v.push(((step.by * Math.PI) / (2 * step.move)) * Math.sin(Math.PI * tau));
      }
    }
    if ("move" in step) {
      edges.push(now, now + duration);
      level += step.by;
    }
    now += duration;
  }
  return { t, y, v, edges };
}

describe("turningPoints", () => {
  it("keeps swings of at least the hysteresis and ignores smaller wiggles", () => {
    const y = [0, 1, 0.9, 1.05, 0, 0.1, 0.02, 1, 1];
    expect(turningPoints(y, 0.5)).toEqual([
      { i: 0, kind: "min" },
      { i: 3, kind: "max" },
      { i: 4, kind: "min" },
      { i: 7, kind: "max" },
    ]);
  });
});

describe("detectReps", () => {
  it("finds squat reps from the top and ignores the un-rack, breathing bobs and a re-rack dip", () => {
    const { t, y, v, edges } = script([
      { hold: 1 },
      { move: 0.6, by: 0.05 }, // un-rack
      { hold: 1 },
      { move: 0.8, by: -0.02 }, // breathing bob
      { move: 0.8, by: 0.02 },
      { hold: 0.5 },
      { move: 1.2, by: -0.5 }, // rep 1
      { move: 0.8, by: 0.5 },
      { hold: 0.8 },
      { move: 1.2, by: -0.5 }, // rep 2, paused
      { hold: 0.7 },
      { move: 0.9, by: 0.5 },
      { hold: 0.8 },
      { move: 1.3, by: -0.3 }, // rep 3, shallow
      { move: 0.8, by: 0.3 },
      { hold: 1 },
      { move: 0.6, by: -0.06 }, // re-rack
      { hold: 1 },
    ]);
    const reps = detectReps("squat", t, y, v, y);
    expect(reps).toHaveLength(3);
    const [rep1, rep2, rep3] = reps;
    // Each move adds its start and end: un-rack 0-1, bob 2-5, rep 1 lowering 6-7 and drive 8-9, rep 2 10-13.
    expect(rep1.eccentricStartS).toBeCloseTo(edges[6], 1);
    expect(rep1.concentricStartS).toBeCloseTo(edges[8], 1);
    expect(rep1.concentricEndS).toBeCloseTo(edges[9], 1);
    expect(rep2.pauseDurationS).toBeCloseTo(0.7, 1);
    expect(rep2.concentricStartS).toBeCloseTo(edges[12], 1);
    expect(rep3.concentricEndS - rep3.concentricStartS).toBeCloseTo(0.8, 1);
  });

  it("does not count an excursion far smaller than the set's reps", () => {
    const { t, y, v } = script([
      { hold: 1 },
      { move: 1, by: -0.5 },
      { move: 0.8, by: 0.5 },
      { hold: 1 },
      { move: 0.5, by: -0.12 }, // a quarter squat while settling: under 35 % of the real reps
      { move: 0.5, by: 0.12 },
      { hold: 1 },
      { move: 1, by: -0.5 },
      { move: 0.8, by: 0.5 },
      { hold: 1 },
    ]);
    expect(detectReps("squat", t, y, v, y)).toHaveLength(2);
  });

  it("starts deadlift reps on the floor and times the dead stop between them", () => {
    const { t, y, v, edges } = script([
      { hold: 1.5 },
      { move: 1.1, by: 0.6 },
      { hold: 0.6 },
      { move: 1.0, by: -0.6 },
      { hold: 1.2 },
      { move: 1.2, by: 0.6 },
      { hold: 0.5 },
      { move: 1.0, by: -0.6 },
      { hold: 1 },
    ]);
    const reps = detectReps("deadlift", t, y, v, y);
    expect(reps).toHaveLength(2);
    expect(reps[0].startS).toBeCloseTo(edges[0], 1);
    expect(reps[0].concentricEndS).toBeCloseTo(edges[1], 1);
    expect(reps[0].endS).toBeCloseTo(edges[3], 1);
    expect(reps[0].pauseDurationS).toBeNull();
    expect(reps[1].pauseDurationS).toBeCloseTo(1.2, 1);
    expect(reps[1].bottomS).toBe(reps[1].concentricStartS);
  });

  it("finds nothing in a bar that only moves sideways or bobs", () => {
    const { t, y, v } = script([{ hold: 1 }, { move: 0.7, by: -0.03 }, { move: 0.7, by: 0.03 }, { hold: 1 }]);
    expect(detectReps("bench", t, y, v, y)).toEqual([]);
  });
});
