// Geometry of the markup tools: lengths with the calibration, three-point angles, angles to the
// vertical, and hit tests, against values that can be checked by hand.
import { describe, expect, it } from "vitest";
import { angleToVerticalDeg, distanceToEllipsePx, distanceToPolylinePx, distanceToSegmentPx, lengthCm, threePointAngleDeg } from "@/lib/markup/geometry";
import { anchorOf, hitTest, measureOf, serialiseGeometry, translateGeometry } from "@/lib/markup/kinds";
import { protractorAngleDeg } from "@/lib/markup/kinds/protractor";
import { noteBox } from "@/lib/markup/kinds/note";

describe("lengths", () => {
  it("measures a 3-4-5 right triangle's hypotenuse as 5 units (common practice: Pythagorean triple)", () => {
    expect(measureOf({ kind: "ruler", a: { x: 0, y: 0 }, b: { x: 300, y: 400 } }, { metresPerPixel: null })).toEqual({ value: 500, unit: "px", label: "500 px" });
  });

  it("turns pixels into centimetres with the calibration: a 450 mm plate 300 px across gives 1.5 mm per pixel", () => {
    // 450 mm is the largest disc diameter in the IPF Technical Rules (as used in lib/analysis/calibration.ts).
    const metresPerPixel = 0.45 / 300;
    expect(lengthCm(300, metresPerPixel)).toBeCloseTo(45, 10);
    const measure = measureOf({ kind: "ruler", a: { x: 10, y: 10 }, b: { x: 310, y: 410 } }, { metresPerPixel });
    expect(measure?.unit).toBe("cm");
    expect(measure?.value).toBeCloseTo(75, 10); // 500 px × 1.5 mm
    expect(measure?.label).toBe("75.0 cm");
  });
});

describe("angles", () => {
  it("gives 90° at the right angle of a 3-4-5 triangle (common practice)", () => {
    expect(threePointAngleDeg({ x: 0, y: -4 }, { x: 0, y: 0 }, { x: 3, y: 0 })).toBeCloseTo(90, 10);
  });

  it("gives the 3-4-5 triangle's acute angles, atan(3/4) = 36.87° and atan(4/3) = 53.13° (common practice)", () => {
    // Vertices (0,0), (4,0), (4,3): angle at the origin is atan(3/4).
    expect(threePointAngleDeg({ x: 4, y: 0 }, { x: 0, y: 0 }, { x: 4, y: 3 })).toBeCloseTo((Math.atan(3 / 4) * 180) / Math.PI, 10);
    expect(threePointAngleDeg({ x: 0, y: 0 }, { x: 4, y: 3 }, { x: 4, y: 0 })).toBeCloseTo(53.130102354, 8);
  });

  it("gives 180° for a straight line, 0° when folded, and no angle for a ray of no length", () => {
    expect(threePointAngleDeg({ x: -1, y: 0 }, { x: 0, y: 0 }, { x: 5, y: 0 })).toBeCloseTo(180, 10);
    expect(threePointAngleDeg({ x: 2, y: 0 }, { x: 0, y: 0 }, { x: 5, y: 0 })).toBeCloseTo(0, 10);
    expect(threePointAngleDeg({ x: 0, y: 0 }, { x: 0, y: 0 }, { x: 5, y: 0 })).toBeNull();
  });

  it("measures a line against the vertical: 0° plumb, 90° level, 45° on the diagonal, either direction", () => {
    expect(angleToVerticalDeg({ x: 5, y: 0 }, { x: 5, y: 10 })).toBeCloseTo(0, 10);
    expect(angleToVerticalDeg({ x: 0, y: 5 }, { x: 10, y: 5 })).toBeCloseTo(90, 10);
    expect(angleToVerticalDeg({ x: 0, y: 0 }, { x: -7, y: -7 })).toBeCloseTo(45, 10);
    // A torso leaning 3 forward over 4 up (3-4-5, common practice): atan(3/4) = 36.87° from vertical.
    expect(angleToVerticalDeg({ x: 100, y: 400 }, { x: 130, y: 360 })).toBeCloseTo(36.869897646, 8);
    expect(angleToVerticalDeg({ x: 1, y: 1 }, { x: 1, y: 1 })).toBeNull();
  });

  it("labels the protractor's two modes", () => {
    const threePoint = { kind: "protractor", mode: "three-point", a: { x: 0, y: -4 }, vertex: { x: 0, y: 0 }, b: { x: 3, y: 0 } } as const;
    expect(measureOf(threePoint, { metresPerPixel: null })?.label).toBe("90.0°");
    const vertical = { kind: "protractor", mode: "vertical", vertex: { x: 0, y: 0 }, a: { x: 3, y: -4 } } as const;
    expect(protractorAngleDeg(vertical)).toBeCloseTo(36.869897646, 8);
    expect(measureOf(vertical, { metresPerPixel: null })?.label).toBe("36.9° to vertical");
  });
});

