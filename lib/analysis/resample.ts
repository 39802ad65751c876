// Turns a track's irregular frames into evenly spaced samples per channel (bar
// and each joint): drops low-score points, rejects single-frame outliers,
// bridges short gaps and marks long ones invalid, so the filters and the rep
// finder can assume a uniform grid with no NaN.
import { type JointName, normaliseJointName } from "./joints";
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

interface Sample {
  t: number;
  x: number;
  y: number;
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
  const toChannel = (samples: Sample[]) => interpolateChannel(rejectOutliers(samples, floorPx), times, maxGapS);

  const barSamples = track.frames.flatMap((f) => (f.bar && f.bar.score >= minScore ? [{ t: f.t, x: f.bar.x, y: f.bar.y }] : []));
  const joints: Partial<Record<JointName, Channel>> = {};
  for (const [name, samples] of jointSamples(track, minScore)) joints[name] = toChannel(samples);
  return { sampleRateHz, times, bar: toChannel(barSamples), joints };
}

function defaultSampleRateHz(track: Track): number {
  const intervals = track.frames.slice(1).map((f, i) => f.t - track.frames[i].t);
  if (intervals.length === 0) return Math.round(track.fps);
  return Math.max(1, Math.round(1 / median(intervals)));
}

function uniformTimes(startS: number, endS: number, sampleRateHz: number): number[] {
  const count = Math.floor((endS - startS) * sampleRateHz + TIME_EPS_S) + 1;
  return Array.from({ length: count }, (_, i) => startS + i / sampleRateHz);
}

/** Kept samples per joint in time order; of two points with one name in a frame, the higher score wins. */
function jointSamples(track: Track, minScore: number): Map<JointName, Sample[]> {
  const byJoint = new Map<JointName, Sample[]>();
  for (const frame of track.frames) {
    const best = new Map<JointName, { x: number; y: number; score: number }>();
    for (const k of frame.keypoints) {
      const name = normaliseJointName(k.name);
      if (name === null || k.score < minScore) continue;
      const held = best.get(name);
      if (!held || k.score > held.score) best.set(name, k);
    }
    for (const [name, k] of best) {
      const list = byJoint.get(name) ?? [];
      list.push({ t: frame.t, x: k.x, y: k.y });
      byJoint.set(name, list);
    }
  }
  return byJoint;
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = sorted.length >> 1;
  return sorted.length % 2 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2;
}

/**
 * Hampel filter over neighbouring kept samples: a sample further from the
 * window median than HAMPEL_SIGMAS robust SDs (and than floorPx) on either
 * axis is dropped. The median follows monotone motion exactly, so only
 * isolated jumps (a keypoint snapping to the other leg, a tracker slip) go.
 */
function rejectOutliers(samples: Sample[], floorPx: number): Sample[] {
  const isOutlier = (i: number, axis: "x" | "y") => {
    const window = samples
      .slice(Math.max(0, i - HAMPEL_HALF_WINDOW), i + HAMPEL_HALF_WINDOW + 1)
      .map((s) => s[axis]);
    const centre = median(window);
    const spread = MAD_TO_SD * median(window.map((v) => Math.abs(v - centre)));
    return Math.abs(samples[i][axis] - centre) > Math.max(HAMPEL_SIGMAS * spread, floorPx);
  };
  if (samples.length < 3) return samples;
  return samples.filter((_, i) => !isOutlier(i, "x") && !isOutlier(i, "y"));
}

/** Linear interpolation onto the grid; a span between kept samples longer than maxGapS is invalid, and so is anything before the first or after the last. */
function interpolateChannel(samples: Sample[], times: number[], maxGapS: number): Channel {
  const channel: Channel = { x: [], y: [], valid: [] };
  let next = 0;
  for (const t of times) {
    while (next < samples.length && samples[next].t < t - TIME_EPS_S) next++;
    const after = samples[next];
    const before = samples[next - 1];
    if (after && Math.abs(after.t - t) <= TIME_EPS_S) {
      push(channel, after.x, after.y, true);
    } else if (after && before) {
      const w = (t - before.t) / (after.t - before.t);
      push(channel, before.x + w * (after.x - before.x), before.y + w * (after.y - before.y), after.t - before.t <= maxGapS + TIME_EPS_S);
    } else {
      const held = after ?? before;
      push(channel, held?.x ?? 0, held?.y ?? 0, false);
    }
  }
  return channel;
}

function push(channel: Channel, x: number, y: number, valid: boolean): void {
  channel.x.push(x);
  channel.y.push(y);
  channel.valid.push(valid);
}
