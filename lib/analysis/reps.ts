// Rep and phase detection from the smoothed vertical bar position and velocity. Squat and bench
// reps start at the top (lowering, optional pause, drive); deadlift reps start on the floor
// (pull, lockout, lowering). Walk-out, re-racking, breathing and bracing move the bar too little
// vertically to count; a shallow rep still counts (it is flagged elsewhere).
import { refineEdges as fitEdges, type EdgeEstimate } from "./edges";
import type { Lift } from "./track";

export interface RepPhases {
  startS: number;
  endS: number;
  eccentricStartS: number;
  eccentricEndS: number;
  concentricStartS: number;
  concentricEndS: number;
  bottomS: number;
  /** Squat and bench: still time at the bottom. Deadlift: time on the floor since the previous rep (null for the first). */
  pauseDurationS: number | null;
}

/** Smallest vertical excursion that can be a rep (common practice: well above a breath or an un-rack, below any half rep). */
export const MIN_REP_ROM_M: Record<Lift, number> = { squat: 0.1, bench: 0.06, deadlift: 0.1 };
/** An excursion must reach this fraction of the set's largest to count: a half rep counts, a bounce in a walk-out does not (common practice). */
export const MIN_RELATIVE_ROM = 0.35;
/** A phase boundary is searched for only this close (fraction of the rep's range) to the top or bottom, so a stall mid-drive does not end the rep. */
const EDGE_BAND = 0.2;
/**
 * Phase edges: a straight line fitted to the velocity while it rises through (or falls back
 * through) this band of the phase's peak speed, extended to zero. The zero-lag filter smears the
 * moment the bar leaves rest, which moves a plain zero crossing outward; the line above the
 * smeared part does not move.
 */
const EDGE_BAND_LOW = 0.15;
const EDGE_BAND_HIGH = 0.5;

type Kind = "max" | "min";
interface Extreme {
  i: number;
  kind: Kind;
}

/** Turning points whose swing to the next one is at least h (hysteresis); the last one may be unconfirmed. */
export function turningPoints(y: readonly number[], h: number): Extreme[] {
  const out: Extreme[] = [];
  let dir = 0;
  let lo = 0;
  let hi = 0;
  let cand = 0;
  for (let i = 1; i < y.length; i++) {
    if (dir === 0) {
      if (y[i] > y[hi]) hi = i;
      if (y[i] < y[lo]) lo = i;
      if (y[i] - y[lo] >= h) [dir, cand] = [1, i];
      else if (y[hi] - y[i] >= h) [dir, cand] = [-1, i];
      if (dir !== 0) out.push(dir === 1 ? { i: lo, kind: "min" } : { i: hi, kind: "max" });
    } else if (dir === 1) {
      if (y[i] > y[cand]) cand = i;
      else if (y[cand] - y[i] >= h) {
        out.push({ i: cand, kind: "max" });
        [dir, cand] = [-1, i];
      }
    } else if (y[i] < y[cand]) cand = i;
    else if (y[i] - y[cand] >= h) {
      out.push({ i: cand, kind: "min" });
      [dir, cand] = [1, i];
    }
  }
  if (dir !== 0) out.push({ i: cand, kind: dir === 1 ? "max" : "min" });
  return out;
}

interface Candidate {
  before: number;
  turn: number;
  after: number;
  amplitude: number;
}

/** Squat and bench turn at a low point between two highs; the deadlift at a high point between two lows. */
function candidates(lift: Lift, y: readonly number[], h: number): Candidate[] {
  const turnKind: Kind = lift === "deadlift" ? "max" : "min";
  const ext = turningPoints(y, h);
  const out: Candidate[] = [];
  for (let k = 1; k < ext.length - 1; k++) {
    if (ext[k].kind !== turnKind) continue;
    const [before, turn, after] = [ext[k - 1].i, ext[k].i, ext[k + 1].i];
    out.push({ before, turn, after, amplitude: Math.min(Math.abs(y[turn] - y[before]), Math.abs(y[after] - y[turn])) });
  }
  return out;
}

