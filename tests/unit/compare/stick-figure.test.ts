// Stick figures from a stored track: the frame nearest a time, keypoints in metres with the feet at the
// origin, low-confidence points left out. The track is synthetic with a known scale and known rep times.
import { describe, expect, it } from "vitest";
import { nearestFrameIndex, stickFigureAt } from "@/lib/compare/stick-figure";
import { parseTrack } from "@/lib/analysis/track";
import { generateSyntheticSet } from "@/tests/fixtures/synthetic";

describe("nearestFrameIndex", () => {
  it("picks the closest time, the earlier one on a tie", () => {
    const times = [0, 0.1, 0.2, 0.3];
    expect(nearestFrameIndex(times, -1)).toBe(0);
    expect(nearestFrameIndex(times, 0.14)).toBe(1);
    expect(nearestFrameIndex(times, 0.16)).toBe(2);
    expect(nearestFrameIndex(times, 0.25)).toBe(2);
    expect(nearestFrameIndex(times, 9)).toBe(3);
  });
});

describe("stickFigureAt", () => {
  const { track, truth } = generateSyntheticSet({ lift: "squat", seed: 5, reps: 2, view: "side", noise: "none", keypointSet: "coco" });
  const parsed = parseTrack(track);
  const rep = truth.reps[0];

  it("puts the feet at the origin and scales to metres", () => {
    const start = stickFigureAt(parsed, rep.startS, truth.metresPerPixel);
    if (!start) throw new Error("no figure");
    const ankles = [start.left_ankle, start.right_ankle].filter((a) => a !== undefined);
    expect(ankles.length).toBeGreaterThan(0);
    expect(ankles.reduce((s, a) => s + a.yM, 0) / ankles.length).toBeCloseTo(0, 9);
    // Standing at the start: shoulder height is about 0.82 of stature (Drillis & Contini 1966 segment
    // proportions, from memory); the bounds here are deliberately wide.
    const shoulder = start.left_shoulder ?? start.right_shoulder;
    expect(shoulder?.yM).toBeGreaterThan(0.55 * truth.statureM);
    expect(shoulder?.yM).toBeLessThan(truth.statureM);
  });

  it("shows the hips lower at the bottom than at the start", () => {
    const hipHeight = (t: number) => {
      const f = stickFigureAt(parsed, t, truth.metresPerPixel);
      const hip = f?.left_hip ?? f?.right_hip;
      if (!hip) throw new Error("no hip");
      return hip.yM;
    };
    expect(hipHeight(rep.bottomS)).toBeLessThan(hipHeight(rep.startS) - 0.2);
  });

  it("leaves out unsure keypoints and gives up without the feet", () => {
    const frame = { t: 0, bar: null, keypoints: [{ name: "left_ankle", x: 100, y: 500, score: 0.9 }, { name: "left_knee", x: 110, y: 400, score: 0.1 }] };
    const figure = stickFigureAt({ frames: [frame] }, 0, 0.002);
    expect(figure).toEqual({ left_ankle: { xM: 0, yM: 0 } });
    expect(stickFigureAt({ frames: [{ ...frame, keypoints: [frame.keypoints[1]] }] }, 0, 0.002)).toBeNull();
    expect(stickFigureAt({ frames: [] }, 0, 0.002)).toBeNull();
  });
});
