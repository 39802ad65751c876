// Reading values off the uniform sample grid at arbitrary times (linear interpolation),
// and index ranges for time windows. NaN marks a sample that could not be measured.

/** Fractional sample index of time t on a uniform grid. */
export function fractionalIndex(times: readonly number[], t: number): number {
  if (times.length < 2) return 0;
  const dt = times[1] - times[0];
  return Math.min(times.length - 1, Math.max(0, (t - times[0]) / dt));
}

/** Linearly interpolated value at time t; NaN when a neighbouring sample is NaN. */
export function valueAt(times: readonly number[], values: readonly number[], t: number): number {
  const f = fractionalIndex(times, t);
  const i = Math.floor(f);
  if (i >= values.length - 1) return values[values.length - 1];
  const w = f - i;
  return w === 0 ? values[i] : values[i] * (1 - w) + values[i + 1] * w;
}

/** Nearest sample index to time t. */
export function nearestIndex(times: readonly number[], t: number): number {
  return Math.round(fractionalIndex(times, t));
}

/** First and last sample index inside [startS, endS] (inclusive); last < first when the window holds none. */
export function indexRange(times: readonly number[], startS: number, endS: number): [number, number] {
  return [Math.ceil(fractionalIndex(times, startS) - 1e-9), Math.floor(fractionalIndex(times, endS) + 1e-9)];
}

/** Values of a channel at start, every sample strictly inside, and end of a window. */
export function windowValues(times: readonly number[], values: readonly number[], startS: number, endS: number): number[] {
  const [first, last] = indexRange(times, startS, endS);
  const out = [valueAt(times, values, startS)];
  for (let i = first; i <= last; i++) if (times[i] > startS && times[i] < endS) out.push(values[i]);
  out.push(valueAt(times, values, endS));
  return out;
}

export function median(values: readonly number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = sorted.length >> 1;
  return sorted.length % 2 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2;
}