function crossingTime(times: readonly number[], v: readonly number[], i: number): number {
  const f = v[i] === v[i + 1] ? 0 : v[i] / (v[i] - v[i + 1]);
  return times[i] + Math.min(1, Math.max(0, f)) * (times[i + 1] - times[i]);
}

interface EdgeSearch {
  times: readonly number[];
  /** Velocity, sign-adjusted so that the phase's motion is positive. */
  v: readonly number[];
  peak: number;
  accept: (i: number) => boolean;
  limit: number;
}

/** Time where the line through the samples (t, v) reaches zero; null for a flat line. */
function lineZero(points: [number, number][]): number | null {
  if (points.length < 2) return null;
  const mt = points.reduce((s, p) => s + p[0], 0) / points.length;
  const mv = points.reduce((s, p) => s + p[1], 0) / points.length;
  let num = 0;
  let den = 0;
  for (const [t, v] of points) {
    num += (t - mt) * (v - mv);
    den += (t - mt) ** 2;
  }
  const slope = den > 0 ? num / den : 0;
  return slope !== 0 ? mt - mv / slope : null;
}

/**
 * Samples from `from` stepping by `step` while the velocity stays under the band's top, keeping
 * those inside the band; at low frame rates a fast phase may put fewer than two samples in the
 * band, and then the first sample past the top is used as well.
 */
function bandSamples(times: readonly number[], v: readonly number[], from: number, step: 1 | -1, peakV: number, stop: number): [number, number][] {
  const out: [number, number][] = [];
  for (let i = from; step > 0 ? i <= stop : i >= stop; i += step) {
    if (v[i] > EDGE_BAND_HIGH * peakV) {
      if (out.length < 2) out.push([times[i], v[i]]);
      break;
    }
    if (v[i] >= EDGE_BAND_LOW * peakV) out.push([times[i], v[i]]);
  }
  return out;
}

/** When the motion around `peak` began; null if no start is found after `limit`. */
function motionStart({ times, v, peak, accept, limit }: EdgeSearch): number | null {
  let j = peak - 1;
  while (j >= limit && !(v[j] <= 0 && accept(j))) j--;
  if (j < limit || j + 1 >= v.length) return null;
  const zeroS = crossingTime(times, v, j);
  const line = lineZero(bandSamples(times, v, j + 1, 1, v[peak], peak));
  // The line must land between the last rest sample and the peak; otherwise keep the crossing.
  return line !== null && line > times[j] - 0.1 && line < times[peak] ? line : zeroS;
}

/** When the motion around `peak` ended; null if no end is found up to `limit`. */
function motionEnd({ times, v, peak, accept, limit }: EdgeSearch): number | null {
  let j = peak + 1;
  while (j <= limit && !(v[j] <= 0 && accept(j))) j++;
  if (j > limit) return null;
  const zeroS = crossingTime(times, v, j - 1);
  const line = lineZero(bandSamples(times, v, j - 1, -1, v[peak], peak));
  return line !== null && line > times[peak] && line < times[j] + 0.1 ? line : zeroS;
}

function argExtreme(v: readonly number[], from: number, to: number, sign: 1 | -1): number {
  let best = from;
  for (let i = from; i <= to; i++) if (sign * v[i] > sign * v[best]) best = i;
  return best;
}

function argMinY(times: readonly number[], y: readonly number[], fromS: number, toS: number): number {
  let best = -1;
  for (let i = 0; i < times.length; i++) {
    if (times[i] < fromS || times[i] > toS) continue;
    if (best < 0 || y[i] < y[best]) best = i;
  }
  return best < 0 ? (fromS + toS) / 2 : times[best];
}

interface Signals {
  times: readonly number[];
  y: readonly number[];
  vy: readonly number[];
  negVy: readonly number[];
}

