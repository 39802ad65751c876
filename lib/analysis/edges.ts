// Refines the times a phase starts or ends from the unfiltered bar height. The low-pass filter
// smears the moment the bar leaves rest, and velocity thresholds drown in noise when the bar
// starts slowly; a local fit of the height around the turn uses every sample near it instead.
//
// Model around a stop from τ₁ (motion ends) to τ₂ ≥ τ₁ (motion starts again), velocity zero at
// both: y = y0 + a₋d² + c₋d⁴ for d = t − τ₁ < 0, y0 between τ₁ and τ₂, and y0 + a₊d² + c₊d⁴ for
// d = t − τ₂ > 0. τ₁ = τ₂ is a turn without a pause (a touch-and-go bottom); a lone edge has rest
// on its far side (τ₁ = −∞ before a start, τ₂ = +∞ after an end). Even powers only, because odd
// ones would let the curve mimic a shifted turn. The times are searched on a grid a quarter
// sample apart and the best one is refined by a parabola through its error.

/** Parameters of the stop model: y0 and two coefficients per side. */
const PARAMS = 5;

/** An edge to refine: where motion ends (the bar comes to a stop or turns) or starts. */
export interface EdgeEstimate {
  t: number;
  kind: "start" | "end";
}

/**
 * Scratch space for the normal equations (PARAMS rows of PARAMS + 1: matrix and right-hand side)
 * and their solution: fitError runs thousands of times per set, so nothing is allocated per call.
 */
const WIDTH = PARAMS + 1;
const system = new Float64Array(PARAMS * WIDTH);
const solution = new Float64Array(PARAMS);

/** Solves the system in `system` by Gaussian elimination with partial pivoting into `solution`; false if singular. */
function solve(): boolean {
  const a = system;
  for (let c = 0; c < PARAMS; c++) {
    let p = c;
    for (let i = c + 1; i < PARAMS; i++) if (Math.abs(a[i * WIDTH + c]) > Math.abs(a[p * WIDTH + c])) p = i;
    if (Math.abs(a[p * WIDTH + c]) < 1e-12) return false;
    if (p !== c) {
      for (let k = 0; k < WIDTH; k++) {
        const held = a[c * WIDTH + k];
        a[c * WIDTH + k] = a[p * WIDTH + k];
        a[p * WIDTH + k] = held;
      }
    }
    for (let i = c + 1; i < PARAMS; i++) {
      const f = a[i * WIDTH + c] / a[c * WIDTH + c];
      for (let k = c; k < WIDTH; k++) a[i * WIDTH + k] -= f * a[c * WIDTH + k];
    }
  }
  for (let i = PARAMS - 1; i >= 0; i--) {
    let s = a[i * WIDTH + PARAMS];
    for (let k = i + 1; k < PARAMS; k++) s -= a[i * WIDTH + k] * solution[k];
    solution[i] = s / a[i * WIDTH + i];
  }
  return true;
}

function setRow(row: number, values: readonly [number, number, number, number, number, number]): void {
  for (let k = 0; k < WIDTH; k++) system[row * WIDTH + k] = values[k];
}

