import { describe, expect, it } from "vitest";
import { buildPyramid, grayRegion, halve, sampleGray, toFrameX, toImageX } from "@/lib/tracking/pyramid";
import type { RgbaFrame } from "@/lib/tracking/frame";

/** A frame whose pixel (x, y) is pure grey with value 10 * x + y. */
function rampFrame(width: number, height: number): RgbaFrame {
  const data = new Uint8Array(width * height * 4);
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      const i = (y * width + x) * 4;
      data.fill(10 * x + y, i, i + 3);
      data[i + 3] = 255;
    }
  }
  return { width, height, data };
}

describe("grayRegion", () => {
  it("converts with the ITU-R BT.601 luma weights", () => {
    // BT.601: Y = 0.299 R + 0.587 G + 0.114 B.
    const frame: RgbaFrame = { width: 1, height: 1, data: Uint8Array.from([200, 100, 50, 255]) };
    const gray = grayRegion(frame, { x: 0, y: 0, width: 1, height: 1 }, 1);
    expect(gray.data[0]).toBeCloseTo(0.299 * 200 + 0.587 * 100 + 0.114 * 50, 4);
  });

  it("averages factor x factor blocks of the requested region", () => {
    const gray = grayRegion(rampFrame(8, 6), { x: 2, y: 1, width: 4, height: 4 }, 2);
    expect(gray.width).toBe(2);
    expect(gray.height).toBe(2);
    // Block x 2..3, y 1..2: mean of 10x + y = 10 * 2.5 + 1.5.
    expect(gray.data[0]).toBeCloseTo(26.5, 4);
    expect(gray.data[3]).toBeCloseTo(10 * 4.5 + 3.5, 4);
    expect(gray.originX).toBe(2);
    expect(gray.factor).toBe(2);
  });

  it("clips the region to the frame", () => {
    const gray = grayRegion(rampFrame(8, 6), { x: -3, y: 4, width: 20, height: 20 }, 1);
    expect([gray.originX, gray.originY, gray.width, gray.height]).toEqual([0, 4, 8, 2]);
  });
});

describe("halve and buildPyramid", () => {
  it("averages 2x2 blocks and doubles the factor", () => {
    const base = grayRegion(rampFrame(8, 8), { x: 0, y: 0, width: 8, height: 8 }, 1);
    const pyramid = buildPyramid(base, 3);
    expect(pyramid.map((l) => [l.width, l.factor])).toEqual([
      [8, 1],
      [4, 2],
      [2, 4],
    ]);
    expect(halve(base).data[0]).toBeCloseTo((0 + 10 + 1 + 11) / 4, 5);
    // A linear ramp averages to its value at the block centre: x = 1.5, y = 1.5 at level 2.
    expect(pyramid[2].data[0]).toBeCloseTo(10 * 1.5 + 1.5, 4);
  });
});

describe("coordinates", () => {
  it("maps image pixels to frame pixels and back", () => {
    const image = grayRegion(rampFrame(32, 32), { x: 8, y: 4, width: 16, height: 16 }, 4);
    // Image pixel 0 covers frame columns 8..11, whose centre is 9.5.
    expect(toFrameX(image, 0)).toBeCloseTo(9.5, 10);
    expect(toImageX(image, toFrameX(image, 2.3))).toBeCloseTo(2.3, 10);
  });

  it("samples bilinearly and gives NaN outside", () => {
    const image = grayRegion(rampFrame(4, 4), { x: 0, y: 0, width: 4, height: 4 }, 1);
    expect(sampleGray(image, 1.5, 2.25)).toBeCloseTo(10 * 1.5 + 2.25, 4);
    expect(sampleGray(image, -0.1, 1)).toBeNaN();
  });
});
