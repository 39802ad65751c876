// Smoothing filters for kinematic signals: Butterworth design, zero-lag
// forward-backward filtering and Savitzky-Golay smoothing/differentiation.
// Each function reproduces the SciPy routine it names (checked against SciPy
// fixtures in tests/fixtures/scipy/); they are written here rather than taken
// from npm because the packages found (fili, ml-savitzky-golay) use other
// edge handling and filter structures, so their outputs differ from SciPy's.

type Complex = [re: number, im: number];

const cMul = (a: Complex, b: Complex): Complex => [a[0] * b[0] - a[1] * b[1], a[0] * b[1] + a[1] * b[0]];
const cDiv = (a: Complex, b: Complex): Complex => {
  const d = b[0] * b[0] + b[1] * b[1];
  return [(a[0] * b[0] + a[1] * b[1]) / d, (a[1] * b[0] - a[0] * b[1]) / d];
};

/** Coefficients of the monic polynomial with the given roots, highest power first (numpy.poly). */
function polyFromRoots(roots: Complex[]): Complex[] {
  let coeffs: Complex[] = [[1, 0]];
  for (const r of roots) {
    const next: Complex[] = [...coeffs.map((c): Complex => [c[0], c[1]]), [0, 0]];
    for (let i = 0; i < coeffs.length; i++) {
      const t = cMul(coeffs[i], r);
      next[i + 1] = [next[i + 1][0] - t[0], next[i + 1][1] - t[1]];
    }
    coeffs = next;
  }
  return coeffs;
}

function assertFiniteArray(x: readonly number[], name: string): void {
  const bad = x.findIndex((v) => !Number.isFinite(v));
  if (bad >= 0) throw new RangeError(`${name}[${bad}]: expected a finite number, got ${x[bad]}`);
}

/**
 * Digital low-pass Butterworth design, equal to
 * `scipy.signal.butter(order, cutoffHz, fs=sampleRateHz)`: analogue prototype
 * poles, pre-warped cutoff, bilinear transform, expanded to b/a polynomials.
 * `order` is the designed order N (N poles); -3 dB at cutoffHz for one pass.
 */
export function butter(order: number, cutoffHz: number, sampleRateHz: number): { b: number[]; a: number[] } {
  if (!Number.isInteger(order) || order < 1 || order > 8) {
    throw new RangeError(`butter: order must be an integer from 1 to 8, got ${order}`);
  }
  const nyquistHz = sampleRateHz / 2;
  if (!(sampleRateHz > 0) || !(cutoffHz > 0) || !(cutoffHz < nyquistHz)) {
    throw new RangeError(
      `butter: cutoff must lie between 0 and the Nyquist frequency (${nyquistHz} Hz at ${sampleRateHz} Hz sampling), got ${cutoffHz} Hz`,
    );
  }
  // SciPy works at a normalised fs = 2, so the bilinear constant 2*fs is 4.
  const warped = 4 * Math.tan((Math.PI * (cutoffHz / nyquistHz)) / 2);
  const analoguePoles: Complex[] = [];
  for (let m = -order + 1; m < order; m += 2) {
    const angle = (Math.PI * m) / (2 * order);
    analoguePoles.push([-Math.cos(angle) * warped, -Math.sin(angle) * warped]);
  }
  const digitalPoles = analoguePoles.map((p) => cDiv([4 + p[0], p[1]], [4 - p[0], -p[1]]));
  let gain: Complex = [warped ** order, 0];
  for (const p of analoguePoles) gain = cDiv(gain, [4 - p[0], -p[1]]);
  const zeros: Complex[] = Array.from({ length: order }, () => [-1, 0]);
  const b = polyFromRoots(zeros).map((c) => gain[0] * c[0]);
  const a = polyFromRoots(digitalPoles).map((c) => c[0]);
  return { b, a };
}

/** Direct-form II transposed IIR filter (scipy.signal.lfilter with initial state). */
function lfilter(b: number[], a: number[], x: ArrayLike<number>, zi: number[]): Float64Array {
  const z = Float64Array.from(zi);
  const y = new Float64Array(x.length);
  const n = b.length;
  for (let i = 0; i < x.length; i++) {
    const xi = x[i];
    const yi = b[0] * xi + (n > 1 ? z[0] : 0);
    for (let k = 1; k < n - 1; k++) z[k - 1] = b[k] * xi + z[k] - a[k] * yi;
    if (n > 1) z[n - 2] = b[n - 1] * xi - a[n - 1] * yi;
    y[i] = yi;
  }
  return y;
}

