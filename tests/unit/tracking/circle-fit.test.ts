import { describe, expect, it } from "vitest";
import { circleThroughPoints, fitCircle, kasaFit } from "@/lib/tracking/circle-fit";
import { createRandom, gaussianTable } from "@/tests/fixtures/clips/random";

describe("circleThroughPoints", () => {
  it("passes through three points of a known circle", () => {
    const circle = circleThroughPoints({ x: 15, y: 2 }, { x: 2, y: 15 }, { x: -11, y: 2 })!;
    expect(circle.cx).toBeCloseTo(2, 10);
    expect(circle.cy).toBeCloseTo(2, 10);
    expect(circle.radius).toBeCloseTo(13, 10);
  });

  it("returns null for collinear points", () => {
    expect(circleThroughPoints({ x: 0, y: 0 }, { x: 1, y: 1 }, { x: 2, y: 2 })).toBeNull();
  });
});

describe("fitCircle", () => {
  it("recovers a circle from noisy points on a 200 degree arc", () => {
    const random = createRandom(3);
    const noise = gaussianTable(random, 80);
    const points = Array.from({ length: 40 }, (_, k) => {
      const angle = ((200 / 180) * Math.PI * k) / 39;
      const r = 50 + 0.3 * noise[k];
      return { x: 120 + r * Math.cos(angle), y: 80 + r * Math.sin(angle) };
    });
    const circle = fitCircle(points)!;
    expect(Math.abs(circle.cx - 120)).toBeLessThan(0.2);
    expect(Math.abs(circle.cy - 80)).toBeLessThan(0.2);
    expect(Math.abs(circle.radius - 50)).toBeLessThan(0.2);
  });

  it("matches the algebraic fit exactly on noise-free points and rejects too few points", () => {
    const points = [0, 1, 2, 3, 4].map((k) => ({ x: 3 + 7 * Math.cos(k), y: -4 + 7 * Math.sin(k) }));
    const algebraic = kasaFit(points)!;
    const geometric = fitCircle(points)!;
    expect(algebraic.radius).toBeCloseTo(7, 8);
    expect(geometric.cx).toBeCloseTo(3, 8);
    expect(fitCircle(points.slice(0, 2))).toBeNull();
  });
});
