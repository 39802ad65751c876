// Turns a track's irregular frames into evenly spaced samples per channel (bar
// and each joint): drops low-score points, rejects single-frame outliers,
// bridges short gaps and marks long ones invalid, so the filters and the rep
// finder can assume a uniform grid with no NaN.
import { JOINT_NAMES, type JointName, normaliseJointName } from "./joints";
import type { Track } from "./track";

/** Pixels, y down, one entry per grid time. Never NaN: inside long gaps and outside the seen span values are interpolated or held, with valid = false. */
export interface Channel {
  x: number[];
  y: number[];
  valid: boolean[];
}

export interface UniformTrack {
  sampleRateHz: number;
  times: number[];
  /** Always present; all valid = false (and x = y = 0) when the bar was never seen. */
  bar: Channel;
  /** Only joints seen at least once with a score of at least minScore. */
  joints: Partial<Record<JointName, Channel>>;
}

export interface ResampleOptions {
  /** Grid rate; default 1 / median frame interval, rounded (the track's fps for a single frame). */
  sampleRateHz?: number;
  /** Points scoring below this count as missing (default 0.3, common practice for MoveNet and BlazePose scores). */
  minScore?: number;
  /** Longest time between two kept samples that is bridged by interpolation and still marked valid (default 0.25 s). */
  maxGapS?: number;
  /** Smallest deviation from the local median, in pixels, that can count as an outlier (default 1 % of the image diagonal). */
  outlierFloorPx?: number;
}

export const DEFAULT_MIN_SCORE = 0.3;
export const DEFAULT_MAX_GAP_S = 0.25;
/** Hampel identifier: samples each side of the tested one, and how many robust SDs mark an outlier (3 is common practice). */
export const HAMPEL_HALF_WINDOW = 3;
export const HAMPEL_SIGMAS = 3;
/** MAD-to-SD factor for normally distributed data. */
const MAD_TO_SD = 1.4826;
/** Time slack (1 µs, far below any frame interval) for treating a grid time and a frame time as the same instant. */
const TIME_EPS_S = 1e-6;

/** Kept samples of one channel in time order, as parallel arrays (a long track has tens of thousands). */
interface Samples {
  t: Float64Array;
  x: Float64Array;
  y: Float64Array;
  length: number;
}

function emptySamples(capacity: number): Samples {
  return { t: new Float64Array(capacity), x: new Float64Array(capacity), y: new Float64Array(capacity), length: 0 };
}

function pushSample(s: Samples, t: number, x: number, y: number): void {
  s.t[s.length] = t;
  s.x[s.length] = x;
  s.y[s.length] = y;
  s.length++;
}

export function resampleTrack(track: Track, options: ResampleOptions = {}): UniformTrack {
  const minScore = options.minScore ?? DEFAULT_MIN_SCORE;
  const maxGapS = options.maxGapS ?? DEFAULT_MAX_GAP_S;
  const floorPx = options.outlierFloorPx ?? 0.01 * Math.hypot(track.width, track.height);
  const sampleRateHz = options.sampleRateHz ?? defaultSampleRateHz(track);
  if (!(sampleRateHz > 0) || !Number.isFinite(sampleRateHz)) {
    throw new RangeError(`resampleTrack: sampleRateHz must be a finite number above 0, got ${sampleRateHz}`);
  }
  const times = uniformTimes(track.frames[0].t, track.frames[track.frames.length - 1].t, sampleRateHz);
  const toChannel = (samples: Samples) => interpolateChannel(rejectOutliers(samples, floorPx), times, maxGapS);

  const barSamples = emptySamples(track.frames.length);
  for (const f of track.frames) if (f.bar && f.bar.score >= minScore) pushSample(barSamples, f.t, f.bar.x, f.bar.y);
  const joints: Partial<Record<JointName, Channel>> = {};
  for (const [name, samples] of jointSamples(track, minScore)) joints[name] = toChannel(samples);
  return { sampleRateHz, times, bar: toChannel(barSamples), joints };
}

