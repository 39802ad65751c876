// The difference table of rep compare: each measure of every compared rep against the first (reference)
// rep, flagged when the difference passes a threshold the viewer can edit. Thresholds are in SI-style
// stored units (m/s, °, cm, s, m); the page converts lengths for display only.

export type MeasureKind = "velocity" | "angle" | "lengthCm" | "lengthM" | "duration";

export interface CompareMeasure {
  key: string;
  label: string;
  kind: MeasureKind;
  /** Flag a difference whose absolute size is past this (in the stored unit). */
  defaultThreshold: number;
  thresholdSource: string;
}

const COMMON = "common practice";

export const COMPARE_MEASURES = [
  { key: "meanConcentricVelocityMps", label: "Mean concentric velocity", kind: "velocity", defaultThreshold: 0.05, thresholdSource: COMMON },
  { key: "peakConcentricVelocityMps", label: "Peak concentric velocity", kind: "velocity", defaultThreshold: 0.1, thresholdSource: COMMON },
  { key: "romM", label: "Bar range of motion", kind: "lengthM", defaultThreshold: 0.03, thresholdSource: COMMON },
  { key: "concentricDurationS", label: "Concentric time", kind: "duration", defaultThreshold: 0.2, thresholdSource: COMMON },
  { key: "eccentricDurationS", label: "Eccentric time", kind: "duration", defaultThreshold: 0.3, thresholdSource: COMMON },
  { key: "maxHorizontalDeviationCm", label: "Max bar drift from the plumb line", kind: "lengthCm", defaultThreshold: 2, thresholdSource: COMMON },
  { key: "netHorizontalDriftCm", label: "Bar drift at lockout", kind: "lengthCm", defaultThreshold: 2, thresholdSource: COMMON },
  { key: "torsoAngleAtStartDeg", label: "Torso angle at start", kind: "angle", defaultThreshold: 5, thresholdSource: COMMON },
  { key: "torsoAngleAtBottomDeg", label: "Torso angle at bottom", kind: "angle", defaultThreshold: 5, thresholdSource: COMMON },
  { key: "kneeAngleAtBottomDeg", label: "Knee angle at bottom", kind: "angle", defaultThreshold: 5, thresholdSource: COMMON },
  { key: "hipAngleAtBottomDeg", label: "Hip angle at bottom", kind: "angle", defaultThreshold: 5, thresholdSource: COMMON },
  { key: "hipAngleAtStartDeg", label: "Hip angle at start", kind: "angle", defaultThreshold: 5, thresholdSource: COMMON },
  { key: "depthMarginCm", label: "Depth margin", kind: "lengthCm", defaultThreshold: 3, thresholdSource: COMMON },
  { key: "barOverMidFootOffsetCm", label: "Bar over mid-foot offset", kind: "lengthCm", defaultThreshold: 3, thresholdSource: COMMON },
] as const satisfies readonly CompareMeasure[];

export type CompareMeasureKey = (typeof COMPARE_MEASURES)[number]["key"];
export type RepMeasures = Record<CompareMeasureKey, number | null>;
export type Thresholds = Record<CompareMeasureKey, number>;

export function defaultThresholds(): Thresholds {
  return Object.fromEntries(COMPARE_MEASURES.map((m) => [m.key, m.defaultThreshold])) as Thresholds;
}

export interface DifferenceCell {
  value: number | null;
  /** value minus the reference rep's value; null when either is missing. */
  difference: number | null;
  pastThreshold: boolean;
}

export interface DifferenceRow {
  measure: (typeof COMPARE_MEASURES)[number];
  reference: number | null;
  others: DifferenceCell[];
}

/** One row per measure that at least one rep has; the first rep is the reference. */
export function differenceTable(reps: readonly RepMeasures[], thresholds: Thresholds): DifferenceRow[] {
  const [reference, ...others] = reps;
  if (!reference) return [];
  return COMPARE_MEASURES.flatMap((measure) => {
    const ref = reference[measure.key];
    if (ref === null && others.every((rep) => rep[measure.key] === null)) return [];
    const cells = others.map((rep) => {
      const value = rep[measure.key];
      const difference = value === null || ref === null ? null : value - ref;
      return { value, difference, pastThreshold: difference !== null && Math.abs(difference) > thresholds[measure.key] };
    });
    return [{ measure, reference: ref, others: cells }];
  });
}
