// Refines the times a phase starts or ends from the unfiltered bar height. The low-pass filter
// smears the moment the bar leaves rest, and velocity thresholds drown in noise when the bar
// starts slowly; a local fit of the height around the turn uses every sample near it instead.
//
// Model around a stop from τ₁ (motion ends) to τ₂ ≥ τ₁ (motion starts again), velocity zero at
// both: y = y0 + a₋d² + c₋d⁴ for d = t − τ₁ < 0, y0 between τ₁ and τ₂, and y0 + a₊d² + c₊d⁴ for
// d = t − τ₂ > 0. τ₁ = τ₂ is a turn without a pause; a side with a = c = 0 is a bar at rest. Even
// powers only, because odd ones would let the curve mimic a shifted turn. The times are searched
// on a grid a quarter sample apart and the best one is refined by a parabola through its error.

/** Parameters of the stop model: y0 and two coefficients per side. */
const PARAMS = 5;

/** An edge to refine: where motion ends (the bar comes to a stop or turns) or starts. */
export interface EdgeEstimate {
  t: number;
  kind: "start" | "end";
}

/** Solves the normal equations of a small least-squares problem; null if singular. */
function solve(m: number[][], r: number[]): number[] | null {
  const n = r.length;
  const a = m.map((row, i) => [...row, r[i]]);
  for (let c = 0; c < n; c++) {
    let p = c;
    for (let i = c + 1; i < n; i++) if (Math.abs(a[i][c]) > Math.abs(a[p][c])) p = i;
    if (Math.abs(a[p][c]) < 1e-12) return null;
    [a[c], a[p]] = [a[p], a[c]];
    for (let i = c + 1; i < n; i++) {
      const f = a[i][c] / a[c][c];
      for (let k = c; k <= n; k++) a[i][k] -= f * a[c][k];
    }
  }
  const x = new Array<number>(n).fill(0);
  for (let i = n - 1; i >= 0; i--) {
    let s = a[i][n];
    for (let k = i + 1; k < n; k++) s -= a[i][k] * x[k];
    x[i] = s / a[i][i];
  }
  return x;
}

/** Squared error of the best fit with the stop from tauEnd to tauStart over samples first..last. */
function fitError(times: readonly number[], y: readonly number[], tauEnd: number, tauStart: number, first: number, last: number, weight: (t: number) => number = () => 1, quartic: [boolean, boolean] = [true, true]): number {
  // Normal equations for the columns 1, d₋², d₋⁴, d₊², d₊⁴ (a side's columns are zero outside it).
  const side = [new Float64Array(6), new Float64Array(6)]; // Σd², Σd⁴, Σd⁶, Σd⁸, Σv·d², Σv·d⁴ per side
  let n = 0;
  let sumV = 0;
  let sumV2 = 0;
  // Heights relative to a sample of the window keep the squared-error sum free of cancellation.
  let offset = NaN;
  for (let i = first; i <= last && Number.isNaN(offset); i++) offset = y[i];
  for (let i = first; i <= last; i++) {
    // Samples inside a bridged gap (NaN) were not seen and carry no information.
    if (Number.isNaN(y[i])) continue;
    const v = y[i] - offset;
    const t = times[i];
    const w = weight(t);
    n += w;
    sumV += w * v;
    sumV2 += w * v * v;
    const d = t < tauEnd ? t - tauEnd : t > tauStart ? t - tauStart : 0;
    if (d === 0) continue;
    const d2 = d * d;
    const sd = d < 0 ? 0 : 1;
    const d4 = quartic[sd] ? d2 * d2 : 0;
    const acc = side[sd];
    acc[0] += w * d2;
    acc[1] += w * d4;
    acc[2] += w * d4 * d2;
    acc[3] += w * d4 * d4;
    acc[4] += w * v * d2;
    acc[5] += w * v * d4;
  }
  const [a, b] = side;
  // A side without samples leaves its columns empty; a tiny ridge keeps the system solvable.
  const ridge = 1e-12;
  const m = [
    [n + ridge, a[0], a[1], b[0], b[1]],
    [a[0], a[1] + ridge, a[2], 0, 0],
    [a[1], a[2], a[3] + ridge, 0, 0],
    [b[0], 0, 0, b[1] + ridge, b[2]],
    [b[1], 0, 0, b[2], b[3] + ridge],
  ];
  const r = [sumV, a[4], a[5], b[4], b[5]];
  const p = solve(m, r);
  if (!p) return Infinity;
  // SSE = vᵀv − pᵀ(Xᵀv) for the least-squares solution.
  return sumV2 - p.reduce((s, c, k) => s + c * r[k], 0);
}