describe("hit tests", () => {
  it("finds the distance to a segment from inside its span and beyond its ends", () => {
    expect(distanceToSegmentPx({ x: 5, y: 3 }, { x: 0, y: 0 }, { x: 10, y: 0 })).toBe(3);
    expect(distanceToSegmentPx({ x: 13, y: 4 }, { x: 0, y: 0 }, { x: 10, y: 0 })).toBe(5); // 3-4-5 past the end
    expect(distanceToPolylinePx({ x: 10, y: 5 }, [{ x: 0, y: 0 }, { x: 10, y: 0 }, { x: 10, y: 20 }])).toBe(0);
  });

  it("picks a ruler near its line and not away from it", () => {
    const g = { kind: "ruler", a: { x: 0, y: 0 }, b: { x: 100, y: 0 } } as const;
    expect(hitTest(g, { x: 50, y: 4 }, 5)).toBe(true);
    expect(hitTest(g, { x: 50, y: 6 }, 5)).toBe(false);
  });

  it("picks a three-point protractor on either leg, a vertical one only on its one leg", () => {
    const three = { kind: "protractor", mode: "three-point", a: { x: 0, y: 0 }, vertex: { x: 0, y: 100 }, b: { x: 100, y: 100 } } as const;
    expect(hitTest(three, { x: 2, y: 50 }, 3)).toBe(true);
    expect(hitTest(three, { x: 50, y: 98 }, 3)).toBe(true);
    expect(hitTest(three, { x: 50, y: 50 }, 3)).toBe(false);
    const vertical = { kind: "protractor", mode: "vertical", vertex: { x: 0, y: 100 }, a: { x: 0, y: 0 } } as const;
    expect(hitTest(vertical, { x: 50, y: 98 }, 3)).toBe(false);
  });

  it("picks a ring inside it and on its outline, not outside", () => {
    const g = { kind: "ring", center: { x: 100, y: 100 }, radiusXPx: 50, radiusYPx: 20 } as const;
    expect(distanceToEllipsePx({ x: 150, y: 100 }, g.center, 50, 20)).toBeCloseTo(0, 10);
    expect(hitTest(g, { x: 100, y: 100 }, 2)).toBe(true);
    expect(hitTest(g, { x: 152, y: 100 }, 3)).toBe(true);
    expect(hitTest(g, { x: 100, y: 130 }, 3)).toBe(false);
  });

  it("picks a note inside its text box", () => {
    const g = { kind: "note", at: { x: 10, y: 10 }, text: "knees out" } as const;
    const box = noteBox(g);
    expect(hitTest(g, { x: box.x + box.width - 1, y: box.y + box.height - 1 }, 0)).toBe(true);
    expect(hitTest(g, { x: box.x + box.width + 5, y: box.y }, 2)).toBe(false);
  });
});

describe("moving and serialising", () => {
  it("moves every point of a shape by the same offset and keeps its measure", () => {
    const g = { kind: "protractor", mode: "three-point", a: { x: 0, y: -4 }, vertex: { x: 0, y: 0 }, b: { x: 3, y: 0 } } as const;
    const moved = translateGeometry(g, 10, 20);
    expect(moved).toEqual({ kind: "protractor", mode: "three-point", a: { x: 10, y: 16 }, vertex: { x: 10, y: 20 }, b: { x: 13, y: 20 } });
    expect(protractorAngleDeg(moved)).toBeCloseTo(90, 10);
    expect(anchorOf(moved)).toEqual({ x: 10, y: 20 });
    expect(translateGeometry({ kind: "pen", points: [{ x: 1, y: 1 }, { x: 2, y: 2 }] }, -1, 1)).toEqual({ kind: "pen", points: [{ x: 0, y: 2 }, { x: 1, y: 3 }] });
  });

  it("serialises what the server accepts and refuses what it would refuse", () => {
    expect(serialiseGeometry({ kind: "arrow", from: { x: 0, y: 0 }, to: { x: 1, y: 1 } })).toEqual({ kind: "arrow", from: { x: 0, y: 0 }, to: { x: 1, y: 1 } });
    expect(serialiseGeometry({ kind: "note", at: { x: 0, y: 0 }, text: "" })).toBeNull();
    expect(serialiseGeometry({ kind: "arrow", from: { x: Number.NaN, y: 0 }, to: { x: 1, y: 1 } })).toBeNull();
  });
});