type Edges = Pick<RepPhases, "eccentricStartS" | "eccentricEndS" | "concentricStartS" | "concentricEndS">;
const EDGE_KEYS = ["eccentricStartS", "eccentricEndS", "concentricStartS", "concentricEndS"] as const;

/** Squat and bench: lowering from the high before, drive to the high after. */
function topStartEdges(s: Signals, c: Candidate, prevTurn: number, nextTurn: number): Edges | null {
  const { times, y, vy, negVy } = s;
  const band = EDGE_BAND * c.amplitude;
  const nearTop = (ref: number) => (i: number) => y[i] >= y[ref] - band;
  const nearBottom = (i: number) => y[i] <= y[c.turn] + band;
  const ecPeak = argExtreme(vy, c.before, c.turn, -1);
  const ccPeak = argExtreme(vy, c.turn, c.after, 1);
  const edges = {
    eccentricStartS: motionStart({ times, v: negVy, peak: ecPeak, accept: nearTop(c.before), limit: prevTurn }),
    eccentricEndS: motionEnd({ times, v: negVy, peak: ecPeak, accept: nearBottom, limit: ccPeak }),
    concentricStartS: motionStart({ times, v: vy, peak: ccPeak, accept: nearBottom, limit: ecPeak }),
    concentricEndS: motionEnd({ times, v: vy, peak: ccPeak, accept: nearTop(c.after), limit: nextTurn }),
  };
  if (!EDGE_KEYS.every((k) => edges[k] !== null)) return null;
  const e = edges as Edges;
  // Through a touch-and-go bottom both searches meet one crossing; never let the lowering outlast the drive's start.
  return { ...e, eccentricEndS: Math.min(e.eccentricEndS, e.concentricStartS) };
}

/** Deadlift: pull from the low before, lowering to the low after (which may be cut off by the clip's end). */
function floorStartEdges(s: Signals, c: Candidate, prevTurn: number, nextTurn: number): Edges | null {
  const { times, y, vy, negVy } = s;
  const band = EDGE_BAND * c.amplitude;
  const nearTop = (i: number) => y[i] >= y[c.turn] - band;
  const nearFloor = (ref: number) => (i: number) => y[i] <= y[ref] + band;
  const ccPeak = argExtreme(vy, c.before, c.turn, 1);
  const ecPeak = argExtreme(vy, c.turn, c.after, -1);
  const concentricStartS = motionStart({ times, v: vy, peak: ccPeak, accept: nearFloor(c.before), limit: prevTurn });
  const concentricEndS = motionEnd({ times, v: vy, peak: ccPeak, accept: nearTop, limit: ecPeak });
  if (concentricStartS === null || concentricEndS === null) return null;
  return {
    concentricStartS,
    concentricEndS,
    eccentricStartS: motionStart({ times, v: negVy, peak: ecPeak, accept: nearTop, limit: ccPeak }) ?? concentricEndS,
    eccentricEndS: motionEnd({ times, v: negVy, peak: ecPeak, accept: nearFloor(c.after), limit: nextTurn }) ?? times[times.length - 1],
  };
}

/** Whether the bar starts or stops moving at each edge. */
const EDGE_KINDS: Record<(typeof EDGE_KEYS)[number], EdgeEstimate["kind"]> = {
  eccentricStartS: "start",
  eccentricEndS: "end",
  concentricStartS: "start",
  concentricEndS: "end",
};

/** Edges in the order the bar passes them: starts and ends alternate through the set. */
const TOP_START_ORDER = ["eccentricStartS", "eccentricEndS", "concentricStartS", "concentricEndS"] as const;
const FLOOR_START_ORDER = ["concentricStartS", "concentricEndS", "eccentricStartS", "eccentricEndS"] as const;

