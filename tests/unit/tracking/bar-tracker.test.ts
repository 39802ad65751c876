import { describe, expect, it } from "vitest";
import { createBarTracker, FrameInputError, type BarSample } from "@/lib/tracking";
import { plateCamera, type PlateShot } from "./synthetic-frames";

const WIDTH = 640;
const HEIGHT = 360;

/** Tracks a list of shots from a tap on the first one; returns samples and pixel errors. */
function run(shots: PlateShot[], seed = 7) {
  const shoot = plateCamera(WIDTH, HEIGHT, seed);
  const frames = shots.map(shoot);
  const tracker = createBarTracker({ tapX: shots[0].x, tapY: shots[0].y, firstFrame: frames[0], radiusPx: shots[0].radiusPx });
  const samples = frames.map((frame) => tracker.track(frame));
  const errors = samples.map((s, k) => (s ? Math.hypot(s.x - shots[k].x, s.y - shots[k].y) : Number.NaN));
  const scale = tracker.scale;
  tracker.dispose();
  return { samples, errors, scale };
}

function rms(values: number[]): number {
  const finite = values.filter(Number.isFinite);
  return Math.sqrt(finite.reduce((s, v) => s + v * v, 0) / finite.length);
}

function minScore(samples: (BarSample | null)[]): number {
  return Math.min(...samples.map((s) => s?.score ?? 0));
}

describe("createBarTracker", () => {
  it("returns the tap on the first frame with full confidence", () => {
    const { samples, errors } = run([{ x: 250.3, y: 120.8, radiusPx: 40 }]);
    expect(errors[0]).toBeLessThan(0.1);
    expect(samples[0]!.score).toBeGreaterThan(0.99);
  });

  it("follows smooth motion to a fraction of a pixel", () => {
    const shots = Array.from({ length: 90 }, (_, k) => ({
      x: 300 + 40 * Math.sin((2 * Math.PI * k) / 60),
      y: 110 + 70 * (1 - Math.cos((2 * Math.PI * k) / 45)),
      radiusPx: 40,
    }));
    const { samples, errors, scale } = run(shots);
    expect(errors.every(Number.isFinite)).toBe(true);
    expect(rms(errors)).toBeLessThan(0.25);
    expect(Math.abs(scale - 1)).toBeLessThan(0.02);
    expect(minScore(samples)).toBeGreaterThan(0.9);
  });

  it("ignores a change of lighting", () => {
    const gain = (k: number) => (k < 20 ? 1 : k < 40 ? 1 - (0.45 * (k - 20)) / 20 : k < 70 ? 0.55 + (0.75 * (k - 40)) / 30 : 1.3);
    const shots = Array.from({ length: 80 }, (_, k) => ({ x: 200 + 1.5 * k, y: 180 - k, radiusPx: 36, gain: gain(k) }));
    const { samples, errors } = run(shots);
    expect(Math.max(...errors)).toBeLessThan(0.5);
    expect(minScore(samples)).toBeGreaterThan(0.9);
  });

  it("keeps the centre when the plate grows by a quarter (camera moving closer)", () => {
    const shots = Array.from({ length: 80 }, (_, k) => ({ x: 320 - 0.8 * k, y: 120 + 1.2 * k, radiusPx: 40 * (1 + (0.25 * k) / 79) }));
    const { samples, errors, scale } = run(shots);
    expect(samples.every((s) => s !== null)).toBe(true);
    expect(Math.max(...errors)).toBeLessThan(1);
    expect(scale).toBeGreaterThan(1.2);
    expect(scale).toBeLessThan(1.3);
  });

  it("drops confidence while a passer-by covers the plate, then re-acquires it", () => {
    const radiusPx = 40;
    const plate = (k: number) => ({ x: 300 + 1.5 * k, y: 100 + 3 * k });
    // A band 3.2 radii wide sweeps across the plate, covering it whole around frame 30.
    const shots = Array.from({ length: 50 }, (_, k) => ({
      ...plate(k),
      radiusPx,
      occluder: { centreX: plate(30).x + 30 * (k - 30), halfWidthPx: 1.6 * radiusPx },
    }));
    const { samples, errors } = run(shots);
    const covered = samples.slice(29, 32);
    expect(covered.every((s) => s === null || s.score < 0.5)).toBe(true);
    expect(samples.slice(0, 24).every((s) => s !== null && s.score > 0.9)).toBe(true);
    const after = errors.slice(38);
    expect(after.every((e) => e < 0.5)).toBe(true);
    expect(minScore(samples.slice(38))).toBeGreaterThan(0.9);
  });

  it("does not jump to the background while the plate is hidden", () => {
    const radiusPx = 40;
    const shots = Array.from({ length: 40 }, (_, k) => ({
      x: 320,
      y: 160,
      radiusPx,
      occluder: k >= 10 && k < 20 ? { centreX: 320, halfWidthPx: 2 * radiusPx } : null,
    }));
    const { samples, errors } = run(shots);
    samples.slice(10, 20).forEach((s, k) => {
      if (s) expect(errors[10 + k]).toBeLessThan(2);
    });
    expect(samples.slice(10, 20).filter((s) => s === null).length).toBeGreaterThan(5);
    expect(errors.slice(21).every((e) => e < 0.5)).toBe(true);
  });

  it("rejects bad input with a clear message", () => {
    const shoot = plateCamera(WIDTH, HEIGHT);
    const first = shoot({ x: 300, y: 150, radiusPx: 40 });
    expect(() => createBarTracker({ tapX: 700, tapY: 10, firstFrame: first })).toThrow(/outside the 640x360 frame/);
    expect(() => createBarTracker({ tapX: 5, tapY: 5, firstFrame: first, radiusPx: 40 })).toThrow(/inside the frame/);
    expect(() => createBarTracker({ tapX: 300, tapY: 150, firstFrame: first, radiusPx: -3 })).toThrow(FrameInputError);
    const flat = { width: 64, height: 64, data: new Uint8Array(64 * 64 * 4).fill(90) };
    expect(() => createBarTracker({ tapX: 32, tapY: 32, firstFrame: flat, radiusPx: 10 })).toThrow(/flat/);
    const tracker = createBarTracker({ tapX: 300, tapY: 150, firstFrame: first, radiusPx: 40 });
    expect(() => tracker.track({ width: 320, height: 180, data: new Uint8Array(320 * 180 * 4) })).toThrow(/expected 640x360/);
    tracker.dispose();
    expect(() => tracker.track(first)).toThrow(/dispose/);
  });

  it("finds the plate radius itself when none is given", () => {
    const shoot = plateCamera(WIDTH, HEIGHT);
    const tracker = createBarTracker({ tapX: 301, tapY: 149, firstFrame: shoot({ x: 300, y: 150, radiusPx: 38 }) });
    expect(Math.abs(tracker.radiusPx - 38)).toBeLessThan(0.8);
  });
});
