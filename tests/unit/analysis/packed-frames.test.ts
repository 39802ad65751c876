// Per-frame bar positions packed for the database give back exactly what was packed.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { packBarFrames, unpackBarFrames, type BarFrame } from "@/lib/analysis/packed-frames";

describe("packed bar frames", () => {
  it("round-trips times and positions bit for bit, and frames without a bar as null", () => {
    const frames: BarFrame[] = [
      { t: 0, bar: { x: 903.5084073221024, y: 480.7795907518787 } },
      { t: 1 / 30, bar: null },
      { t: 179.96666666666667, bar: { x: -0.5, y: 1e-9 } },
    ];
    const packed = packBarFrames(frames);
    expect(packed.byteLength).toBe(3 * 24);
    expect(unpackBarFrames(packed)).toEqual(frames);
  });

  it("round-trips any finite frames", () => {
    const finite = fc.double({ noNaN: true, noDefaultInfinity: true });
    fc.assert(
      fc.property(fc.array(fc.record({ t: finite, bar: fc.option(fc.record({ x: finite, y: finite }), { nil: null }) })), (frames) => {
        expect(unpackBarFrames(packBarFrames(frames))).toEqual(frames);
      }),
    );
  });

  it("reads from a view into a larger buffer, as the database driver hands it", () => {
    const packed = packBarFrames([{ t: 2, bar: { x: 3, y: 4 } }]);
    const larger = new Uint8Array(packed.byteLength + 16);
    larger.set(packed, 8);
    expect(unpackBarFrames(larger.subarray(8, 8 + packed.byteLength))).toEqual([{ t: 2, bar: { x: 3, y: 4 } }]);
  });

  it("refuses bytes that are not whole frames", () => {
    expect(() => unpackBarFrames(new Uint8Array(25))).toThrow(RangeError);
  });
});
