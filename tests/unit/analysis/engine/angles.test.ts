import { describe, expect, it } from "vitest";
import { angleToVerticalDeg, frontalPlaneProjectionAngleDeg, interiorAngleDeg, tiltDeg } from "@/lib/analysis/angles";

describe("interiorAngleDeg", () => {
  it("is 180° for a straight limb and 90° for a right angle", () => {
    expect(interiorAngleDeg({ x: 0, y: 2 }, { x: 0, y: 1 }, { x: 0, y: 0 })).toBeCloseTo(180, 9);
    expect(interiorAngleDeg({ x: 0, y: 1 }, { x: 0, y: 0 }, { x: 1, y: 0 })).toBeCloseTo(90, 9);
  });

  it("reads the angle of a 3-4-5 triangle", () => {
    // Angle opposite the side of length 3 in a 3-4-5 right triangle: atan(3/4) = 36.8699° (plane geometry).
    expect(interiorAngleDeg({ x: 4, y: 0 }, { x: 0, y: 0 }, { x: 4, y: 3 })).toBeCloseTo(36.8699, 3);
  });

  it("does not depend on which way the axes point", () => {
    const a = { x: 1, y: 2 };
    const b = { x: 3, y: -1 };
    const c = { x: -2, y: 0.5 };
    const mirrored = (p: { x: number; y: number }) => ({ x: -p.x, y: -p.y });
    expect(interiorAngleDeg(mirrored(a), mirrored(b), mirrored(c))).toBeCloseTo(interiorAngleDeg(a, b, c)!, 9);
  });

  it("is null when a ray has no length", () => {
    expect(interiorAngleDeg({ x: 1, y: 1 }, { x: 1, y: 1 }, { x: 0, y: 0 })).toBeNull();
  });
});

describe("angleToVerticalDeg", () => {
  it("measures a segment against straight up in a y-up frame", () => {
    expect(angleToVerticalDeg({ x: 0, y: 0 }, { x: 0, y: 1 })).toBeCloseTo(0, 9);
    expect(angleToVerticalDeg({ x: 0, y: 0 }, { x: 1, y: 1 })).toBeCloseTo(45, 9);
    expect(angleToVerticalDeg({ x: 0, y: 0 }, { x: -1, y: 0 })).toBeCloseTo(90, 9);
    expect(angleToVerticalDeg({ x: 0, y: 0 }, { x: 0, y: -1 })).toBeCloseTo(180, 9);
  });
});

describe("frontalPlaneProjectionAngleDeg", () => {
  // Left leg seen from the front with the body's midline toward +x.
  const hip = { x: 0, y: 1 };
  const ankle = { x: 0, y: 0 };

  it("is positive when the knee falls toward the midline (valgus) and negative outside (varus)", () => {
    const valgus = frontalPlaneProjectionAngleDeg(hip, { x: 0.1, y: 0.5 }, ankle, 1);
    const varus = frontalPlaneProjectionAngleDeg(hip, { x: -0.1, y: 0.5 }, ankle, 1);
    // Deviation from straight: 2 × atan(0.1 / 0.5) = 22.62° (plane geometry).
    expect(valgus).toBeCloseTo(22.62, 2);
    expect(varus).toBeCloseTo(-22.62, 2);
  });

  it("flips with the side of the midline", () => {
    expect(frontalPlaneProjectionAngleDeg(hip, { x: 0.1, y: 0.5 }, ankle, -1)).toBeCloseTo(-22.62, 2);
  });

  it("is zero for a knee on the hip–ankle line", () => {
    expect(frontalPlaneProjectionAngleDeg(hip, { x: 0, y: 0.5 }, ankle, 1)).toBeCloseTo(0, 9);
  });
});

describe("tiltDeg", () => {
  it("is positive when the left point is higher", () => {
    expect(tiltDeg({ x: 1, y: 1 }, { x: 0, y: 0 })).toBeCloseTo(45, 9);
    expect(tiltDeg({ x: -1, y: -1 }, { x: 0, y: 0 })).toBeCloseTo(-45, 9);
  });
});