/**
 * Replaces every edge by its fitted time (edges.ts). The velocity-line estimate only seeds the
 * fit: it reads the speed above the filter's smear, which noise moves by tens of milliseconds,
 * while the fit of the unfiltered heights uses every sample around the stop.
 */
function refineEdges(lift: Lift, times: readonly number[], yRaw: readonly number[], seen: readonly boolean[] | undefined, reps: Edges[]): Edges[] {
  const order = lift === "deadlift" ? FLOOR_START_ORDER : TOP_START_ORDER;
  const all = reps.flatMap((r, k) => order.map((key) => ({ k, key, t: r[key], kind: EDGE_KINDS[key] })));
  const fitted = fitEdges(times, yRaw, all, seen);
  const out = reps.map((r) => ({ ...r }));
  all.forEach((e, i) => (out[e.k][e.key] = fitted[i]));
  return out;
}

/** Phases in their natural order (lowering first for squat and bench, pull first for the deadlift), with bottom and pause. */
function phases(lift: Lift, times: readonly number[], y: readonly number[], e: Edges, previous: RepPhases | undefined): RepPhases {
  if (lift === "deadlift") {
    const concentricEndS = Math.max(e.concentricStartS, e.concentricEndS);
    const eccentricStartS = Math.max(concentricEndS, e.eccentricStartS);
    const eccentricEndS = Math.max(eccentricStartS, e.eccentricEndS);
    return {
      startS: e.concentricStartS,
      endS: eccentricEndS,
      eccentricStartS,
      eccentricEndS,
      concentricStartS: e.concentricStartS,
      concentricEndS,
      bottomS: e.concentricStartS,
      pauseDurationS: previous ? Math.max(0, e.concentricStartS - previous.eccentricEndS) : null,
    };
  }
  const eccentricEndS = Math.max(e.eccentricStartS, e.eccentricEndS);
  const concentricStartS = Math.max(eccentricEndS, e.concentricStartS);
  const concentricEndS = Math.max(concentricStartS, e.concentricEndS);
  const pauseS = concentricStartS - eccentricEndS;
  return {
    startS: e.eccentricStartS,
    endS: concentricEndS,
    eccentricStartS: e.eccentricStartS,
    eccentricEndS,
    concentricStartS,
    concentricEndS,
    bottomS: pauseS > 0 ? argMinY(times, y, eccentricEndS, concentricStartS) : concentricStartS,
    pauseDurationS: pauseS,
  };
}

/**
 * Reps in time order, from the smoothed bar height y (m, up) and its velocity vy (m/s); with the
 * unsmoothed height yRaw the phase edges are refined by a local fit (edges.ts); `seen` marks the
 * samples of yRaw that were observed rather than bridged across a gap.
 */
export function detectReps(
  lift: Lift,
  times: readonly number[],
  y: readonly number[],
  vy: readonly number[],
  yRaw?: readonly number[],
  seen?: readonly boolean[],
): RepPhases[] {
  if (times.length < 3) return [];
  const minRom = MIN_REP_ROM_M[lift];
  const first = candidates(lift, y, minRom);
  if (first.length === 0) return [];
  const largest = Math.max(...first.map((c) => c.amplitude));
  const found = candidates(lift, y, Math.max(minRom, MIN_RELATIVE_ROM * largest));
  const signals: Signals = { times, y, vy, negVy: vy.map((v) => -v) };
  const edgesOf = lift === "deadlift" ? floorStartEdges : topStartEdges;
  const edges = found.flatMap((c, k) => {
    const prevTurn = k > 0 ? found[k - 1].turn : 0;
    const nextTurn = k < found.length - 1 ? found[k + 1].turn : times.length - 1;
    return edgesOf(signals, c, prevTurn, nextTurn) ?? [];
  });
  const final = yRaw ? refineEdges(lift, times, yRaw, seen, edges) : edges;
  const reps: RepPhases[] = [];
  for (const e of final) reps.push(phases(lift, times, y, e, reps[reps.length - 1]));
  return reps;
}
