// The analysis engine's entry point, shared by the worker, the command line and the server:
// track in, reps with phases and measures, set measures, fault flags and cautions out.
import { z } from "zod";
import { resolveScale, type Scale } from "./calibration";
import { bridgeTrackGaps } from "./gaps";
import { FAULT_CODES, repFlags, resolveThresholds, setFlags, type FaultCode, type FlagContext } from "./faults";
import { buildKinematics, FILTER_ORDER, MIN_SAMPLES, SAVGOL_POLY_ORDER, type Kinematics } from "./kinematics";
import { nearerSide } from "./orientation";
import { frontMeasures, sideAngles } from "./posture";
import { measureRep, type RepContext } from "./rep-measures";
import { detectReps } from "./reps";
import { DEFAULT_MAX_GAP_S, DEFAULT_MIN_SCORE, medianFrameIntervalS, resampleTrack } from "./resample";
import { analysisResultSchema, ENGINE_VERSION, type AnalysisResult, type RepResult } from "./result";
import { repSeries } from "./series";
import { measureSet } from "./set-measures";
import { valueAt } from "./timeline";
import { parseTrack, type Track } from "./track";

/** Low-pass cutoff for bar and joint positions (Winter, Biomechanics and Motor Control of Human Movement: about 6 Hz for gross limb motion). */
export const DEFAULT_CUTOFF_HZ = 6;

const thresholdOverridesSchema = z
  .object(Object.fromEntries(FAULT_CODES.map((c) => [c, z.number().optional()])) as Record<FaultCode, z.ZodOptional<z.ZodNumber>>)
  .strict();

export const analysisOptionsSchema = z
  .object({
    cutoffHz: z.number().gt(0).max(30).optional(),
    sampleRateHz: z.number().gt(0).max(1000).optional(),
    minScore: z.number().min(0).max(1).optional(),
    maxGapS: z.number().gt(0).max(5).optional(),
    /** Load on the bar; enables the 1RM estimates. */
    loadKg: z.number().gt(0).max(1000).optional(),
    thresholds: thresholdOverridesSchema.optional(),
    /** Include the smoothed bar position per sample (image pixels) for drawing the trace. */
    includeFrames: z.boolean().optional(),
  })
  .strict();
export type AnalysisOptions = z.input<typeof analysisOptionsSchema>;

/**
 * Smallest jump (share of the image diagonal) the resampler may drop as a one-frame outlier. Half
 * the resampler's default: a tracked bar at rest jitters well under a pixel, and a 1 % slip of the
 * tracker would otherwise pass as several centimetres of bar drift (common practice).
 */
const OUTLIER_FLOOR_DIAGONAL_SHARE = 0.005;
/** Up to this many frame intervals the resampler's straight-line bridge is kept (one lost frame). */
const LINEAR_BRIDGE_INTERVALS = 2.5;

/** Bad analysis options; the message names the option and what is wrong. */
export class AnalysisOptionsError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "AnalysisOptionsError";
  }
}

function parseOptions(options: unknown): z.output<typeof analysisOptionsSchema> {
  const result = analysisOptionsSchema.safeParse(options ?? {});
  if (result.success) return result.data;
  const issue = result.error.issues[0];
  throw new AnalysisOptionsError(`options.${issue.path.join(".") || "(root)"}: ${issue.message}`);
}

/** Validates the track (an object or its JSON text; throws TrackInputError) and analyses it. */
export function analyseTrack(track: unknown, options: AnalysisOptions = {}): AnalysisResult {
  return analyseParsedTrack(parseTrack(track), options);
}

/** Analyses a track that parseTrack has already returned, without validating it again. */
export function analyseParsedTrack(input: Track, options: AnalysisOptions = {}): AnalysisResult {
  const opts = parseOptions(options);
  const minScore = opts.minScore ?? DEFAULT_MIN_SCORE;
  const maxGapS = opts.maxGapS ?? DEFAULT_MAX_GAP_S;
  // Resample bridging only single lost frames; longer gaps get a cubic bridge (gaps.ts).
  const linearGapS = LINEAR_BRIDGE_INTERVALS * medianFrameIntervalS(input);
  const outlierFloorPx = OUTLIER_FLOOR_DIAGONAL_SHARE * Math.hypot(input.width, input.height);
  const resampled = resampleTrack(input, { sampleRateHz: opts.sampleRateHz, minScore, maxGapS: Math.min(maxGapS, linearGapS), outlierFloorPx });
  const uniform = bridgeTrackGaps(resampled, maxGapS);
  const scale = resolveScale(input.calibration, uniform);
  const { lift, view } = input;
  const side = view === "side" ? nearerSide(input) : null;
  const kin = buildKinematics({ uniform, scale, lift, view, side, cutoffHz: opts.cutoffHz ?? DEFAULT_CUTOFF_HZ, observed: resampled });
  const hasBar = kin.bar.valid.some(Boolean);
  const phases = hasBar && kin.times.length >= MIN_SAMPLES ? detectReps(lift, kin.times, kin.bar.y, kin.bar.vy, kin.bar.yRaw, kin.bar.seen) : [];
  const ctx: RepContext = { kin, lift, view, side: view === "side" ? sideAngles(kin) : null, front: view === "front" ? frontMeasures(kin) : null };
  const reps = phases.map((p, k) => ({ index: k + 1, ...measureRep(ctx, p), series: repSeries(kin, ctx.side, p) }));
  const starts = phases.map((p) => ({ x: valueAt(kin.times, kin.bar.x, p.startS), y: valueAt(kin.times, kin.bar.y, p.startS) }));
  const loadKg = opts.loadKg ?? null;
  const measured = measureSet(lift, reps, starts, loadKg);
  const thresholds = resolveThresholds(opts.thresholds);
  const flagCtx: FlagContext = { lift, view, thresholds, ...measured };
  const repResults: RepResult[] = reps.map((r, k) => ({ ...r, flags: repFlags(flagCtx, r, k) }));
  const result: AnalysisResult = {
    engineVersion: ENGINE_VERSION,
    settings: {
      lift,
      view,
      sampleRateHz: kin.sampleRateHz,
      cutoffHz: kin.cutoffHz,
      filterOrder: FILTER_ORDER,
      savgolWindow: kin.savgolWindow,
      savgolPolyOrder: SAVGOL_POLY_ORDER,
      minScore,
      maxGapS,
      barSource: kin.barSource,
      side,
      horizontalAxis: kin.facing.axis,
      loadKg,
      thresholds,
    },
    scale,
    cautions: cautions(input, kin, scale, repResults),
    notes: notes(input, kin, scale, repResults),
    reps: repResults,
    set: { ...measured.set, flags: setFlags(flagCtx, measured.set) },
    ...(opts.includeFrames ? { frames: frames(kin, scale) } : {}),
  };
  return analysisResultSchema.parse(result);
}