/** Median time between consecutive frames, or one frame at the track's fps for a single frame. */
export function medianFrameIntervalS(track: Track): number {
  const { frames } = track;
  if (frames.length < 2) return 1 / track.fps;
  const intervals = new Float64Array(frames.length - 1);
  for (let i = 1; i < frames.length; i++) intervals[i - 1] = frames[i].t - frames[i - 1].t;
  // A typed array sorts numerically, and much faster than an array with a comparator.
  intervals.sort();
  const mid = intervals.length >> 1;
  return intervals.length % 2 ? intervals[mid] : (intervals[mid - 1] + intervals[mid]) / 2;
}

function defaultSampleRateHz(track: Track): number {
  if (track.frames.length < 2) return Math.round(track.fps);
  return Math.max(1, Math.round(1 / medianFrameIntervalS(track)));
}

function uniformTimes(startS: number, endS: number, sampleRateHz: number): number[] {
  const count = Math.floor((endS - startS) * sampleRateHz + TIME_EPS_S) + 1;
  return Array.from({ length: count }, (_, i) => startS + i / sampleRateHz);
}

const JOINT_INDEX = new Map<JointName, number>(JOINT_NAMES.map((name, i) => [name, i]));

/** Kept samples per joint in time order (joints in the order first seen); of two points with one name in a frame, the higher score wins. */
function jointSamples(track: Track, minScore: number): Map<JointName, Samples> {
  const count = JOINT_NAMES.length;
  const frames = track.frames;
  const lists: (Samples | undefined)[] = new Array(count);
  const firstSeen: number[] = [];
  // Best point per joint in the current frame; `frameOf` says which frame a slot was last written in.
  const frameOf = new Int32Array(count).fill(-1);
  const score = new Float64Array(count);
  const bestX = new Float64Array(count);
  const bestY = new Float64Array(count);
  const touched = new Int32Array(count);
  // Joint index per keypoint name (-1: not used); a track repeats a few names in every frame.
  const indexOf = new Map<string, number>();
  for (let f = 0; f < frames.length; f++) {
    const keypoints = frames[f].keypoints;
    let touchedCount = 0;
    for (let p = 0; p < keypoints.length; p++) {
      const k = keypoints[p];
      if (k.score < minScore) continue;
      let j = indexOf.get(k.name);
      if (j === undefined) {
        const name = normaliseJointName(k.name);
        indexOf.set(k.name, (j = name === null ? -1 : (JOINT_INDEX.get(name) as number)));
      }
      if (j < 0 || (frameOf[j] === f && k.score <= score[j])) continue;
      if (frameOf[j] !== f) touched[touchedCount++] = j;
      frameOf[j] = f;
      score[j] = k.score;
      bestX[j] = k.x;
      bestY[j] = k.y;
    }
    for (let q = 0; q < touchedCount; q++) {
      const j = touched[q];
      let list = lists[j];
      if (!list) {
        lists[j] = list = emptySamples(frames.length - f);
        firstSeen.push(j);
      }
      pushSample(list, frames[f].t, bestX[j], bestY[j]);
    }
  }
  return new Map(firstSeen.map((j) => [JOINT_NAMES[j], lists[j] as Samples]));
}

/**
 * Hampel test of every sample of one axis: true where the sample lies further from the median of
 * its window (HAMPEL_HALF_WINDOW samples each side, fewer at the ends) than HAMPEL_SIGMAS robust
 * SDs and than floorPx. The window slides one sample at a time, so it is kept sorted by one
 * insertion and one removal per step instead of being sorted afresh.
 */
