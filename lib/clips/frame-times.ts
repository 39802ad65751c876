// Frame times of a clip for decoding through the <video> element: the container's presentation
// times (demuxed, not decoded), which frame the element shows at a reported media time, and where
// to seek to land on a given frame. Pure, shared by the page and the tests.

/** Presentation times in seconds, ascending, without repeats and without frames before the start. */
export function sortedFrameTimes(timestampsS: Iterable<number>): number[] {
  const sorted = [...timestampsS].filter((t) => Number.isFinite(t) && t >= 0).sort((a, b) => a - b);
  return sorted.filter((t, i) => i === 0 || t > sorted[i - 1]);
}

/**
 * Index of the frame shown at `mediaTimeS`: the last frame starting at or before it, allowing for
 * the element rounding times to microseconds. -1 before the first frame.
 */
export function frameIndexAt(timesS: readonly number[], mediaTimeS: number): number {
  const slackS = 1e-4;
  let low = 0;
  let high = timesS.length - 1;
  let found = -1;
  while (low <= high) {
    const mid = (low + high) >> 1;
    if (timesS[mid] <= mediaTimeS + slackS) {
      found = mid;
      low = mid + 1;
    } else high = mid - 1;
  }
  return found;
}

/**
 * Seek target for a frame: the middle of its display interval, so rounding in the element's clock
 * cannot land on a neighbour. The last frame lasts as long as the one before it.
 */
export function seekTargetS(timesS: readonly number[], index: number): number {
  if (index < 0 || index >= timesS.length) throw new RangeError(`frame ${index} is outside 0..${timesS.length - 1}`);
  const start = timesS[index];
  const next = timesS[index + 1];
  if (next !== undefined) return (start + next) / 2;
  const previous = timesS[index - 1];
  return previous === undefined ? start : start + (start - previous) / 2;
}
