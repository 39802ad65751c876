// Refines the time a phase starts or ends from the unfiltered bar height. The low-pass filter
// smears the moment the bar leaves rest, and velocity thresholds drown in noise when the bar
// starts slowly; a local fit of the height around the turn uses every sample near it instead.
//
// Model around a turn at time τ (velocity zero there): y = y0 + a₋d² + c₋d⁴ for d = t − τ < 0 and
// y0 + a₊d² + c₊d⁴ for d ≥ 0. It covers a bar at rest on one side (a = c = 0) as well as a bar
// passing smoothly through its turn; even powers only, because odd ones would let the curve mimic a
// shifted turn. τ is the grid point (a quarter sample apart) with the smallest squared error.

/** Parameters of the turn model: y0 and two coefficients per side. */
const PARAMS = 5;

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

/** Squared error of the best fit with the turn at tau over samples first..last. */
function fitError(times: readonly number[], y: readonly number[], tau: number, first: number, last: number): number {
  // Normal equations for the columns 1, d₋², d₋⁴, d₊², d₊⁴ (one side's columns are zero on the other side).
  const side = [new Float64Array(6), new Float64Array(6)]; // Σd², Σd⁴, Σd⁶, Σd⁸, Σv·d², Σv·d⁴ per side
  let n = 0;
  let sumV = 0;
  let sumV2 = 0;
  // Heights relative to the first sample keep the squared-error sum free of cancellation.
  const offset = y[first];
  for (let i = first; i <= last; i++) {
    const d = times[i] - tau;
    const d2 = d * d;
    const d4 = d2 * d2;
    const v = y[i] - offset;
    const acc = side[d < 0 ? 0 : 1];
    acc[0] += d2;
    acc[1] += d4;
    acc[2] += d4 * d2;
    acc[3] += d4 * d4;
    acc[4] += v * d2;
    acc[5] += v * d4;
    n++;
    sumV += v;
    sumV2 += v * v;
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

/** Largest span of samples used on one side of a turn. */
const MAX_SIDE_S = 0.25;
/** Turns closer than this are one turn: a touch-and-go bottom, or a lockout lowered at once. */
export const MERGE_TURNS_S = 0.1;
/** The turn may move at most this share of its window side from the first estimate. */
const SEARCH_SHARE = 0.3;

/**
 * Refined times for a sorted list of turn estimates (every phase start and end of the set).
 * Estimates closer than MERGE_TURNS_S share one refined time. Each fit uses samples up to
 * halfway to the neighbouring turns, so a pause between two turns is fitted as rest.
 */
export function refineTurns(times: readonly number[], y: readonly number[], estimates: readonly number[]): number[] {
  if (times.length < PARAMS + 2 || estimates.length === 0) return [...estimates];
  const groups: number[][] = [];
  for (const t of estimates) {
    const g = groups[groups.length - 1];
    if (g && t - g[g.length - 1] < MERGE_TURNS_S) g.push(t);
    else groups.push([t]);
  }
  const centres = groups.map((g) => g.reduce((s, t) => s + t, 0) / g.length);
  const dt = times[1] - times[0];
  const index = (t: number) => Math.min(times.length - 1, Math.max(0, Math.round((t - times[0]) / dt)));
  const refined = centres.map((t, k) => {
    const left = Math.min(MAX_SIDE_S, k > 0 ? (t - centres[k - 1]) / 2 : MAX_SIDE_S);
    const right = Math.min(MAX_SIDE_S, k < centres.length - 1 ? (centres[k + 1] - t) / 2 : MAX_SIDE_S);
    const [first, last] = [index(t - left), index(t + right)];
    if (last - first < PARAMS + 2) return t;
    let best = t;
    let bestError = fitError(times, y, t, first, last);
    for (let tau = t - SEARCH_SHARE * left; tau <= t + SEARCH_SHARE * right; tau += dt / 4) {
      const e = fitError(times, y, tau, first, last);
      if (e < bestError) [best, bestError] = [tau, e];
    }
    return best;
  });
  return groups.flatMap((g, k) => g.map(() => refined[k]));
}
