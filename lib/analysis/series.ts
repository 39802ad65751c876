// Per-rep curves resampled to 0–100 % of the rep (101 points), so reps and sets of different
// speed can be laid over each other in rep compare.
import type { Kinematics } from "./kinematics";
import type { SideAngles } from "./posture";
import type { RepPhases } from "./reps";
import { SERIES_POINTS, type RepSeries } from "./result";
import { valueAt } from "./timeline";

/** A curve with more unseen points than this share is left out rather than drawn from guesses (common practice). */
const MAX_MISSING_SHARE = 0.1;

export const SERIES_PCT: number[] = Array.from({ length: SERIES_POINTS }, (_, k) => (100 * k) / (SERIES_POINTS - 1));

/** Fills isolated NaN points by linear interpolation (nearest value at the ends); null if too many are missing. */
function filled(values: number[]): number[] | null {
  const known = values.map((v, i) => [i, v] as const).filter(([, v]) => Number.isFinite(v));
  if (known.length === 0 || values.length - known.length > MAX_MISSING_SHARE * values.length) return null;
  let k = 0;
  return values.map((v, i) => {
    if (Number.isFinite(v)) return v;
    while (k < known.length - 1 && known[k + 1][0] < i) k++;
    const [i0, v0] = known[k];
    const next = known[k + 1];
    if (i < i0 || !next) return v0;
    return v0 + ((next[1] - v0) * (i - i0)) / (next[0] - i0);
  });
}

export function repSeries(kin: Kinematics, side: SideAngles | null, p: RepPhases): RepSeries {
  const ts = SERIES_PCT.map((pct) => p.startS + (pct / 100) * (p.endS - p.startS));
  const sample = (values: number[]) => ts.map((t) => valueAt(kin.times, values, t));
  const relative = (values: number[]) => {
    const v0 = valueAt(kin.times, values, p.startS);
    return sample(values).map((v) => v - v0);
  };
  return {
    pct: [...SERIES_PCT],
    barXM: filled(relative(kin.bar.x)),
    barYM: filled(relative(kin.bar.y)),
    barVelocityMps: filled(sample(kin.bar.vy)),
    kneeAngleDeg: side ? filled(sample(side.kneeDeg)) : null,
    hipAngleDeg: side ? filled(sample(side.hipDeg)) : null,
    torsoAngleDeg: side ? filled(sample(side.torsoDeg)) : null,
  };
}
