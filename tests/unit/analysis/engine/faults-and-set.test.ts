import { describe, expect, it } from "vitest";
import { analyseTrack } from "@/lib/analysis/analyse";
import { DEFAULT_FAULT_THRESHOLDS, FAULT_CODES } from "@/lib/analysis/faults";
import { analysisResultSchema, SERIES_POINTS } from "@/lib/analysis/result";
import { parseTrack } from "@/lib/analysis/track";
import { generateSyntheticSet, type SyntheticOptions } from "@/tests/fixtures/synthetic";

function analyse(options: SyntheticOptions, analysisOptions: Parameters<typeof analyseTrack>[1] = {}) {
  const set = generateSyntheticSet(options);
  return { set, result: analyseTrack(parseTrack(set.track), analysisOptions) };
}

const codes = (flags: { code: string }[]) => flags.map((f) => f.code);

describe("fault thresholds", () => {
  it("give every threshold a unit, a rule and a source", () => {
    for (const code of FAULT_CODES) {
      const t = DEFAULT_FAULT_THRESHOLDS[code];
      expect(Number.isFinite(t.value)).toBe(true);
      expect(t.unit.length).toBeGreaterThan(0);
      expect(t.rule.length).toBeGreaterThan(0);
      expect(t.source.length).toBeGreaterThan(0);
    }
  });
});

describe("rep flags", () => {
  it("counts a shallow squat and flags it as shallow and short of depth", () => {
    const { set, result } = analyse({ lift: "squat", seed: 3, reps: 4, shallowRep: 2, paused: false });
    expect(result.reps).toHaveLength(4);
    expect(codes(result.reps[1].flags)).toEqual(expect.arrayContaining(["shallow-rep", "depth-not-reached"]));
    result.reps.forEach((r, i) => {
      if (i !== 1) expect(codes(r.flags)).not.toContain("shallow-rep");
      if (set.truth.reps[i].depthMarginCm > 3) expect(codes(r.flags)).not.toContain("depth-not-reached");
    });
    const shallow = result.reps[1].flags.find((f) => f.code === "shallow-rep")!;
    expect(shallow.rep).toBe(2);
    expect(shallow.threshold).toBe(DEFAULT_FAULT_THRESHOLDS["shallow-rep"].value);
    expect(shallow.value).toBeLessThan(shallow.threshold);
    expect(shallow.source).toBe("common practice");
  });

  it("flags knees caving in from the front only on the side that caves", () => {
    // The model's left knee ends 16 cm inside the hip–ankle line at the bottom.
    const caving = analyse({ lift: "squat", view: "front", seed: 5, kneeValgusM: { left: 0.16, right: 0 }, shallowRep: null });
    for (const r of caving.result.reps) {
      const flag = r.flags.find((f) => f.code === "knees-inside-feet");
      expect(flag?.message).toContain("left knee");
      expect(r.kneeProjectionAngleLeftDeg!).toBeGreaterThan(r.kneeProjectionAngleRightDeg!);
    }
    const straight = analyse({ lift: "squat", view: "front", seed: 5, kneeValgusM: { left: 0, right: 0 }, shallowRep: null });
    for (const r of straight.result.reps) expect(codes(r.flags)).not.toContain("knees-inside-feet");
  });
});

