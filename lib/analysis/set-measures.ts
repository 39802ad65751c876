// Set measures: best and last rep speed, velocity loss, consistency of start position and bar
// path, and the published estimates (reps in reserve, %1RM, 1RM) each quoted with its source.
import type { Point } from "./angles";
import { brzyckiOneRepMax, epleyOneRepMax, estimateOneRepMaxFromVelocity, estimatePercentOneRepMax, estimateRepsInReserve, type ReferenceValue } from "./references";
import type { RepResult, SetResult } from "./result";
import { median } from "./timeline";
import type { Lift } from "./track";

type RepInput = Omit<RepResult, "flags">;

export interface SetMeasures {
  set: Omit<SetResult, "flags">;
  medianRomM: number | null;
  startDistanceCm: (number | null)[];
  startTorsoDiffDeg: (number | null)[];
}

/** Each start's distance from the median start (cm); null for a set of one. */
function startDistancesCm(starts: Point[]): (number | null)[] {
  if (starts.length < 2) return starts.map(() => null);
  const mid = { x: median(starts.map((p) => p.x)), y: median(starts.map((p) => p.y)) };
  return starts.map((p) => 100 * Math.hypot(p.x - mid.x, p.y - mid.y));
}

function startTorsoDiffs(reps: RepInput[]): (number | null)[] {
  const angles = reps.map((r) => r.torsoAngleAtStartDeg);
  const seen = angles.filter((a): a is number => a !== null);
  if (seen.length < 2) return reps.map(() => null);
  const mid = median(seen);
  return angles.map((a) => (a === null ? null : a - mid));
}

/** Mean over reps of the RMS distance (cm) between the rep's bar path and the set's mean path, both over 0–100 % of the rep. */
function barPathConsistencyCm(reps: RepInput[]): number | null {
  const paths = reps.flatMap((r) => (r.series.barXM && r.series.barYM ? [{ x: r.series.barXM, y: r.series.barYM }] : []));
  if (paths.length < 2) return null;
  const n = paths[0].x.length;
  const meanX = Array.from({ length: n }, (_, k) => paths.reduce((s, p) => s + p.x[k], 0) / paths.length);
  const meanY = Array.from({ length: n }, (_, k) => paths.reduce((s, p) => s + p.y[k], 0) / paths.length);
  const rms = paths.map((p) => Math.sqrt(p.x.reduce((s, x, k) => s + (x - meanX[k]) ** 2 + (p.y[k] - meanY[k]) ** 2, 0) / n));
  return (100 * rms.reduce((s, v) => s + v, 0)) / rms.length;
}

const asKg = (r: ReferenceValue | null) => (r ? { valueKg: r.value, source: r.source } : null);

function oneRepMax(lift: Lift, loadKg: number | null, bestMps: number | null, repCount: number, rirReps: number | null): SetResult["estimatedOneRepMaxKg"] {
  if (loadKg === null || repCount === 0) return null;
  const repsCounted = repCount + Math.max(0, Math.round(rirReps ?? 0));
  return {
    loadKg,
    repsCounted,
    fromVelocity: bestMps === null ? null : asKg(estimateOneRepMaxFromVelocity(lift, loadKg, bestMps)),
    epley: asKg(epleyOneRepMax(loadKg, repsCounted)),
    brzycki: asKg(brzyckiOneRepMax(loadKg, repsCounted)),
    note:
      "Epley and Brzycki assume a set taken to failure, so they use the reps done plus the estimated reps in reserve " +
      `(${repsCounted} here); the load–velocity estimate uses the best rep's mean concentric velocity. Cross-checks, not a tested max.`,
  };
}

export function measureSet(lift: Lift, reps: RepInput[], starts: Point[], loadKg: number | null): SetMeasures {
  const velocities = reps.map((r) => r.meanConcentricVelocityMps);
  const best = velocities.length > 0 ? Math.max(...velocities) : null;
  const last = velocities.length > 0 ? velocities[velocities.length - 1] : null;
  const distances = startDistancesCm(starts);
  const torsoDiffs = startTorsoDiffs(reps);
  const seenDistances = distances.filter((d): d is number => d !== null);
  const seenTorso = torsoDiffs.filter((d): d is number => d !== null);
  const rir = reps.length >= 2 ? estimateRepsInReserve(lift, velocities) : null;
  const percent = best === null ? null : estimatePercentOneRepMax(lift, best);
  return {
    set: {
      repCount: reps.length,
      bestMeanVelocityMps: best,
      lastMeanVelocityMps: last,
      velocityLossPct: best !== null && last !== null && reps.length >= 2 && best > 0 ? (100 * (best - last)) / best : null,
      startPositionSpreadCm: seenDistances.length > 0 ? Math.max(...seenDistances) : null,
      startTorsoAngleSpreadDeg: seenTorso.length > 0 ? Math.max(...seenTorso) - Math.min(...seenTorso) : null,
      barPathConsistencyCm: barPathConsistencyCm(reps),
      estimatedRepsInReserve: rir,
      estimatedPercentOneRepMax: percent && best !== null ? { percent: percent.percent, velocityMps: best, source: percent.source } : null,
      estimatedOneRepMaxKg: oneRepMax(lift, loadKg, best, reps.length, rir?.reps ?? null),
    },
    medianRomM: reps.length >= 2 ? median(reps.map((r) => r.romM)) : null,
    startDistanceCm: distances,
    startTorsoDiffDeg: torsoDiffs,
  };
}