function hampelOutliers(v: Float64Array, length: number, floorPx: number): Uint8Array {
  const out = new Uint8Array(length);
  const sorted = new Float64Array(2 * HAMPEL_HALF_WINDOW + 1);
  let m = 0;
  for (let i = -HAMPEL_HALF_WINDOW - 1; i < length; i++) {
    if (i >= 0) {
      const half = m >> 1;
      const centre = m % 2 ? sorted[half] : (sorted[half - 1] + sorted[half]) / 2;
      const offset = Math.abs(v[i] - centre);
      // The threshold is never below the floor, so most samples need no spread at all.
      if (offset > floorPx && offset > HAMPEL_SIGMAS * (MAD_TO_SD * medianDeviation(sorted, m, centre))) out[i] = 1;
    }
    // Slide: the sample HAMPEL_HALF_WINDOW behind leaves, the one HAMPEL_HALF_WINDOW + 1 ahead comes in.
    if (i >= HAMPEL_HALF_WINDOW) {
      const leaving = v[i - HAMPEL_HALF_WINDOW];
      let j = 0;
      while (sorted[j] !== leaving) j++;
      for (m--; j < m; j++) sorted[j] = sorted[j + 1];
    }
    const coming = i + HAMPEL_HALF_WINDOW + 1;
    if (coming >= 0 && coming < length) {
      const value = v[coming];
      let j = m++;
      for (; j > 0 && sorted[j - 1] > value; j--) sorted[j] = sorted[j - 1];
      sorted[j] = value;
    }
  }
  return out;
}

/** Median of |sorted[k] − centre| over the first m entries: the deviations below and above the centre are each in order, so they are merged. */
function medianDeviation(sorted: Float64Array, m: number, centre: number): number {
  let below = 0;
  while (below < m && sorted[below] < centre) below++;
  let above = below;
  below--;
  const wanted = m >> 1;
  let previous = 0;
  for (let k = 0; ; k++) {
    const fromBelow = below >= 0 ? centre - sorted[below] : Infinity;
    const fromAbove = above < m ? sorted[above] - centre : Infinity;
    const next = fromBelow <= fromAbove ? fromBelow : fromAbove;
    if (fromBelow <= fromAbove) below--;
    else above++;
    if (k === wanted) return m % 2 ? next : (previous + next) / 2;
    previous = next;
  }
}

/**
 * Hampel filter over neighbouring kept samples: a sample further from the
 * window median than HAMPEL_SIGMAS robust SDs (and than floorPx) on either
 * axis is dropped. The median follows monotone motion exactly, so only
 * isolated jumps (a keypoint snapping to the other leg, a tracker slip) go.
 */
function rejectOutliers(samples: Samples, floorPx: number): Samples {
  const n = samples.length;
  if (n < 3) return samples;
  const outX = hampelOutliers(samples.x, n, floorPx);
  const outY = hampelOutliers(samples.y, n, floorPx);
  if (outX.indexOf(1) < 0 && outY.indexOf(1) < 0) return samples;
  const kept = emptySamples(n);
  for (let i = 0; i < n; i++) if (!outX[i] && !outY[i]) pushSample(kept, samples.t[i], samples.x[i], samples.y[i]);
  return kept;
}

/** Linear interpolation onto the grid; a span between kept samples longer than maxGapS is invalid, and so is anything before the first or after the last. */
function interpolateChannel(samples: Samples, times: number[], maxGapS: number): Channel {
  const count = times.length;
  const channel: Channel = { x: new Array<number>(count), y: new Array<number>(count), valid: new Array<boolean>(count) };
  const { t: st, x: sx, y: sy, length } = samples;
  let next = 0;
  for (let i = 0; i < count; i++) {
    const t = times[i];
    while (next < length && st[next] < t - TIME_EPS_S) next++;
    const hasAfter = next < length;
    const hasBefore = next > 0;
    if (hasAfter && Math.abs(st[next] - t) <= TIME_EPS_S) {
      set(channel, i, sx[next], sy[next], true);
    } else if (hasAfter && hasBefore) {
      const b = next - 1;
      const w = (t - st[b]) / (st[next] - st[b]);
      set(channel, i, sx[b] + w * (sx[next] - sx[b]), sy[b] + w * (sy[next] - sy[b]), st[next] - st[b] <= maxGapS + TIME_EPS_S);
    } else {
      const held = hasAfter ? next : next - 1;
      set(channel, i, held >= 0 ? sx[held] : 0, held >= 0 ? sy[held] : 0, false);
    }
  }
  return channel;
}

function set(channel: Channel, i: number, x: number, y: number, valid: boolean): void {
  channel.x[i] = x;
  channel.y[i] = y;
  channel.valid[i] = valid;
}