describe("set measures", () => {
  it("reports velocity loss from the best rep to the last, as in the model", () => {
    for (const seed of [1, 2, 3]) {
      const { set, result } = analyse({ lift: "bench", seed });
      const truth = set.truth.reps.map((r) => r.meanConcentricVelocityMps);
      const best = Math.max(...truth);
      const lossPct = (100 * (best - truth[truth.length - 1])) / best;
      expect(result.set.velocityLossPct!).toBeCloseTo(lossPct, -1);
      expect(result.set.repCount).toBe(truth.length);
      expect(result.set.bestMeanVelocityMps).toBe(Math.max(...result.reps.map((r) => r.meanConcentricVelocityMps)));
      expect(result.set.lastMeanVelocityMps).toBe(result.reps[result.reps.length - 1].meanConcentricVelocityMps);
    }
  });

  it("flags velocity loss past the threshold, and a team's own threshold says so", () => {
    const { result } = analyse({ lift: "squat", seed: 1 }, { thresholds: { "velocity-loss": 1 } });
    const flag = result.set.flags.find((f) => f.code === "velocity-loss")!;
    expect(flag.threshold).toBe(1);
    expect(flag.rep).toBeNull();
    expect(flag.source).toMatch(/^team setting \(default 20 %/);
    expect(result.settings.thresholds["velocity-loss"].value).toBe(1);
    const lenient = analyse({ lift: "squat", seed: 1 }, { thresholds: { "velocity-loss": 99 } });
    expect(codes(lenient.result.set.flags)).not.toContain("velocity-loss");
  });

  it("estimates 1RM from the load with Epley and Brzycki as cross-checks", () => {
    const loadKg = 120;
    const { result } = analyse({ lift: "squat", seed: 2, reps: 3 }, { loadKg });
    const e = result.set.estimatedOneRepMaxKg!;
    const reps = e.repsCounted;
    expect(reps).toBe(result.set.repCount + (result.set.estimatedRepsInReserve?.reps ?? 0));
    if (reps <= 10) {
      // Epley (1985): 1RM = load × (1 + reps / 30); Brzycki (1993): 1RM = load × 36 / (37 − reps) (from memory).
      expect(e.epley!.valueKg).toBeCloseTo(loadKg * (1 + reps / 30), 6);
      expect(e.brzycki!.valueKg).toBeCloseTo((loadKg * 36) / (37 - reps), 6);
    } else {
      expect(e.epley).toBeNull();
    }
    const percent = result.set.estimatedPercentOneRepMax;
    if (percent) expect(e.fromVelocity!.valueKg).toBeCloseTo((loadKg * 100) / percent.percent, 6);
    expect(analyse({ lift: "squat", seed: 2, reps: 3 }).result.set.estimatedOneRepMaxKg).toBeNull();
  });

  it("quotes a source with every published estimate", () => {
    const { result } = analyse({ lift: "squat", seed: 4 });
    const { estimatedRepsInReserve, estimatedPercentOneRepMax } = result.set;
    for (const estimate of [estimatedRepsInReserve, estimatedPercentOneRepMax]) {
      if (estimate) expect(estimate.source.length).toBeGreaterThan(10);
    }
    expect(estimatedPercentOneRepMax?.velocityMps ?? result.set.bestMeanVelocityMps).toBe(result.set.bestMeanVelocityMps);
  });
});

describe("the result", () => {
  it("matches its schema, with 101-point series per rep starting at the rep's start", () => {
    const { result } = analyse({ lift: "deadlift", seed: 6 });
    expect(() => analysisResultSchema.parse(result)).not.toThrow();
    for (const r of result.reps) {
      expect(r.series.pct).toHaveLength(SERIES_POINTS);
      expect(r.series.pct[0]).toBe(0);
      expect(r.series.pct[SERIES_POINTS - 1]).toBe(100);
      expect(r.series.barYM![0]).toBeCloseTo(0, 9);
      expect(Math.max(...r.series.barYM!)).toBeCloseTo(r.romM, 1);
      expect(r.series.kneeAngleDeg).toHaveLength(SERIES_POINTS);
    }
  });

  it("carries the cautions and says depth is approximated from keypoints", () => {
    const { result } = analyse({ lift: "squat", seed: 8 });
    expect(result.cautions.join(" ")).toMatch(/not medical advice/);
    expect(result.cautions.join(" ")).toMatch(/pain.*licensed/);
    expect(result.cautions.join(" ")).toMatch(/spinal flexion/);
    expect(result.notes.join(" ")).toMatch(/approximation/);
  });

  it("measures horizontal distances toward the athlete's feet whichever way they face", () => {
    const runs = [1, 2, 3, 4, 5, 6].map((seed) => analyse({ lift: "squat", seed }));
    expect(new Set(runs.map((r) => r.set.truth.facing)).size).toBe(2);
    for (const { set, result } of runs) {
      expect(result.settings.horizontalAxis).toBe("toward-feet");
      result.reps.forEach((r, i) => expect(r.netHorizontalDriftCm).toBeCloseTo(set.truth.reps[i].netHorizontalDriftCm, -0.3));
    }
  });

  it("includes the smoothed bar trace in image pixels only when asked", () => {
    const plain = analyse({ lift: "bench", seed: 9 });
    expect(plain.result.frames).toBeUndefined();
    const { set, result } = analyse({ lift: "bench", seed: 9 }, { includeFrames: true });
    const frames = result.frames!;
    expect(frames.length).toBeGreaterThan(set.track.frames.length * 0.9);
    const first = set.track.frames.find((f) => f.bar)!;
    const near = frames.find((f) => f.bar && Math.abs(f.t - first.t) < 0.02)!;
    expect(Math.hypot(near.bar!.x - first.bar!.x, near.bar!.y - first.bar!.y)).toBeLessThan(5);
  });
});
