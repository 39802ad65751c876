// Filming advice: warnings (never refusals) for loads outside a working range, single reps, upright and very short clips.
import { describe, expect, it } from "vitest";
import { filmingWarnings } from "@/lib/clips/advice";

const base = { loadKg: null, oneRepMaxKg: null, reps: null, clip: null };
const codes = (facts: Parameters<typeof filmingWarnings>[0]) => filmingWarnings(facts).map((w) => w.code);

describe("filmingWarnings", () => {
  it("warns below 75 % and above 95 % of the profile's one-rep max, not inside (working load 75–95 %: common practice)", () => {
    expect(codes({ ...base, loadKg: 140, oneRepMaxKg: 200 })).toEqual(["load-below-working"]);
    expect(codes({ ...base, loadKg: 150, oneRepMaxKg: 200 })).toEqual([]);
    expect(codes({ ...base, loadKg: 190, oneRepMaxKg: 200 })).toEqual([]);
    expect(codes({ ...base, loadKg: 195, oneRepMaxKg: 200 })).toEqual(["load-above-working"]);
    expect(filmingWarnings({ ...base, loadKg: 100, oneRepMaxKg: 200 })[0].message).toMatch(/50 % of your one-rep max/);
  });

  it("says nothing about the load without a known one-rep max", () => {
    expect(codes({ ...base, loadKg: 300, oneRepMaxKg: null })).toEqual([]);
  });

  it("warns for a single rep, an upright clip and a clip under 3 s", () => {
    expect(codes({ ...base, reps: 1, clip: { widthPx: 1080, heightPx: 1920, durationS: 2 } })).toEqual(["few-reps", "portrait", "short-clip"]);
    expect(codes({ ...base, reps: 5, clip: { widthPx: 1920, heightPx: 1080, durationS: 20 } })).toEqual([]);
  });

  it("names a source for every warning", () => {
    const all = filmingWarnings({ loadKg: 100, oneRepMaxKg: 200, reps: 1, clip: { widthPx: 1, heightPx: 2, durationS: 1 } });
    expect(all.every((w) => w.source.length > 0)).toBe(true);
  });
});