/**
 * Largest span of samples used on the moving side of an edge. Within about half a phase a
 * quadratic-plus-quartic follows a smooth start or stop closely, and the fit's precision grows
 * quickly with its span (tuned on the synthetic sets: 0.25 s left twice the timing error).
 */
const MAX_SIDE_S = Number(process.env.MAXSIDE ?? 0.5);
const SIDE_FRACTION = Number(process.env.SIDEFRAC ?? 0.5);
/** An end and the next start closer than this are fitted together as one stop (a touch-and-go bottom, a short lockout). */
export const JOINT_STOP_S = Number(process.env.JOINT ?? 0.4);
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
 * Refined times for a sorted list of edge estimates (every phase start and end of the set). Each
 * fit uses samples up to halfway to the neighbouring edges (at most MAX_SIDE_S), so a pause
 * between two stops is fitted as rest and neighbouring phases do not leak in. An end and a start
 * closer than JOINT_STOP_S share one fit with a rest between them; both times are searched in
 * turn (two rounds), which settles because the two sides of the fit barely interact.
 */
export function refineEdges(times: readonly number[], y: readonly number[], estimates: readonly EdgeEstimate[]): number[] {
  let out = estimates.map((e) => e.t);
  for (let pass = 0; pass < Number(process.env.PASSES ?? 1); pass++) out = refinePass(times, y, estimates.map((e, i) => ({ ...e, t: out[i] })));
  return out;
}

function refinePass(times: readonly number[], y: readonly number[], estimates: readonly EdgeEstimate[]): number[] {
  const refined = estimates.map((e) => e.t);
  if (times.length < PARAMS + 2 || estimates.length === 0) return refined;
  const dt = times[1] - times[0];
  const index = (t: number) => Math.min(times.length - 1, Math.max(0, Math.round((t - times[0]) / dt)));
  const stops = stopsOf(estimates);
  stops.forEach((stop, k) => {
    const [tEnd, tStart] = stopSpan(stop, estimates);
    const before = k > 0 ? stopSpan(stops[k - 1], estimates)[1] : -Infinity;
    const after = k < stops.length - 1 ? stopSpan(stops[k + 1], estimates)[0] : Infinity;
    const unseen = (from: number, to: number) => {
      let c = 0;
      for (let i = index(from); i <= index(to); i++) if (Number.isNaN(y[i])) c++;
      return c * dt;
    };
    const GAPX = Number(process.env.GAPX ?? 0);
    let left = Math.min(MAX_SIDE_S, (tEnd - before) * SIDE_FRACTION);
    let right = Math.min(MAX_SIDE_S, (after - tStart) * SIDE_FRACTION);
    if (GAPX) {
      left = Math.min(left + unseen(tEnd - left, tEnd), GAPX * (tEnd - before));
      right = Math.min(right + unseen(tStart, tStart + right), GAPX * (after - tStart));
    }
    const [first, last] = [index(tEnd - left), index(tStart + right)];
    if (last - first < PARAMS + 2) return;
    const K = process.env.KERNEL ?? "none";
    const weight = (t: number) => {
      const u = t < tEnd ? (tEnd - t) / left : t > tStart ? (t - tStart) / right : 0;
      if (K === "epan") return Math.max(0, 1 - u * u);
      if (K === "tri") return Math.max(0, (1 - u ** 3)) ** 3;
      if (K === "lin") return Math.max(0, 1 - u);
      return 1;
    };
    const QG = Number(process.env.QGAP ?? 0);
    const quartic: [boolean, boolean] = QG ? [unseen(tEnd - left, tEnd + 0.1) < QG, unseen(tStart - 0.1, tStart + right) < QG] : [true, true];
    const error = ([e, s]: Taus) => fitError(times, y, e, s, first, last, weight, quartic);
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
