// Scripted motion in the synthetic generator (what the demo seed drives): given velocities per rep, a
// bar drift, hips rising first, the athlete's stature and frame size, and the noise-free scene that the
// demo clip is drawn from, which must agree with the track.
import { describe, expect, it } from "vitest";
import { analyseTrack } from "@/lib/analysis/analyse";
import { generateSyntheticScene, type SyntheticOptions } from "@/lib/synthetic";

const base: SyntheticOptions = {
  lift: "squat",
  seed: 42,
  view: "side",
  fps: 30,
  reps: 3,
  keypointSet: "blazepose",
  noise: "realistic",
  paused: false,
  shallowRep: null,
  calibration: "plate",
  statureM: 1.75,
  frameWidthPx: 640,
  velocitiesMps: [0.7, 0.62, 0.5],
};

describe("scripted synthetic sets", () => {
  it("moves each rep at its scripted mean velocity, which the engine reads back", () => {
    const scene = generateSyntheticScene(base);
    expect(scene.set.track.width).toBe(640);
    expect(scene.set.truth.statureM).toBe(1.75);
    expect(scene.set.truth.reps.map((r) => r.meanConcentricVelocityMps)).toEqual(base.velocitiesMps!.map((v) => expect.closeTo(v, 9)));
    const result = analyseTrack(scene.set.track);
    // The brief's accuracy target for mean concentric velocity on synthetic clips: 0.03 m/s.
    result.reps.forEach((rep, i) => expect(Math.abs(rep.meanConcentricVelocityMps - base.velocitiesMps![i])).toBeLessThan(0.03));
  });

  it("makes the hips rise first in the scripted reps only, and drifts the bar when asked", () => {
    const hips = analyseTrack(generateSyntheticScene({ ...base, hipsRiseEarlyReps: [3] }).set.track);
    const codes = (rep: number) => hips.reps[rep - 1].flags.map((f) => f.code);
    expect(codes(3)).toContain("hips-rise-first");
    expect(codes(1)).not.toContain("hips-rise-first");
    const drift = analyseTrack(generateSyntheticScene({ ...base, barDriftM: 0.07 }).set.track);
    expect(drift.reps.every((r) => r.flags.some((f) => f.code === "bar-drift"))).toBe(true);
  });

  it("keeps the seed's athlete and camera when the velocities are scripted", () => {
    const drawn = generateSyntheticScene({ ...base, velocitiesMps: undefined });
    const scripted = generateSyntheticScene(base);
    expect(scripted.set.truth.facing).toBe(drawn.set.truth.facing);
    expect(scripted.set.truth.nearSide).toBe(drawn.set.truth.nearSide);
    expect(scripted.pxPerM).toBe(drawn.pxPerM);
    expect(scripted.poseAt(0)).toEqual(drawn.poseAt(0));
  });

  it("draws the scene where the track says the bar and joints are", () => {
    const scene = generateSyntheticScene(base);
    for (const frame of scene.set.track.frames.filter((_, i) => i % 50 === 0)) {
      const pose = scene.poseAt(frame.t);
      if (frame.bar) expect(Math.hypot(frame.bar.x - pose.bar.x, frame.bar.y - pose.bar.y)).toBeLessThan(10);
      const hip = frame.keypoints.find((k) => k.name === `${scene.set.truth.nearSide}_hip`)!;
      expect(Math.hypot(hip.x - pose.keypoints[`${scene.set.truth.nearSide}_hip`].x, hip.y - pose.keypoints[`${scene.set.truth.nearSide}_hip`].y)).toBeLessThan(15);
    }
    expect(scene.durationS).toBeGreaterThan(scene.set.track.frames.at(-1)!.t);
    expect(scene.plateRadiusPx).toBeCloseTo(0.225 * scene.pxPerM, 9);
  });

  it("films only a margin around the reps when asked, with the truth's instants moved to match", () => {
    const whole = generateSyntheticScene(base);
    const cut = generateSyntheticScene({ ...base, marginAroundRepsS: 2 });
    const offsetS = whole.set.truth.reps[0].startS - 2;
    expect(cut.durationS).toBeLessThan(whole.durationS - offsetS);
    expect(cut.set.truth.reps[0].startS).toBeCloseTo(2, 9);
    cut.set.truth.reps.forEach((rep, i) => {
      expect(rep.concentricEndS).toBeCloseTo(whole.set.truth.reps[i].concentricEndS - offsetS, 9);
      expect(rep.meanConcentricVelocityMps).toBeCloseTo(whole.set.truth.reps[i].meanConcentricVelocityMps, 9);
    });
    expect(cut.poseAt(1)).toEqual(whole.poseAt(offsetS + 1));
    const result = analyseTrack(cut.set.track);
    expect(result.reps).toHaveLength(base.reps!);
    result.reps.forEach((rep, i) => expect(Math.abs(rep.meanConcentricVelocityMps - base.velocitiesMps![i])).toBeLessThan(0.03));
  });
});
