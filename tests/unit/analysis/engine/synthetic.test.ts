import { describe, expect, it } from "vitest";
import { parseTrack } from "@/lib/analysis/track";
import { generateSyntheticSet } from "@/tests/fixtures/synthetic";
import { Prng } from "@/tests/fixtures/synthetic/prng";

describe("Prng", () => {
  it("repeats a sequence for a seed and differs between seeds", () => {
    const a = new Prng(42);
    const b = new Prng(42);
    const c = new Prng(43);
    const seqA = Array.from({ length: 5 }, () => a.next());
    expect(Array.from({ length: 5 }, () => b.next())).toEqual(seqA);
    expect(Array.from({ length: 5 }, () => c.next())).not.toEqual(seqA);
  });

  it("draws uniform and normal numbers with the right mean and spread", () => {
    const rng = new Prng(7);
    const u = Array.from({ length: 20_000 }, () => rng.next());
    const n = Array.from({ length: 20_000 }, () => rng.normal());
    const mean = (v: number[]) => v.reduce((s, x) => s + x, 0) / v.length;
    // Uniform on [0, 1): mean 1/2, variance 1/12; standard normal: mean 0, variance 1 (textbook moments).
    expect(mean(u)).toBeCloseTo(0.5, 1);
    expect(mean(u.map((x) => (x - 0.5) ** 2))).toBeCloseTo(1 / 12, 2);
    expect(mean(n)).toBeCloseTo(0, 1);
    expect(mean(n.map((x) => x * x))).toBeCloseTo(1, 1);
    expect(Math.min(...u)).toBeGreaterThanOrEqual(0);
    expect(Math.max(...u)).toBeLessThan(1);
  });
});

describe("generateSyntheticSet", () => {
  it("is reproducible from its seed", () => {
    expect(generateSyntheticSet({ lift: "deadlift", seed: 5 })).toEqual(generateSyntheticSet({ lift: "deadlift", seed: 5 }));
  });

  it("writes valid track files with irregular times, dropped frames and the requested keypoint names", () => {
    for (const lift of ["squat", "bench", "deadlift"] as const) {
      const { track } = generateSyntheticSet({ lift, seed: 2, fps: 60, keypointSet: "blazepose" });
      expect(() => parseTrack(track)).not.toThrow();
      const gaps = track.frames.slice(1).map((f, i) => f.t - track.frames[i].t);
      expect(Math.max(...gaps)).toBeGreaterThan(2.5 / 60);
      expect(Math.min(...gaps)).toBeLessThan(0.95 / 60);
      expect(track.frames[10].keypoints.map((k) => k.name)).toContain("left_foot_index");
    }
    const coco = generateSyntheticSet({ lift: "squat", seed: 2, keypointSet: "coco" }).track;
    expect(coco.frames[10].keypoints.map((k) => k.name)).not.toContain("left_heel");
  });

  it("gives a ground truth with reps in order and the planned speed loss", () => {
    const { truth } = generateSyntheticSet({ lift: "squat", seed: 9, reps: 5 });
    expect(truth.reps).toHaveLength(5);
    truth.reps.forEach((r, i) => {
      expect(r.eccentricStartS).toBeLessThan(r.concentricStartS);
      expect(r.concentricStartS).toBeLessThan(r.concentricEndS);
      if (i > 0) expect(r.startS).toBeGreaterThan(truth.reps[i - 1].endS);
      expect(r.meanConcentricVelocityMps).toBeCloseTo(r.romM / (r.concentricEndS - r.concentricStartS), 9);
    });
    expect(truth.reps[4].meanConcentricVelocityMps).toBeLessThan(truth.reps[0].meanConcentricVelocityMps);
  });

  it("draws a straight standing leg and a bent one at the bottom of a squat", () => {
    const { truth } = generateSyntheticSet({ lift: "squat", seed: 4, noise: "none", shallowRep: null });
    for (const r of truth.reps) {
      expect(r.kneeAngleAtStartDeg).toBeCloseTo(180, 6);
      expect(r.kneeAngleAtBottomDeg).toBeLessThan(70);
    }
  });
});