/** Solves M v = rhs by Gaussian elimination with partial pivoting (small dense systems). */
function solveLinear(matrix: number[][], rhs: number[]): number[] {
  const n = rhs.length;
  const m = matrix.map((row, i) => [...row, rhs[i]]);
  for (let col = 0; col < n; col++) {
    let pivot = col;
    for (let r = col + 1; r < n; r++) if (Math.abs(m[r][col]) > Math.abs(m[pivot][col])) pivot = r;
    [m[col], m[pivot]] = [m[pivot], m[col]];
    for (let r = col + 1; r < n; r++) {
      const f = m[r][col] / m[col][col];
      for (let c = col; c <= n; c++) m[r][c] -= f * m[col][c];
    }
  }
  const v = new Array<number>(n).fill(0);
  for (let r = n - 1; r >= 0; r--) {
    let s = m[r][n];
    for (let c = r + 1; c < n; c++) s -= m[r][c] * v[c];
    v[r] = s / m[r][r];
  }
  return v;
}

/** Steady-state initial conditions for a step input (scipy.signal.lfilter_zi). */
function lfilterZi(b: number[], a: number[]): number[] {
  const n = b.length;
  const matrix = Array.from({ length: n - 1 }, (_, i) =>
    Array.from({ length: n - 1 }, (_, j) => (i === j ? 1 : 0) + (j === 0 ? a[i + 1] : 0) - (j === i + 1 ? 1 : 0)),
  );
  const rhs = Array.from({ length: n - 1 }, (_, i) => b[i + 1] - a[i + 1] * b[0]);
  return solveLinear(matrix, rhs);
}

/** Normalises a[0] to 1 and pads b and a to the same length, as SciPy does. */
function normaliseCoefficients(b: number[], a: number[]): { b: number[]; a: number[] } {
  if (a.length === 0 || a[0] === 0) throw new RangeError("filtfilt: a[0] must be non-zero");
  const n = Math.max(a.length, b.length);
  const pad = (v: number[]) => [...v.map((c) => c / a[0]), ...new Array<number>(n - v.length).fill(0)];
  return { b: pad(b), a: pad(a) };
}

/**
 * Zero-phase forward-backward filtering, equal to
 * `scipy.signal.filtfilt(b, a, x)` (padtype "odd", method "pad", padlen
 * 3 * max(len(a), len(b))). SciPy refuses inputs no longer than padlen; here
 * padlen shrinks to len(x) - 1 instead, which equals
 * `filtfilt(b, a, x, padlen=len(x) - 1)`, so short clips still get smoothed.
 */
export function filtfilt(b: number[], a: number[], x: number[]): number[] {
  assertFiniteArray(x, "filtfilt input");
  if (x.length === 0) return [];
  const coeffs = normaliseCoefficients(b, a);
  const edge = Math.min(3 * coeffs.b.length, x.length - 1);
  const last = x.length - 1;
  // Odd extension: the signal, with point-mirrored copies of its ends before and after it.
  const extended = new Float64Array(x.length + 2 * edge);
  for (let i = 0; i < edge; i++) extended[i] = 2 * x[0] - x[edge - i];
  extended.set(x, edge);
  for (let i = 0; i < edge; i++) extended[edge + x.length + i] = 2 * x[last] - x[last - 1 - i];
  const zi = lfilterZi(coeffs.b, coeffs.a);
  const forward = lfilter(coeffs.b, coeffs.a, extended, zi.map((z) => z * extended[0]));
  forward.reverse();
  const backward = lfilter(coeffs.b, coeffs.a, forward, zi.map((z) => z * forward[0]));
  backward.reverse();
  return Array.from(backward.subarray(edge, edge + x.length));
}

/**
 * Zero-lag low-pass Butterworth filter: `butter(order, cutoffHz)` applied
 * forward and backward by filtfilt.
 *
 * What "order" means: `order` is the designed order of the filter run in each
 * direction. The double pass squares the magnitude response, so the effective
 * order is 2 * order and the gain at cutoffHz is -6 dB (not -3 dB), with no
 * phase lag. The defaults (designed 4th order, 6 Hz) follow the request for a
 * 4th-order Butterworth run forward and back; Winter (Biomechanics and Motor
 * Control of Human Movement, 4th ed., 2009, ch. 2) describes the same idea
 * with a 2nd-order design run twice ("fourth-order zero-lag"), which order = 2
 * reproduces, and places cutoffs for gross limb and bar movement near 6 Hz.
 */
export function lowPassZeroLag(x: number[], sampleRateHz: number, cutoffHz = 6, order = 4): number[] {
  const { b, a } = butter(order, cutoffHz, sampleRateHz);
  return filtfilt(b, a, x);
}

/**
 * Pseudo-inverse rows of the least-squares polynomial fit over one window,
 * with offsets scaled to [-1, 1] so the fit stays well conditioned.
 * Returns P ((polyOrder + 1) x windowLength) with fitted coefficients = P * window.
 */
