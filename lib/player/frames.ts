// Frame index <-> media time for the player: the analysis recorded each decoded frame's exact timestamp,
// so stepping and read-outs use those instead of guessing from currentTime and a nominal frame rate.

/** Index of the frame shown at `timeS`: the last frame whose timestamp is at or before it (binary search). */
export function frameAt(timeS: number, timestampsS: readonly number[]): number {
  if (timestampsS.length === 0) return -1;
  // A seek lands a hair before the intended timestamp after float rounding; treat it as that frame.
  const t = timeS + 1e-6;
  if (t < timestampsS[0]) return 0;
  let lo = 0;
  let hi = timestampsS.length - 1;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (timestampsS[mid] <= t) lo = mid;
    else hi = mid - 1;
  }
  return lo;
}

/**
 * The media time to seek to for a frame: the middle of its display interval, so decoder rounding on
 * either side still shows that frame. The last frame lasts as long as the one before it.
 */
export function seekTargetFor(frameIndex: number, timestampsS: readonly number[]): number {
  const n = timestampsS.length;
  if (n === 0) return 0;
  const i = clampIndex(frameIndex, n);
  const start = timestampsS[i];
  const next = i + 1 < n ? timestampsS[i + 1] : start + (n > 1 ? start - timestampsS[i - 1] : 1 / 30);
  return (start + next) / 2;
}

export function clampIndex(frameIndex: number, count: number): number {
  if (count <= 0) return 0;
  return Math.min(count - 1, Math.max(0, Math.round(frameIndex)));
}

/** The frame `step` frames away from `frameIndex`, kept inside the clip. */
export function stepFrame(frameIndex: number, step: number, count: number): number {
  return clampIndex(frameIndex + step, count);
}
