// The demo clip renderer's drawing primitives: anti-aliased coverage, segment distance, capsules and
// discs on an RGBA buffer, the gym background and the lifter drawn where the keypoints and bar are.
import { describe, expect, it } from "vitest";
import { JOINT_NAMES, type JointName } from "@/lib/analysis/joints";
import {
  bonesFor,
  coverage,
  createFrame,
  distanceToSegment,
  drawCapsule,
  drawDisc,
  drawLifter,
  gymBackground,
  type FigurePose,
} from "@/dev/demo/stick-figure";

const rgbAt = (frame: ReturnType<typeof createFrame>, x: number, y: number) => {
  const p = 4 * (y * frame.width + x);
  return [frame.data[p], frame.data[p + 1], frame.data[p + 2], frame.data[p + 3]];
};

describe("coverage and distance", () => {
  it("covers a pixel fully inside, not at all outside, and half on the edge", () => {
    expect(coverage(5, 2)).toBe(1);
    expect(coverage(5, 7)).toBe(0);
    expect(coverage(5, 5)).toBe(0.5);
  });

  it("measures to the nearest point of a segment, or to its end beyond it", () => {
    expect(distanceToSegment(5, 3, 0, 0, 10, 0)).toBeCloseTo(3, 12);
    expect(distanceToSegment(13, 4, 0, 0, 10, 0)).toBeCloseTo(5, 12);
    expect(distanceToSegment(1, 1, 2, 2, 2, 2)).toBeCloseTo(Math.SQRT2, 12);
  });
});

describe("drawing", () => {
  it("paints a capsule along its segment and leaves pixels away from it alone", () => {
    const frame = createFrame(40, 20);
    drawCapsule(frame, { x: 5, y: 10 }, { x: 35, y: 10 }, 4, [200, 100, 50]);
    expect(rgbAt(frame, 20, 9)).toEqual([200, 100, 50, 255]);
    expect(rgbAt(frame, 20, 2)).toEqual([0, 0, 0, 255]);
    expect(rgbAt(frame, 39, 10)).toEqual([0, 0, 0, 255]);
  });

  it("gives a disc an area of π r² (anti-aliased edge included)", () => {
    const frame = createFrame(64, 64);
    const r = 20;
    drawDisc(frame, { x: 32, y: 32 }, r, [255, 255, 255]);
    let area = 0;
    for (let i = 0; i < frame.data.length; i += 4) area += frame.data[i] / 255;
    // Area of a circle, π r² (geometry); the 8-bit edge rounding keeps it within a percent.
    expect(area / (Math.PI * r * r)).toBeCloseTo(1, 1);
  });

  it("draws the same background for the same seed, with the floor below the floor line", () => {
    const a = gymBackground(64, 36, 30, 7);
    const b = gymBackground(64, 36, 30, 7);
    expect(Buffer.from(a.data).equals(Buffer.from(b.data))).toBe(true);
    const [r, g, bl] = rgbAt(a, 32, 33);
    expect(r).toBeGreaterThan(bl);
    expect(rgbAt(a, 32, 33)).not.toEqual(rgbAt(a, 32, 10));
  });

  it("names only joints the engine knows for each side, torso first", () => {
    for (const side of ["left", "right"] as const) {
      const bones = bonesFor(side);
      expect(bones[0]).toEqual([`${side}_shoulder`, `${side}_hip`]);
      for (const [a, b] of bones) expect(JOINT_NAMES).toEqual(expect.arrayContaining([a, b]));
    }
  });

  it("puts the plate's hub on the bar and the near leg between hip and knee", () => {
    const frame = createFrame(200, 120);
    const keypoints = Object.fromEntries(JOINT_NAMES.map((name) => [name, { x: 100, y: 60 }])) as FigurePose["keypoints"];
    const place = (joint: string, x: number, y: number) => {
      for (const side of ["left", "right"]) keypoints[`${side}_${joint}` as JointName] = { x, y };
    };
    place("shoulder", 100, 30);
    place("hip", 100, 60);
    place("knee", 100, 85);
    place("ankle", 100, 110);
    drawLifter(frame, { keypoints, bar: { x: 150, y: 30 } }, { nearSide: "left", pxPerM: 60, plateRadiusPx: 12, bench: false });
    expect(rgbAt(frame, 150, 30)).toEqual([210, 210, 214, 255]);
    expect(rgbAt(frame, 100, 72)).toEqual([236, 232, 222, 255]);
    expect(rgbAt(frame, 20, 20)).toEqual([0, 0, 0, 255]);
  });
});