function polyFitPseudoInverse(windowLength: number, polyOrder: number, scale: number): number[][] {
  const half = (windowLength - 1) / 2;
  const cols = polyOrder + 1;
  // Columns of the Vandermonde matrix, orthonormalised by modified Gram-Schmidt run twice.
  const q = Array.from({ length: cols }, (_, j) =>
    Array.from({ length: windowLength }, (_, k) => ((k - half) / scale) ** j),
  );
  const r = Array.from({ length: cols }, () => new Array<number>(cols).fill(0));
  for (let j = 0; j < cols; j++) {
    for (let pass = 0; pass < 2; pass++) {
      for (let i = 0; i < j; i++) {
        const dot = q[i].reduce((s, v, k) => s + v * q[j][k], 0);
        r[i][j] += dot;
        for (let k = 0; k < windowLength; k++) q[j][k] -= dot * q[i][k];
      }
    }
    const norm = Math.hypot(...q[j]);
    r[j][j] = norm;
    for (let k = 0; k < windowLength; k++) q[j][k] /= norm;
  }
  // P = R^-1 Q^T by back substitution.
  const p = Array.from({ length: cols }, () => new Array<number>(windowLength).fill(0));
  for (let i = cols - 1; i >= 0; i--) {
    for (let k = 0; k < windowLength; k++) {
      let s = q[i][k];
      for (let j = i + 1; j < cols; j++) s -= r[i][j] * p[j][k];
      p[i][k] = s / r[i][i];
    }
  }
  return p;
}

/** Weights giving the deriv-th derivative of the window's fitted polynomial at `offset` samples from its centre. */
function evaluationWeights(p: number[][], offset: number, deriv: number, scale: number, deltaS: number): number[] {
  const weights = new Array<number>(p[0].length).fill(0);
  for (let j = deriv; j < p.length; j++) {
    let factor = 1;
    for (let m = 0; m < deriv; m++) factor *= j - m;
    const c = (factor * (offset / scale) ** (j - deriv)) / (scale * deltaS) ** deriv;
    for (let k = 0; k < weights.length; k++) weights[k] += c * p[j][k];
  }
  return weights;
}

function dot(weights: number[], x: number[], start: number): number {
  let s = 0;
  for (let k = 0; k < weights.length; k++) s += weights[k] * x[start + k];
  return s;
}

/**
 * Savitzky-Golay smoothing or differentiation, equal to
 * `scipy.signal.savgol_filter(x, windowLength, polyOrder, deriv, delta=deltaS, mode="interp")`:
 * a least-squares polynomial over each window; the first and last
 * windowLength/2 samples come from the polynomial fitted to the first and last
 * full window. windowLength must be odd (SciPy also accepts even lengths).
 */
export function savitzkyGolay(x: number[], windowLength: number, polyOrder: number, deriv = 0, deltaS = 1): number[] {
  assertFiniteArray(x, "savitzkyGolay input");
  if (!Number.isInteger(windowLength) || windowLength < 1 || windowLength % 2 === 0) {
    throw new RangeError(`savitzkyGolay: windowLength must be a positive odd integer, got ${windowLength}`);
  }
  if (!Number.isInteger(polyOrder) || polyOrder < 0 || polyOrder >= windowLength) {
    throw new RangeError(`savitzkyGolay: polyOrder must be an integer from 0 to windowLength - 1, got ${polyOrder}`);
  }
  if (!Number.isInteger(deriv) || deriv < 0 || deriv > polyOrder) {
    throw new RangeError(`savitzkyGolay: deriv must be an integer from 0 to polyOrder, got ${deriv}`);
  }
  if (!(deltaS > 0)) throw new RangeError(`savitzkyGolay: deltaS must be greater than 0, got ${deltaS}`);
  if (windowLength > x.length) {
    throw new RangeError(`savitzkyGolay: windowLength (${windowLength}) must not exceed the input length (${x.length})`);
  }
  const half = (windowLength - 1) / 2;
  const scale = Math.max(half, 1);
  const p = polyFitPseudoInverse(windowLength, polyOrder, scale);
  const centre = evaluationWeights(p, 0, deriv, scale, deltaS);
  const y = x.map((_, i) => (i < half || i >= x.length - half ? 0 : dot(centre, x, i - half)));
  const lastStart = x.length - windowLength;
  for (let i = 0; i < half; i++) {
    y[i] = dot(evaluationWeights(p, i - half, deriv, scale, deltaS), x, 0);
    y[lastStart + half + 1 + i] = dot(evaluationWeights(p, i + 1, deriv, scale, deltaS), x, lastStart);
  }
  return y;
}
