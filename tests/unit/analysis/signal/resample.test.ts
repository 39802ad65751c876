import { describe, expect, it } from "vitest";
import { resampleTrack } from "@/lib/analysis/resample";
import { parseTrack, type Track } from "@/lib/analysis/track";

type FrameInput = { t: number; bar?: { x: number; y: number; score: number } | null; keypoints?: { name: string; x: number; y: number; score: number }[] };

function makeTrack(frames: FrameInput[]): Track {
  return parseTrack({
    version: 1,
    lift: "squat",
    view: "side",
    fps: 30,
    width: 1280,
    height: 720,
    calibration: { metresPerPixel: 0.002 },
    frames: frames.map((f) => ({ keypoints: [], bar: null, ...f })),
  });
}

/** A bar moving in a straight line: x = 100 + 300 t, y = 400 - 150 t (pixels). */
const linearBar = (t: number) => ({ x: 100 + 300 * t, y: 400 - 150 * t, score: 0.9 });
const at30Hz = (count: number) => Array.from({ length: count }, (_, i) => i / 30);

describe("resampleTrack", () => {
  it("puts irregular phone frame times onto a uniform grid at the median rate", () => {
    const times = [0, 0.031, 0.067, 0.1, 0.129, 0.167, 0.2, 0.233, 0.27, 0.3];
    const uniform = resampleTrack(makeTrack(times.map((t) => ({ t, bar: linearBar(t) }))));
    expect(uniform.sampleRateHz).toBe(30);
    expect(uniform.times).toHaveLength(10);
    uniform.times.forEach((t, i) => {
      expect(t).toBeCloseTo(i / 30, 12);
      expect(uniform.bar.x[i]).toBeCloseTo(linearBar(t).x, 9);
      expect(uniform.bar.y[i]).toBeCloseTo(linearBar(t).y, 9);
    });
    expect(uniform.bar.valid.every(Boolean)).toBe(true);
  });

  it("honours a requested sample rate", () => {
    const uniform = resampleTrack(makeTrack(at30Hz(31).map((t) => ({ t, bar: linearBar(t) }))), { sampleRateHz: 100 });
    expect(uniform.times).toHaveLength(101);
    expect(uniform.bar.x[50]).toBeCloseTo(linearBar(0.5).x, 9);
  });

  it("bridges dropped frames and keeps them valid", () => {
    const times = at30Hz(20).filter((_, i) => i !== 7 && i !== 8 && i !== 12);
    const uniform = resampleTrack(makeTrack(times.map((t) => ({ t, bar: linearBar(t) }))));
    expect(uniform.times).toHaveLength(20);
    expect(uniform.bar.valid.every(Boolean)).toBe(true);
    expect(uniform.bar.x[8]).toBeCloseTo(linearBar(8 / 30).x, 9);
  });

  it("treats low-score and missing keypoints as gaps", () => {
    const frames = at30Hz(10).map((t, i) => ({
      t,
      bar: linearBar(t),
      keypoints: i === 4 ? [{ name: "left_knee", x: 999, y: 999, score: 0.1 }] : i === 5 ? [] : [{ name: "left_knee", x: 10 * i, y: 50, score: 0.8 }],
    }));
    const knee = resampleTrack(makeTrack(frames)).joints.left_knee!;
    expect(knee.x[4]).toBeCloseTo(40, 9);
    expect(knee.x[5]).toBeCloseTo(50, 9);
    expect(knee.valid.every(Boolean)).toBe(true);
  });

  it("uses the higher score when a frame names a joint twice, and maps other spellings", () => {
    const frames = at30Hz(3).map((t) => ({
      t,
      keypoints: [
        { name: "leftHip", x: 1, y: 1, score: 0.5 },
        { name: "left_hip", x: 2, y: 2, score: 0.9 },
      ],
    }));
    expect(resampleTrack(makeTrack(frames)).joints.left_hip!.x).toEqual([2, 2, 2]);
  });

  it("rejects a single-frame outlier before interpolating", () => {
    const frames = at30Hz(15).map((t, i) => ({ t, bar: i === 7 ? { x: 700, y: 100, score: 0.95 } : linearBar(t) }));
    const uniform = resampleTrack(makeTrack(frames));
    expect(uniform.bar.x[7]).toBeCloseTo(linearBar(7 / 30).x, 9);
    expect(uniform.bar.y[7]).toBeCloseTo(linearBar(7 / 30).y, 9);
    expect(uniform.bar.valid[7]).toBe(true);
  });

  it("keeps a sharp turnaround (a bounce at the bottom is not an outlier)", () => {
    // 11 px a frame down then up: about 1 m/s at 330 px/m and 30 fps.
    const frames = at30Hz(15).map((t, i) => ({ t, bar: { x: 300, y: 500 - 11 * Math.abs(i - 7), score: 0.9 } }));
    const uniform = resampleTrack(makeTrack(frames));
    expect(uniform.bar.y[7]).toBe(500);
  });

  it("marks a long missing stretch invalid but still fills it without NaN", () => {
    // Bar lost from 0.3 s to 0.8 s (a 0.53 s span between kept samples, above the 0.25 s default).
    const frames = at30Hz(31).map((t, i) => ({ t, bar: i > 9 && i < 24 ? null : linearBar(t) }));
    const uniform = resampleTrack(makeTrack(frames));
    expect(uniform.bar.valid.slice(10, 24).every((v) => !v)).toBe(true);
    expect(uniform.bar.valid[9] && uniform.bar.valid[24]).toBe(true);
    expect(uniform.bar.x.every(Number.isFinite)).toBe(true);
    expect(uniform.bar.x[16]).toBeCloseTo(linearBar(16 / 30).x, 9);
  });

  it("fills a short missing stretch as valid, and the limit is maxGapS", () => {
    // Frames 10..14 missing: the kept samples around them are 0.2 s apart.
    const frames = at30Hz(31).map((t, i) => ({ t, bar: i >= 10 && i <= 14 ? null : linearBar(t) }));
    expect(resampleTrack(makeTrack(frames)).bar.valid.every(Boolean)).toBe(true);
    expect(resampleTrack(makeTrack(frames), { maxGapS: 0.15 }).bar.valid.slice(10, 15).some(Boolean)).toBe(false);
  });

  it("holds values outside the seen span and marks them invalid", () => {
    const frames = at30Hz(10).map((t, i) => ({ t, bar: i < 3 ? null : linearBar(t) }));
    const bar = resampleTrack(makeTrack(frames)).bar;
    expect(bar.valid.slice(0, 3)).toEqual([false, false, false]);
    expect(bar.x[0]).toBeCloseTo(linearBar(0.1).x, 9);
  });

  it("gives an all-invalid bar when it is never seen and leaves unseen joints out", () => {
    const frames = at30Hz(5).map((t) => ({ t, keypoints: [{ name: "nose", x: 5, y: 5, score: 0.9 }, { name: "left_ankle", x: 1, y: 1, score: 0.05 }] }));
    const uniform = resampleTrack(makeTrack(frames));
    expect(uniform.bar).toEqual({ x: [0, 0, 0, 0, 0], y: [0, 0, 0, 0, 0], valid: [false, false, false, false, false] });
    expect(Object.keys(uniform.joints)).toEqual(["nose"]);
  });

  it("uses the track's fps for a single frame", () => {
    const uniform = resampleTrack(makeTrack([{ t: 2, bar: linearBar(0) }]));
    expect(uniform).toMatchObject({ sampleRateHz: 30, times: [2], bar: { valid: [true] } });
  });
});
