// Bridging gaps in a resampled channel with a cubic rather than a straight line: a straight
// bridge over a lost stretch of a moving bar (tracker drop-out, dropped frames) flattens the
// velocity peak and moves the end of the lift; a cubic that keeps the speed at both edges does not.
import type { Channel, UniformTrack } from "./resample";

/** Valid samples each side used to estimate the speed at a gap's edge. */
const EDGE_FIT_SAMPLES = 4;

/** Slope (per second) of a least-squares line through valid samples from `from` stepping by `step`. */
function edgeSlope(times: readonly number[], v: readonly number[], valid: readonly boolean[], from: number, step: 1 | -1): number {
  const idx: number[] = [];
  for (let i = from; i >= 0 && i < v.length && valid[i] && idx.length < EDGE_FIT_SAMPLES; i += step) idx.push(i);
  if (idx.length < 2) return 0;
  const mt = idx.reduce((s, i) => s + times[i], 0) / idx.length;
  const mv = idx.reduce((s, i) => s + v[i], 0) / idx.length;
  let num = 0;
  let den = 0;
  for (const i of idx) {
    num += (times[i] - mt) * (v[i] - mv);
    den += (times[i] - mt) ** 2;
  }
  return den > 0 ? num / den : 0;
}

function hermite(p0: number, p1: number, m0: number, m1: number, h: number, s: number): number {
  const s2 = s * s;
  const s3 = s2 * s;
  return (2 * s3 - 3 * s2 + 1) * p0 + (s3 - 2 * s2 + s) * h * m0 + (-2 * s3 + 3 * s2) * p1 + (s3 - s2) * h * m1;
}

/** Refills every run of invalid samples between two valid ones; runs whose gap may be at most maxGapS become valid. */
export function bridgeGaps(channel: Channel, times: readonly number[], maxGapS: number): Channel {
  const x = [...channel.x];
  const y = [...channel.y];
  const valid = [...channel.valid];
  let i = 0;
  while (i < valid.length) {
    if (valid[i]) {
      i++;
      continue;
    }
    let end = i;
    while (end < valid.length && !valid[end]) end++;
    const before = i - 1;
    if (before >= 0 && end < valid.length) {
      const h = times[end] - times[before];
      for (const v of [x, y]) {
        const m0 = edgeSlope(times, v, channel.valid, before, -1);
        const m1 = edgeSlope(times, v, channel.valid, end, 1);
        for (let k = i; k < end; k++) v[k] = hermite(v[before], v[end], m0, m1, h, (times[k] - times[before]) / h);
      }
      // The grid only brackets the lost frames: the true gap is at least two samples shorter than h.
      if (h - 2 * (times[1] - times[0]) <= maxGapS + 1e-9) valid.fill(true, i, end);
    }
    i = end;
  }
  return { x, y, valid };
}

export function bridgeTrackGaps(uniform: UniformTrack, maxGapS: number): UniformTrack {
  const joints: UniformTrack["joints"] = {};
  for (const [name, channel] of Object.entries(uniform.joints)) joints[name as keyof typeof joints] = bridgeGaps(channel!, uniform.times, maxGapS);
  return { ...uniform, bar: bridgeGaps(uniform.bar, uniform.times, maxGapS), joints };
}
