// Least-squares circle fits: the algebraic (Kasa) fit as a start, then geometric Gauss-Newton.

export interface Point {
  x: number;
  y: number;
}

export interface Circle {
  cx: number;
  cy: number;
  radius: number;
}

/** Circle through three points; null when they are (nearly) collinear. */
export function circleThroughPoints(a: Point, b: Point, c: Point): Circle | null {
  const d = 2 * (a.x * (b.y - c.y) + b.x * (c.y - a.y) + c.x * (a.y - b.y));
  if (Math.abs(d) < 1e-9) return null;
  const a2 = a.x * a.x + a.y * a.y;
  const b2 = b.x * b.x + b.y * b.y;
  const c2 = c.x * c.x + c.y * c.y;
  const cx = (a2 * (b.y - c.y) + b2 * (c.y - a.y) + c2 * (a.y - b.y)) / d;
  const cy = (a2 * (c.x - b.x) + b2 * (a.x - c.x) + c2 * (b.x - a.x)) / d;
  return { cx, cy, radius: Math.hypot(a.x - cx, a.y - cy) };
}

/** Solves the 3x3 system m * v = r by Cramer's rule; null when singular. */
function solve3(m: number[][], r: number[]): [number, number, number] | null {
  const det = (a: number[][]): number =>
    a[0][0] * (a[1][1] * a[2][2] - a[1][2] * a[2][1]) -
    a[0][1] * (a[1][0] * a[2][2] - a[1][2] * a[2][0]) +
    a[0][2] * (a[1][0] * a[2][1] - a[1][1] * a[2][0]);
  const d = det(m);
  if (Math.abs(d) < 1e-12) return null;
  const column = (k: number) => m.map((row, i) => row.map((v, j) => (j === k ? r[i] : v)));
  return [det(column(0)) / d, det(column(1)) / d, det(column(2)) / d];
}

/** Algebraic fit: minimises sum (x^2 + y^2 + D x + E y + F)^2 (Kasa 1976). */
export function kasaFit(points: Point[]): Circle | null {
  if (points.length < 3) return null;
  // Centre the points first so the normal equations stay well conditioned.
  const mx = points.reduce((s, p) => s + p.x, 0) / points.length;
  const my = points.reduce((s, p) => s + p.y, 0) / points.length;
  const m = [
    [0, 0, 0],
    [0, 0, 0],
    [0, 0, 0],
  ];
  const r = [0, 0, 0];
  for (const p of points) {
    const x = p.x - mx;
    const y = p.y - my;
    const row = [x, y, 1];
    const z = -(x * x + y * y);
    for (let i = 0; i < 3; i++) {
      r[i] += row[i] * z;
      for (let j = 0; j < 3; j++) m[i][j] += row[i] * row[j];
    }
  }
  const v = solve3(m, r);
  if (!v) return null;
  const [D, E, F] = v;
  const cx = -D / 2;
  const cy = -E / 2;
  const r2 = cx * cx + cy * cy - F;
  if (!(r2 > 0)) return null;
  return { cx: cx + mx, cy: cy + my, radius: Math.sqrt(r2) };
}

/** Geometric fit: minimises sum (|p - c| - R)^2 by Gauss-Newton from the algebraic fit. */
export function fitCircle(points: Point[], iterations = 10): Circle | null {
  let circle = kasaFit(points);
  if (!circle) return null;
  for (let it = 0; it < iterations; it++) {
    const m = [
      [0, 0, 0],
      [0, 0, 0],
      [0, 0, 0],
    ];
    const g = [0, 0, 0];
    for (const p of points) {
      const dx = p.x - circle.cx;
      const dy = p.y - circle.cy;
      const d = Math.hypot(dx, dy);
      if (d < 1e-9) continue;
      const jac = [-dx / d, -dy / d, -1];
      const residual = d - circle.radius;
      for (let i = 0; i < 3; i++) {
        g[i] -= jac[i] * residual;
        for (let j = 0; j < 3; j++) m[i][j] += jac[i] * jac[j];
      }
    }
    const step = solve3(m, g);
    if (!step) break;
    circle = { cx: circle.cx + step[0], cy: circle.cy + step[1], radius: circle.radius + step[2] };
    if (Math.hypot(step[0], step[1], step[2]) < 1e-6) break;
  }
  return circle.radius > 0 ? circle : null;
}
