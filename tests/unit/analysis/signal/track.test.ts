import { describe, expect, it } from "vitest";
import { parseTrack, TrackInputError } from "@/lib/analysis/track";

function validTrack(): Record<string, unknown> & { frames: Record<string, unknown>[] } {
  return {
    version: 1,
    lift: "squat",
    view: "side",
    fps: 30,
    width: 1280,
    height: 720,
    calibration: { plate: { cx: 600, cy: 300, radiusPx: 75 } },
    frames: [
      { t: 0, keypoints: [{ name: "left_knee", x: 610, y: 500, score: 0.9 }], bar: { x: 600, y: 300, score: 1 } },
      { t: 1 / 30, keypoints: [], bar: null },
      { t: 2 / 30, keypoints: [{ name: "left_knee", x: 611, y: 501, score: 0.8 }] },
    ],
  };
}

function errorOf(input: unknown): TrackInputError {
  try {
    parseTrack(input);
  } catch (error) {
    if (error instanceof TrackInputError) return error;
    throw error;
  }
  throw new Error("parseTrack accepted the input");
}

describe("parseTrack accepts", () => {
  it("a valid track, filling the plate diameter and a missing bar", () => {
    const track = parseTrack(validTrack());
    expect(track.calibration).toEqual({ plate: { cx: 600, cy: 300, radiusPx: 75, diameterM: 0.45 } });
    expect(track.frames[2].bar).toBeNull();
    expect(track.frames).toHaveLength(3);
  });

  it("its JSON text", () => {
    expect(parseTrack(JSON.stringify(validTrack())).lift).toBe("squat");
  });

  it("each calibration form", () => {
    expect(parseTrack({ ...validTrack(), calibration: { metresPerPixel: 0.002 } }).calibration).toEqual({ metresPerPixel: 0.002 });
    expect(parseTrack({ ...validTrack(), calibration: { athleteHeightM: 1.75 } }).calibration).toEqual({ athleteHeightM: 1.75 });
  });
});

describe("parseTrack rejects with the path and the problem", () => {
  it("a wrong version", () => {
    expect(errorOf({ ...validTrack(), version: 2 }).message).toMatch(/^version: expected 1/);
  });

  it("empty frames", () => {
    expect(errorOf({ ...validTrack(), frames: [] }).message).toMatch(/^frames: expected at least one frame/);
  });

  it("NaN and Infinity in an already-parsed object (JSON cannot carry them)", () => {
    const track = validTrack();
    track.frames[0] = { t: 0, keypoints: [], bar: { x: Number.NaN, y: 1, score: 1 } };
    expect(errorOf(track).message).toBe("frames[0].bar.x: expected a finite number");
    const infinite = validTrack();
    infinite.frames[2] = { t: 0.1, keypoints: [{ name: "nose", x: 1, y: Number.POSITIVE_INFINITY, score: 1 }] };
    expect(errorOf(infinite).message).toBe("frames[2].keypoints[0].y: expected a finite number");
  });

  it("a track with no bar and no person", () => {
    const track = validTrack();
    track.frames = [{ t: 0, keypoints: [], bar: null }, { t: 0.1, keypoints: [{ name: "left_pinky", x: 1, y: 1, score: 1 }], bar: null }];
    expect(errorOf(track).message).toMatch(/^frames: no frame has a bar position or a recognised keypoint/);
  });

  it("times that repeat, go backwards or are negative", () => {
    const duplicate = validTrack();
    duplicate.frames[2].t = 1 / 30;
    expect(errorOf(duplicate).message).toMatch(/^frames\[2\]\.t: duplicate time/);
    const backwards = validTrack();
    backwards.frames[1].t = 0.5;
    expect(errorOf(backwards).message).toMatch(/^frames\[2\]\.t: time goes backwards/);
    const negative = validTrack();
    negative.frames[0].t = -0.1;
    expect(errorOf(negative).message).toMatch(/^frames\[0\]\.t: expected a time of 0 s or later/);
  });

  it("absurd sizes", () => {
    const frames = Array.from({ length: 200_001 }, (_, i) => ({ t: i / 30, keypoints: [], bar: null }));
    expect(errorOf({ ...validTrack(), frames }).message).toMatch(/^frames: too many frames/);
    expect(errorOf({ ...validTrack(), width: 100_000 }).message).toMatch(/^width: expected at most/);
  });

  it("a bad calibration", () => {
    expect(errorOf({ ...validTrack(), calibration: {} }).message).toMatch(/^calibration: expected exactly one of/);
    expect(errorOf({ ...validTrack(), calibration: { metresPerPixel: 0.002, athleteHeightM: 1.8 } }).message).toMatch(
      /got 2/,
    );
    expect(errorOf({ ...validTrack(), calibration: { plate: { cx: 1, cy: 1, radiusPx: -3 } } }).message).toMatch(
      /^calibration\.plate\.radiusPx: expected a radius/,
    );
  });

  it("wrong kinds of value", () => {
    expect(errorOf({ ...validTrack(), lift: "snatch" }).message).toMatch(/^lift: expected one of squat, bench, deadlift/);
    expect(errorOf(null).message).toBe("track: expected a track object");
    expect(errorOf("{ not json").message).toMatch(/^track: not valid JSON/);
    const badScore = validTrack();
    badScore.frames[0] = { t: 0, keypoints: [{ name: "nose", x: 1, y: 1, score: 3 }] };
    expect(errorOf(badScore).message).toBe("frames[0].keypoints[0].score: expected a score from 0 to 1");
  });

  it("and lists every problem on the error", () => {
    const error = errorOf({ ...validTrack(), version: 3, lift: "curl" });
    expect(error.issues.map((i) => i.path)).toEqual(["version", "lift"]);
    expect(error.message).toMatch(/\(and 1 more problem\)$/);
  });
});