/** Squared error of the best fit with the stop from tauEnd to tauStart over samples first..last. */
function fitError(times: readonly number[], y: readonly number[], tauEnd: number, tauStart: number, first: number, last: number): number {
  // Normal equations for the columns 1, d₋², d₋⁴, d₊², d₊⁴ (a side's columns are zero outside it):
  // Σd², Σd⁴, Σd⁶, Σd⁸, Σv·d², Σv·d⁴ before the stop (a) and after it (b).
  let [a0, a1, a2, a3, a4, a5] = [0, 0, 0, 0, 0, 0];
  let [b0, b1, b2, b3, b4, b5] = [0, 0, 0, 0, 0, 0];
  let n = 0;
  let sumV = 0;
  let sumV2 = 0;
  // Heights relative to the first sample keep the squared-error sum free of cancellation.
  const offset = y[first];
  for (let i = first; i <= last; i++) {
    const v = y[i] - offset;
    const t = times[i];
    n++;
    sumV += v;
    sumV2 += v * v;
    const d = t < tauEnd ? t - tauEnd : t > tauStart ? t - tauStart : 0;
    if (d === 0) continue;
    const d2 = d * d;
    const d4 = d2 * d2;
    if (d < 0) {
      a0 += d2;
      a1 += d4;
      a2 += d4 * d2;
      a3 += d4 * d4;
      a4 += v * d2;
      a5 += v * d4;
    } else {
      b0 += d2;
      b1 += d4;
      b2 += d4 * d2;
      b3 += d4 * d4;
      b4 += v * d2;
      b5 += v * d4;
    }
  }
  // A side without samples leaves its columns empty; a tiny ridge keeps the system solvable.
  const ridge = 1e-12;
  setRow(0, [n + ridge, a0, a1, b0, b1, sumV]);
  setRow(1, [a0, a1 + ridge, a2, 0, 0, a4]);
  setRow(2, [a1, a2, a3 + ridge, 0, 0, a5]);
  setRow(3, [b0, 0, 0, b1 + ridge, b2, b4]);
  setRow(4, [b1, 0, 0, b2, b3 + ridge, b5]);
  if (!solve()) return Infinity;
  // SSE = vᵀv − pᵀ(Xᵀv) for the least-squares solution.
  const r = [sumV, a4, a5, b4, b5];
  let fitted = 0;
  for (let k = 0; k < PARAMS; k++) fitted += solution[k] * r[k];
  return sumV2 - fitted;
}

/**
 * Each side of a fit spans this share of the time to the neighbouring edge, at most MAX_SIDE_S:
 * within about 40 % of a phase a quadratic-plus-quartic follows a smooth start or stop closely
 * (further out a sticking dip bends the curve away), and the fit's precision grows quickly with
 * its span. Tuned on the synthetic sets: spans of a quarter second left about twice the timing error.
 */
const SIDE_SHARE = 0.4;
const MAX_SIDE_S = 0.5;
/**
 * A side is widened by the length of bridged samples inside it (gaps.ts), up to this share of
 * the time to the neighbouring edge, so a lost stretch of the track next to an edge does not
 * leave the fit with too few seen samples. The bridged samples themselves stay in the fit: their
 * cubic keeps the speed at the gap's edges, which is the best guess of the motion inside.
 */
const MAX_WIDENED_SHARE = 0.75;
/** An end and the next start closer than this are fitted together as one stop (a touch-and-go bottom, a short lockout). */
export const JOINT_STOP_S = 0.4;
/** An edge may move at most this share of its window side from the first estimate. */
const SEARCH_SHARE = 0.3;

interface Stop {
  /** Indices into the estimates: the end of motion, the start of motion (either may be absent). */
  end: number | null;
  start: number | null;
}

/**
 * Pairs each end with the start that follows it in motion order when the two are close (or
 * crossed: noise can put the estimated start of a touch-and-go just before the end); every other
 * edge stands alone with rest on its far side.
 */
function stopsOf(estimates: readonly EdgeEstimate[]): Stop[] {
  const stops: Stop[] = [];
  for (let k = 0; k < estimates.length; k++) {
    const e = estimates[k];
    const next = estimates[k + 1];
    if (e.kind === "end" && next?.kind === "start" && next.t - e.t < JOINT_STOP_S) {
      stops.push({ end: k, start: k + 1 });
      k++;
    } else {
      stops.push(e.kind === "end" ? { end: k, start: null } : { end: null, start: k });
    }
  }
  return stops;
}

/** Times of a stop: [end of motion, start of motion], equal for a lone edge and for crossed estimates. */
type Taus = [number, number];

function stopSpan(stop: Stop, estimates: readonly EdgeEstimate[]): Taus {
  const tEnd = estimates[stop.end ?? (stop.start as number)].t;
  const tStart = estimates[stop.start ?? (stop.end as number)].t;
  return tEnd <= tStart ? [tEnd, tStart] : [(tEnd + tStart) / 2, (tEnd + tStart) / 2];
}

