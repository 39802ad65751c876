// Options of one pipeline run, validated with zod because they arrive from worker messages and
// command-line flags. Coordinates are in pixels of the original clip (y down).
import { z } from "zod";
import { FULL_SIZE_PLATE_DIAMETER_M } from "@/lib/analysis/calibration";
import { CAMERA_VIEWS, LIFTS } from "@/lib/analysis/track";
import { DEFAULT_POSE_MODEL, PRECISE_POSE_MODEL, type PoseModelId } from "@/lib/pose/constants";
import { PipelineError } from "./errors";

const finite = z.number().finite();
const pixels = finite.min(0);

/** One tap on the plate or sleeve end, or the plate's circle when it is already known. */
export const barMarkSchema = z.discriminatedUnion("kind", [
  z.object({ kind: z.literal("tap"), x: pixels, y: pixels }),
  z.object({ kind: z.literal("plate"), cx: pixels, cy: pixels, radiusPx: finite.gt(0) }),
]);
export type BarMark = z.infer<typeof barMarkSchema>;

/**
 * How often pose runs. "adaptive": as often as fits in `realTimeShare` of the clip's duration once
 * decoding and tracking are paid for, and never more than `maxPoseShare` of it, timed as the run
 * goes, so the whole analysis keeps up with playback; "every-frame": the precise mode;
 * "interval": fixed spacing in clip seconds.
 */
export const poseScheduleSchema = z.discriminatedUnion("kind", [
  z.object({
    kind: z.literal("adaptive"),
    realTimeShare: finite.min(0.1).max(4).default(0.9),
    maxPoseShare: finite.min(0.05).max(4).default(0.5),
  }),
  z.object({ kind: z.literal("every-frame") }),
  z.object({ kind: z.literal("interval"), intervalS: finite.gt(0).max(1) }),
]);
export type PoseSchedule = z.infer<typeof poseScheduleSchema>;

export const pipelineOptionsSchema = z.object({
  lift: z.enum(LIFTS),
  view: z.enum(CAMERA_VIEWS),
  /** The clip as stored (display size, after rotation); frames may arrive smaller. */
  source: z.object({
    width: z.number().int().positive().max(16_384),
    height: z.number().int().positive().max(16_384),
    fps: finite.gt(0).max(1000).nullable().default(null),
    durationS: finite.gt(0).nullable().default(null),
  }),
  bar: barMarkSchema.nullable().default(null),
  plateDiameterM: finite.gt(0).max(1).default(FULL_SIZE_PLATE_DIAMETER_M),
  athleteHeightM: finite.min(1).max(2.5).optional(),
  poseSchedule: poseScheduleSchema.default({ kind: "adaptive", realTimeShare: 0.9, maxPoseShare: 0.5 }),
});
export type PipelineOptions = z.input<typeof pipelineOptionsSchema>;
export type ResolvedPipelineOptions = z.output<typeof pipelineOptionsSchema>;

export function parsePipelineOptions(input: unknown): ResolvedPipelineOptions {
  const parsed = pipelineOptionsSchema.safeParse(input);
  if (parsed.success) return parsed.data;
  const issue = parsed.error.issues[0];
  throw new PipelineError("bad-options", `${issue.path.join(".") || "options"}: ${issue.message}`);
}

/** Default: MoveNet Lightning on a real-time budget; precise: BlazePose full on every frame. */
export function posePlanFor(precise: boolean): { model: PoseModelId; poseSchedule: PoseSchedule } {
  return precise
    ? { model: PRECISE_POSE_MODEL, poseSchedule: { kind: "every-frame" } }
    : { model: DEFAULT_POSE_MODEL, poseSchedule: { kind: "adaptive", realTimeShare: 0.9, maxPoseShare: 0.5 } };
}
