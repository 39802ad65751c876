// Phase-aligned sync between two clips: start, bottom and lockout land together; in between time is
// mapped linearly per phase; outside the rep both clips run at plain speed.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { phaseAt, repPercentAt, syncedTime, timeAtPhase, type RepEvents } from "@/lib/compare/sync";

// Rep A: 1.0 s descent, 0.5 s ascent. Rep B (slower, later in its clip): 2.0 s descent, 1.5 s ascent.
const a: RepEvents = { startS: 2, bottomS: 3, lockoutS: 3.5 };
const b: RepEvents = { startS: 10, bottomS: 12, lockoutS: 13.5 };

describe("phase mapping", () => {
  it("puts start, bottom and lockout at phases 0, 0.5 and 1", () => {
    expect(phaseAt(a, 2)).toBe(0);
    expect(phaseAt(a, 3)).toBe(0.5);
    expect(phaseAt(a, 3.5)).toBe(1);
    expect(phaseAt(a, 2.5)).toBe(0.25);
    expect(phaseAt(a, 3.25)).toBe(0.75);
  });

  it("clamps outside the rep", () => {
    expect(phaseAt(a, 0)).toBe(0);
    expect(phaseAt(a, 9)).toBe(1);
  });

  it("maps the key events of one rep onto the other's", () => {
    expect(syncedTime(a, b, 2)).toBe(10);
    expect(syncedTime(a, b, 3)).toBe(12);
    expect(syncedTime(a, b, 3.5)).toBe(13.5);
    // Halfway down A (2.5 s) is halfway down B (11 s); halfway up A (3.25 s) is halfway up B (12.75 s).
    expect(syncedTime(a, b, 2.5)).toBeCloseTo(11, 12);
    expect(syncedTime(a, b, 3.25)).toBeCloseTo(12.75, 12);
  });

  it("runs at plain speed before the start and after the lockout", () => {
    expect(syncedTime(a, b, 1.5)).toBeCloseTo(9.5, 12);
    expect(syncedTime(a, b, 4)).toBeCloseTo(14, 12);
  });

  it("falls back to start and lockout when one rep has no bottom", () => {
    const noBottom: RepEvents = { startS: 0, bottomS: null, lockoutS: 4 };
    expect(syncedTime(a, noBottom, 2.75)).toBeCloseTo(2, 12);
    // A bottom outside the rep counts as none.
    expect(phaseAt({ startS: 0, bottomS: 5, lockoutS: 4 }, 1)).toBe(0.25);
  });

  it("refuses a rep that ends before it starts", () => {
    expect(() => phaseAt({ startS: 2, bottomS: null, lockoutS: 2 }, 2)).toThrow(RangeError);
  });

  it("is monotonic and inverts timeAtPhase inside any valid rep", () => {
    const rep = fc
      .tuple(fc.double({ min: 0, max: 100, noNaN: true }), fc.double({ min: 0.05, max: 5, noNaN: true }), fc.double({ min: 0.05, max: 5, noNaN: true }))
      .map(([s, down, up]): RepEvents => ({ startS: s, bottomS: s + down, lockoutS: s + down + up }));
    fc.assert(
      fc.property(rep, rep, fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), (lead, follow, p, q) => {
        const [lo, hi] = p <= q ? [p, q] : [q, p];
        const t1 = timeAtPhase(lead, lo);
        const t2 = timeAtPhase(lead, hi);
        expect(phaseAt(lead, t1)).toBeCloseTo(lo, 9);
        expect(syncedTime(lead, follow, t1)).toBeLessThanOrEqual(syncedTime(lead, follow, t2) + 1e-9);
      }),
    );
  });

  it("gives the stored series' percent of rep time", () => {
    expect(repPercentAt(a, 2)).toBe(0);
    expect(repPercentAt(a, 2.75)).toBe(50);
    expect(repPercentAt(a, 5)).toBe(100);
  });
});