/** Smoothed bar position back in image pixels (y down), null where the bar was not seen. */
function frames(kin: Kinematics, scale: Scale): NonNullable<AnalysisResult["frames"]> {
  const k = kin.facing.sign / scale.metresPerPixel;
  return kin.times.map((t, i) => ({
    t,
    bar: kin.bar.valid[i] ? { x: kin.bar.x[i] * k, y: -kin.bar.y[i] / scale.metresPerPixel } : null,
  }));
}

function cautions(track: Track, kin: Kinematics, scale: Scale, reps: RepResult[]): string[] {
  const out = [
    "These measures are estimates from video, not medical advice.",
    "If a lift causes pain, stop and see a licensed health professional such as a physician or physiotherapist.",
    "2-D video cannot see spinal flexion (rounding of the back) or any movement along the camera's line of sight.",
    track.view === "side"
      ? "From the side, knees moving inward, left–right differences and the bar's sideways tilt cannot be judged."
      : "From the front, depth, joint angles in the side plane and the bar's path front to back cannot be judged.",
  ];
  if (track.lift === "squat" && track.view === "side") {
    out.push("Squat depth is estimated from hip and knee keypoints; only a judge's view of the IPF rule decides a lift.");
  }
  if (kin.barSource === "pose-estimate") {
    out.push(`No bar was tracked: bar position is estimated from the athlete's ${track.lift === "squat" ? "shoulders" : "wrists"}, so bar path and speed are estimates.`);
  }
  if (scale.method === "athlete-height") {
    out.push(`The scale comes from the athlete's height: distances and speeds may be off by ${scale.uncertaintyPct.toFixed(0)} % or more. Calibrate from a plate for measurement.`);
  }
  const patchy = reps.filter((r) => r.barCoverage < 0.8).map((r) => r.index);
  if (patchy.length > 0) out.push(`The bar was not seen for part of rep ${patchy.join(", ")}: those measures are less certain.`);
  if (reps.length === 0) out.push("No reps were found: check that the whole bar path is in frame and the bar is tracked.");
  return out;
}

function notes(track: Track, kin: Kinematics, scale: Scale, reps: RepResult[]): string[] {
  const out = [
    scale.note,
    `Positions are low-passed at ${kin.cutoffHz.toFixed(1)} Hz (Butterworth, order ${FILTER_ORDER}, run forward and back); ` +
      `velocity is a Savitzky–Golay derivative (${kin.savgolWindow} samples, order ${SAVGOL_POLY_ORDER}). Mean propulsive velocity ends where the bar decelerates faster than 9.81 m/s² (Sánchez-Medina et al. 2010).`,
    kin.facing.axis === "toward-feet"
      ? `Horizontal distances are positive toward the athlete's feet (orientation from ${kin.facing.basis}).`
      : "Horizontal distances are positive toward the right of the image.",
  ];
  if (track.lift === "squat" && track.view === "side") {
    out.push(
      "Depth margin: height of the knee keypoint above the hip keypoint at the bottom, an approximation from joint centres of the IPF rule " +
        "(top surface of the legs at the hip joint lower than the top of the knees).",
    );
  }
  if (reps.some((r) => r.barOverMidFootMethod === "ankle-estimate")) {
    out.push("Mid-foot estimated from the ankle keypoint (no heel or toe keypoints): about a quarter foot length ahead of the ankle.");
  }
  if (track.view === "front" && track.lift !== "bench") {
    out.push("Knee projection angles are read only while the thigh is seen at length (not at the very bottom of a deep squat, where it points at the camera).");
  }
  return out;
}
