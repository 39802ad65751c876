import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { butter, filtfilt, lowPassZeroLag, savitzkyGolay } from "@/lib/analysis/filters";

// Reference outputs from Debian's python3-scipy (scipy.signal.butter, filtfilt,
// savgol_filter), written by tests/fixtures/scipy/generate.py; the JSON names the version.
interface Fixture {
  scipyVersion: string;
  signals: Record<string, { sampleRateHz: number; x: number[] }>;
  butter: { order: number; cutoffHz: number; sampleRateHz: number; b: number[]; a: number[] }[];
  filtfilt: { signal: string; order: number; cutoffHz: number; sampleRateHz: number; padlen: number; y: number[] }[];
  savgol: { signal: string; windowLength: number; polyOrder: number; deriv: number; deltaS: number; y: number[] }[];
}
const fixture = JSON.parse(
  readFileSync(path.join(import.meta.dirname, "../../../fixtures/scipy/filters.json"), "utf8"),
) as Fixture;

const TOLERANCE = 1e-9;

/** Largest absolute difference relative to the largest magnitude of the SciPy output. */
function relativeDeviation(actual: number[], expected: number[]): number {
  expect(actual).toHaveLength(expected.length);
  const scale = Math.max(...expected.map(Math.abs), Number.MIN_VALUE);
  return Math.max(...actual.map((v, i) => Math.abs(v - expected[i]))) / scale;
}

describe("butter", () => {
  it.each(fixture.butter)("matches SciPy for order $order, $cutoffHz Hz at $sampleRateHz Hz", (c) => {
    const { b, a } = butter(c.order, c.cutoffHz, c.sampleRateHz);
    // Per coefficient: the b coefficients of a low cutoff are tiny, so compare each one to itself.
    b.forEach((v, i) => expect(Math.abs(v - c.b[i])).toBeLessThanOrEqual(TOLERANCE * Math.abs(c.b[i])));
    a.forEach((v, i) => expect(Math.abs(v - c.a[i])).toBeLessThanOrEqual(TOLERANCE * Math.max(Math.abs(c.a[i]), 1e-300)));
    expect(a).toHaveLength(c.a.length);
    expect(b).toHaveLength(c.b.length);
  });

  it("has unit gain at 0 Hz", () => {
    const { b, a } = butter(4, 6, 30);
    const sum = (v: number[]) => v.reduce((s, c) => s + c, 0);
    expect(sum(b) / sum(a)).toBeCloseTo(1, 12);
  });

  it("rejects a cutoff at or above Nyquist and a bad order", () => {
    expect(() => butter(4, 15, 30)).toThrow(/Nyquist/);
    expect(() => butter(0, 6, 30)).toThrow(/order/);
    expect(() => butter(2.5, 6, 30)).toThrow(/order/);
  });
});

describe("filtfilt", () => {
  it.each(fixture.filtfilt)("matches SciPy on $signal, order $order, $cutoffHz Hz (padlen $padlen)", (c) => {
    const { b, a } = butter(c.order, c.cutoffHz, c.sampleRateHz);
    const y = filtfilt(b, a, fixture.signals[c.signal].x);
    expect(relativeDeviation(y, c.y)).toBeLessThan(TOLERANCE);
  });

  it("keeps a constant signal constant and handles one or no samples", () => {
    const { b, a } = butter(4, 6, 30);
    filtfilt(b, a, new Array(40).fill(7)).forEach((v) => expect(v).toBeCloseTo(7, 10));
    expect(filtfilt(b, a, [5])[0]).toBeCloseTo(5, 12);
    expect(filtfilt(b, a, [])).toEqual([]);
  });

  it("rejects NaN input with the index", () => {
    const { b, a } = butter(2, 6, 30);
    expect(() => filtfilt(b, a, [1, 2, NaN, 4])).toThrow(/\[2\]/);
  });
});

describe("lowPassZeroLag", () => {
  it("is butter(4, 6 Hz) run forward and back by default", () => {
    const { x, sampleRateHz } = fixture.signals["noisy-sine"];
    const expected = fixture.filtfilt.find((c) => c.signal === "noisy-sine" && c.order === 4 && c.cutoffHz === 6);
    expect(expected).toBeDefined();
    expect(relativeDeviation(lowPassZeroLag(x, sampleRateHz), expected!.y)).toBeLessThan(TOLERANCE);
  });

  it("adds no lag: a smoothed symmetric peak stays where it was", () => {
    const x = Array.from({ length: 121 }, (_, i) => Math.exp(-(((i - 60) / 12) ** 2)));
    const y = lowPassZeroLag(x, 60);
    expect(y.indexOf(Math.max(...y))).toBe(60);
  });
});

describe("savitzkyGolay", () => {
  it.each(fixture.savgol)(
    "matches SciPy on $signal, window $windowLength, poly $polyOrder, deriv $deriv",
    (c) => {
      const y = savitzkyGolay(fixture.signals[c.signal].x, c.windowLength, c.polyOrder, c.deriv, c.deltaS);
      expect(relativeDeviation(y, c.y)).toBeLessThan(TOLERANCE);
    },
  );

  it("differentiates a quadratic exactly, edges included", () => {
    const deltaS = 0.1;
    const x = Array.from({ length: 15 }, (_, i) => 3 * (i * deltaS) ** 2 - 2 * i * deltaS + 1);
    savitzkyGolay(x, 7, 2, 1, deltaS).forEach((v, i) => expect(v).toBeCloseTo(6 * i * deltaS - 2, 10));
    savitzkyGolay(x, 7, 2, 2, deltaS).forEach((v) => expect(v).toBeCloseTo(6, 8));
  });

  it("rejects even windows, windows longer than the input and deriv above the polynomial order", () => {
    const x = [1, 2, 3, 4, 5, 6];
    expect(() => savitzkyGolay(x, 4, 2)).toThrow(/odd/);
    expect(() => savitzkyGolay(x, 7, 2)).toThrow(/exceed/);
    expect(() => savitzkyGolay(x, 5, 1, 2)).toThrow(/deriv/);
  });
});

it("fixture came from SciPy", () => {
  expect(fixture.scipyVersion).toMatch(/^\d+\.\d+/);
});
