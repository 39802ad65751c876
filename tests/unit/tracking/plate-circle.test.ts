import { describe, expect, it } from "vitest";
import { FrameInputError, suggestPlateCircle } from "@/lib/tracking";
import { plateCamera } from "./synthetic-frames";

describe("suggestPlateCircle", () => {
  const shoot = plateCamera(640, 360);
  const plate = { x: 300.4, y: 150.7, radiusPx: 42.3 };
  const frame = shoot(plate);

  it("finds the outer rim from a tap near the centre", () => {
    const circle = suggestPlateCircle(frame, plate.x + 2, plate.y - 3)!;
    expect(Math.abs(circle.radiusPx - plate.radiusPx) / plate.radiusPx).toBeLessThan(0.02);
    expect(Math.hypot(circle.cx - plate.x, circle.cy - plate.y)).toBeLessThan(0.5);
    expect(circle.score).toBeGreaterThan(0.8);
  });

  it("finds it from a tap halfway to the rim", () => {
    const circle = suggestPlateCircle(frame, plate.x - 0.5 * plate.radiusPx, plate.y + 4)!;
    expect(Math.abs(circle.radiusPx - plate.radiusPx) / plate.radiusPx).toBeLessThan(0.02);
    expect(Math.hypot(circle.cx - plate.x, circle.cy - plate.y)).toBeLessThan(0.5);
  });

  it("finds small and large plates", () => {
    for (const radiusPx of [14, 120]) {
      const shot = { x: 320, y: 180, radiusPx };
      const circle = suggestPlateCircle(shoot(shot), 321, 179)!;
      expect(Math.abs(circle.radiusPx - radiusPx) / radiusPx).toBeLessThan(0.03);
    }
  });

  it("returns null where there is no plate", () => {
    const flat = { width: 64, height: 48, data: new Uint8Array(64 * 48 * 4).fill(128) };
    expect(suggestPlateCircle(flat, 30, 20)).toBeNull();
  });

  it("rejects a tap outside the frame and a malformed frame", () => {
    expect(() => suggestPlateCircle(frame, 700, 20)).toThrow(FrameInputError);
    expect(() => suggestPlateCircle({ width: 10, height: 10, data: new Uint8Array(12) }, 5, 5)).toThrow(/frame.data: expected 400 bytes/);
    expect(() => suggestPlateCircle(frame, Number.NaN, 20)).toThrow(/tapX/);
  });
});
