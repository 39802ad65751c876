import { describe, expect, it } from "vitest";
import { discFootprint, normaliseTemplate, parabolaVertex, TemplateMatcher } from "@/lib/tracking/ncc";
import type { GrayImage } from "@/lib/tracking/pyramid";

/** A grey image holding a Gaussian blob (sigma in pixels) centred at a sub-pixel position. */
function blobImage(width: number, height: number, cx: number, cy: number, sigma = 2.5, base = 40, peak = 180): GrayImage {
  const data = new Float32Array(width * height);
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      data[y * width + x] = base + peak * Math.exp(-((x - cx) ** 2 + (y - cy) ** 2) / (2 * sigma * sigma));
    }
  }
  return { width, height, data, originX: 0, originY: 0, factor: 1 };
}

describe("discFootprint", () => {
  it("holds the integer offsets inside the disc", () => {
    // Radius 2: the centre, 4 at distance 1, 4 diagonals, 4 at distance 2 (lattice count).
    const footprint = discFootprint(2);
    expect(footprint.dx.length).toBe(13);
    for (let k = 0; k < footprint.dx.length; k++) {
      expect(footprint.dx[k] ** 2 + footprint.dy[k] ** 2).toBeLessThanOrEqual(4);
    }
  });

  it("rejects a radius below half a pixel", () => {
    expect(() => discFootprint(0.2)).toThrow(/radius/);
  });
});

describe("normaliseTemplate", () => {
  it("makes the weights zero-mean with unit norm", () => {
    const weights = normaliseTemplate(Float32Array.from([10, 20, 30, 60]))!;
    const sum = weights.reduce((s, w) => s + w, 0);
    const norm = Math.sqrt(weights.reduce((s, w) => s + w * w, 0));
    expect(sum).toBeCloseTo(0, 6);
    expect(norm).toBeCloseTo(1, 6);
  });

  it("returns null for a flat patch", () => {
    expect(normaliseTemplate(new Float32Array(25).fill(90))).toBeNull();
  });
});

describe("TemplateMatcher", () => {
  const footprint = discFootprint(5);
  const image = blobImage(40, 32, 17, 14);
  const asFloats = Float32Array.from(footprint.dx, (dx, k) => image.data[(14 + footprint.dy[k]) * image.width + 17 + dx]);

  it("scores 1 on the patch itself, and is blind to gain and offset (zero-mean NCC)", () => {
    const matcher = new TemplateMatcher(footprint, normaliseTemplate(asFloats)!, image.width);
    expect(matcher.scoreAt(image, 17, 14)).toBeCloseTo(1, 5);
    const brighter = { ...image, data: image.data.map((v) => 0.5 * v + 70) };
    expect(matcher.scoreAt(brighter, 17, 14)).toBeCloseTo(1, 5);
    const inverted = { ...image, data: image.data.map((v) => 255 - v) };
    expect(matcher.scoreAt(inverted, 17, 14)).toBeCloseTo(-1, 5);
  });

  it("reports -2 where the footprint does not fit", () => {
    const matcher = new TemplateMatcher(footprint, normaliseTemplate(asFloats)!, image.width);
    expect(matcher.scoreAt(image, 2, 14)).toBe(-2);
  });

  it("finds a shifted blob to a tenth of a pixel", () => {
    const matcher = new TemplateMatcher(footprint, normaliseTemplate(asFloats)!, image.width);
    const moved = blobImage(40, 32, 20.3, 12.6);
    const match = matcher.search(moved, 17, 14, 5)!;
    // The integer peak sits 0.3-0.4 px off the blob, which costs some correlation.
    expect(match.score).toBeGreaterThan(0.9);
    expect(Math.abs(match.x - 20.3)).toBeLessThan(0.1);
    expect(Math.abs(match.y - 12.6)).toBeLessThan(0.1);
  });

  it("does not find what lies outside the search window", () => {
    const matcher = new TemplateMatcher(footprint, normaliseTemplate(asFloats)!, image.width);
    const far = blobImage(40, 32, 30, 14);
    const match = matcher.search(far, 14, 14, 3)!;
    expect(Math.abs(match.x - 30)).toBeGreaterThan(5);
    expect(match.score).toBeLessThan(0.9);
  });
});

describe("parabolaVertex", () => {
  it("finds the vertex of a sampled parabola", () => {
    // f(x) = -(x - 0.25)^2 sampled at -1, 0, 1.
    expect(parabolaVertex(-1.5625, -0.0625, -0.5625)).toBeCloseTo(0.25, 10);
  });

  it("returns 0 without a peak or with a missing neighbour", () => {
    expect(parabolaVertex(0.5, 0.5, 0.5)).toBe(0);
    expect(parabolaVertex(-2, 0.9, 0.5)).toBe(0);
  });
});