/** Minimises f over a grid from lo to hi, then refines the best point by a parabola through its neighbours. */
function minimise(f: (tau: number) => number, lo: number, hi: number, step: number, fallback: number): number {
  let best = fallback;
  let bestError = f(fallback);
  const grid: [number, number][] = [];
  for (let tau = lo; tau <= hi + 1e-12; tau += step) grid.push([tau, f(tau)]);
  let k = -1;
  grid.forEach(([tau, e], i) => {
    if (e < bestError) [best, bestError, k] = [tau, e, i];
  });
  if (k <= 0 || k >= grid.length - 1) return best;
  const [e0, e1, e2] = [grid[k - 1][1], grid[k][1], grid[k + 1][1]];
  const curvature = e0 - 2 * e1 + e2;
  // The vertex stays within half a step of the best grid point when both neighbours are higher.
  return Number.isFinite(curvature) && curvature > 0 ? best + (step * (e0 - e2)) / (2 * curvature) : best;
}

/**
 * Refined times for the edge estimates of a set, in the order the bar passes them (starts and ends
 * alternating). `seen` marks samples observed rather than bridged (all when omitted). Each fit
 * spans a share of the time to the neighbouring edges, so a pause between two stops is fitted as
 * rest and neighbouring phases do not leak in. An end and a start closer than JOINT_STOP_S share
 * one fit with a rest between them; both times are searched in turn (two rounds), which settles
 * because the two sides of the fit barely interact.
 */
export function refineEdges(times: readonly number[], y: readonly number[], estimates: readonly EdgeEstimate[], seen?: readonly boolean[]): number[] {
  const refined = estimates.map((e) => e.t);
  if (times.length < PARAMS + 2 || estimates.length === 0) return refined;
  const dt = times[1] - times[0];
  const index = (t: number) => Math.min(times.length - 1, Math.max(0, Math.round((t - times[0]) / dt)));
  const bridgedS = (from: number, to: number) => {
    let count = 0;
    if (seen) for (let i = index(from); i <= index(to); i++) if (!seen[i]) count++;
    return count * dt;
  };
  const stops = stopsOf(estimates);
  stops.forEach((stop, k) => {
    const [tEnd, tStart] = stopSpan(stop, estimates);
    const toBefore = tEnd - (k > 0 ? stopSpan(stops[k - 1], estimates)[1] : -Infinity);
    const toAfter = (k < stops.length - 1 ? stopSpan(stops[k + 1], estimates)[0] : Infinity) - tStart;
    const baseLeft = Math.min(MAX_SIDE_S, SIDE_SHARE * toBefore);
    const baseRight = Math.min(MAX_SIDE_S, SIDE_SHARE * toAfter);
    const left = Math.min(baseLeft + bridgedS(tEnd - baseLeft, tEnd), MAX_WIDENED_SHARE * toBefore);
    const right = Math.min(baseRight + bridgedS(tStart, tStart + baseRight), MAX_WIDENED_SHARE * toAfter);
    const [first, last] = [index(tEnd - left), index(tStart + right)];
    if (last - first < PARAMS + 2) return;
    const error = ([e, s]: Taus) => fitError(times, y, e, s, first, last);
    const taus = fitStop(error, stop, [tEnd, tStart], [SEARCH_SHARE * left, SEARCH_SHARE * right], dt / 4);
    if (stop.end !== null) refined[stop.end] = taus[0];
    if (stop.start !== null) refined[stop.start] = taus[1];
  });
  return refined;
}

function fitStop(error: (taus: Taus) => number, stop: Stop, [tEnd, tStart]: Taus, [reachLeft, reachRight]: Taus, step: number): Taus {
  // A lone edge has rest on its far side: its neighbouring edges are too far away to be part of this stop.
  if (stop.start === null) {
    const tau = minimise((u) => error([u, Infinity]), tEnd - reachLeft, tEnd + reachRight, step, tEnd);
    return [tau, tau];
  }
  if (stop.end === null) {
    const tau = minimise((u) => error([-Infinity, u]), tStart - reachLeft, tStart + reachRight, step, tStart);
    return [tau, tau];
  }
  let [e, s] = [tEnd, tStart];
  for (let round = 0; round < 2; round++) {
    e = minimise((u) => error([u, s]), tEnd - reachLeft, Math.min(s, tEnd + reachRight), step, Math.min(e, s));
    s = minimise((u) => error([e, u]), Math.max(e, tStart - reachLeft), tStart + reachRight, step, Math.max(s, e));
  }
  return [e, s];
}
