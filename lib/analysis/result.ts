// The analysis result: what analyseTrack returns, the worker posts and the server validates
// before saving. SI units in every name; null means "not measurable in this view", never a guess.
import { z } from "zod";
import { FAULT_CODES } from "./faults";
import { CAMERA_VIEWS, LIFTS } from "./track";

export const ENGINE_VERSION = "1.0.0";
export const SERIES_POINTS = 101;

const num = z.number();
const maybe = num.nullable();
const series = z.array(num).length(SERIES_POINTS).nullable();
const sourced = <T extends z.ZodRawShape>(shape: T) => z.object({ ...shape, source: z.string().min(1) });

export const flagSchema = z.object({
  code: z.enum(FAULT_CODES),
  rep: z.number().int().positive().nullable(),
  message: z.string().min(1),
  threshold: num,
  value: num,
  unit: z.string(),
  source: z.string().min(1),
});
export type Flag = z.infer<typeof flagSchema>;

const atStartBottomLockout = <P extends string>(prefix: P) =>
  ({
    [`${prefix}AtStartDeg`]: maybe,
    [`${prefix}AtBottomDeg`]: maybe,
    [`${prefix}AtLockoutDeg`]: maybe,
  }) as Record<`${P}AtStartDeg` | `${P}AtBottomDeg` | `${P}AtLockoutDeg`, typeof maybe>;

export const repSeriesSchema = z.object({
  pct: z.array(num).length(SERIES_POINTS),
  barXM: series,
  barYM: series,
  barVelocityMps: series,
  kneeAngleDeg: series,
  hipAngleDeg: series,
  torsoAngleDeg: series,
});
export type RepSeries = z.infer<typeof repSeriesSchema>;

export const repResultSchema = z.object({
  index: z.number().int().positive(),
  startS: num,
  endS: num,
  eccentricStartS: num,
  eccentricEndS: num,
  concentricStartS: num,
  concentricEndS: num,
  bottomS: num,
  romM: num,
  meanConcentricVelocityMps: num,
  peakConcentricVelocityMps: num,
  meanPropulsiveVelocityMps: num,
  propulsiveDurationS: num,
  concentricDurationS: num,
  eccentricDurationS: num,
  pauseDurationS: maybe,
  stickingPoint: z.object({ timeS: num, heightM: num, velocityMps: num }).nullable(),
  maxHorizontalDeviationCm: num,
  netHorizontalDriftCm: num,
  pathLengthM: num,
  benchPathShapeCm: maybe,
  ...atStartBottomLockout("kneeAngle"),
  ...atStartBottomLockout("hipAngle"),
  ...atStartBottomLockout("ankleAngle"),
  ...atStartBottomLockout("torsoAngle"),
  ...atStartBottomLockout("shinAngle"),
  hipRiseIndex: maybe,
  depthReached: z.boolean().nullable(),
  depthMarginCm: maybe,
  barOverMidFootOffsetCm: maybe,
  barOverMidFootMethod: z.enum(["heel-toe", "ankle-estimate"]).nullable(),
  kneeProjectionAngleDeg: maybe,
  kneeProjectionAngleLeftDeg: maybe,
  kneeProjectionAngleRightDeg: maybe,
  stanceToShoulderWidthRatio: maybe,
  leftRightAsymmetry: z
    .object({ kneeProjectionDiffDeg: maybe, hipShiftCm: maybe, shoulderTiltDeg: maybe, wristHeightDiffCm: maybe })
    .nullable(),
  /** Share of the rep's samples with a seen (not bridged) bar position. */
  barCoverage: num.min(0).max(1),
  flags: z.array(flagSchema),
  series: repSeriesSchema,
});
export type RepResult = z.infer<typeof repResultSchema>;

const sourcedValueKg = sourced({ valueKg: num }).nullable();

export const setResultSchema = z.object({
  repCount: z.number().int().min(0),
  bestMeanVelocityMps: maybe,
  lastMeanVelocityMps: maybe,
  velocityLossPct: maybe,
  startPositionSpreadCm: maybe,
  startTorsoAngleSpreadDeg: maybe,
  barPathConsistencyCm: maybe,
  estimatedRepsInReserve: sourced({ reps: num }).nullable(),
  estimatedPercentOneRepMax: sourced({ percent: num, velocityMps: num }).nullable(),
  estimatedOneRepMaxKg: z
    .object({
      loadKg: num.positive(),
      repsCounted: z.number().int().min(1),
      fromVelocity: sourcedValueKg,
      epley: sourcedValueKg,
      brzycki: sourcedValueKg,
      note: z.string(),
    })
    .nullable(),
  flags: z.array(flagSchema),
});
export type SetResult = z.infer<typeof setResultSchema>;

export const faultThresholdSchema = z.object({ value: num, unit: z.string(), rule: z.string(), source: z.string().min(1) });

export const analysisResultSchema = z.object({
  engineVersion: z.string(),
  settings: z.object({
    lift: z.enum(LIFTS),
    view: z.enum(CAMERA_VIEWS),
    sampleRateHz: num.positive(),
    cutoffHz: num.positive(),
    filterOrder: z.number().int().positive(),
    savgolWindow: z.number().int().positive(),
    savgolPolyOrder: z.number().int().min(0),
    minScore: num,
    maxGapS: num,
    barSource: z.enum(["tracked", "pose-estimate"]),
    side: z.enum(["left", "right"]).nullable(),
    horizontalAxis: z.enum(["toward-feet", "image-right"]),
    loadKg: num.positive().nullable(),
    thresholds: z.record(z.enum(FAULT_CODES), faultThresholdSchema),
  }),
  scale: z.object({
    metresPerPixel: num.positive(),
    method: z.enum(["plate", "scale", "athlete-height"]),
    uncertaintyPct: num.min(0),
    note: z.string(),
  }),
  cautions: z.array(z.string()),
  notes: z.array(z.string()),
  reps: z.array(repResultSchema),
  set: setResultSchema,
  frames: z.array(z.object({ t: num, bar: z.object({ x: num, y: num }).nullable() })).optional(),
});
export type AnalysisResult = z.infer<typeof analysisResultSchema>;
