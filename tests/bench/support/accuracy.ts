// Compares an analysis of a synthetic clip with the clip's ground truth, for the benchmark printouts.
import type { ClipTruth } from "@/tests/fixtures/clips/generate-clip";

export interface BarFrame {
  t: number;
  bar: { x: number; y: number } | null;
}

export interface RepMeasure {
  concentricStartS: number;
  meanConcentricVelocityMps: number;
}

export interface Accuracy {
  barRmsCm: number;
  barFrames: number;
  repsFound: number;
  /** Truth reps with an analysed rep whose concentric phase starts within 0.25 s. */
  repsMatched: number;
  repsTrue: number;
  maxVelocityErrorMps: number;
}

export function accuracy(frames: BarFrame[], metresPerPixel: number, reps: RepMeasure[], truth: ClipTruth): Accuracy {
  const first = frames.find((f) => f.bar)?.bar;
  const squares = frames.flatMap((f, i) => {
    if (!f.bar || !first) return [];
    const dx = (f.bar.x - first.x) * metresPerPixel - truth.frames[i].xM;
    const dy = (f.bar.y - first.y) * metresPerPixel - truth.frames[i].yM;
    return [dx * dx + dy * dy];
  });
  let repsMatched = 0;
  let maxVelocityErrorMps = 0;
  for (const rep of truth.reps) {
    const found = reps.find((r) => Math.abs(r.concentricStartS - rep.concentricStartS) < 0.25);
    if (!found) continue;
    repsMatched += 1;
    maxVelocityErrorMps = Math.max(maxVelocityErrorMps, Math.abs(found.meanConcentricVelocityMps - rep.meanConcentricVelocityMps));
  }
  return {
    barRmsCm: 100 * Math.sqrt(squares.reduce((s, v) => s + v, 0) / Math.max(1, squares.length)),
    barFrames: squares.length,
    repsFound: reps.length,
    repsMatched,
    repsTrue: truth.reps.length,
    maxVelocityErrorMps,
  };
}

export function describeAccuracy(a: Accuracy): string {
  return (
    `bar RMS ${a.barRmsCm.toFixed(3)} cm over ${a.barFrames} frames; reps ${a.repsFound} found, ` +
    `${a.repsMatched} of ${a.repsTrue} true matched; worst mean concentric velocity error ${a.maxVelocityErrorMps.toFixed(4)} m/s`
  );
}
