// Video mode of `npm run analyse -- --video <clip> ...`: decodes the clip with ffmpeg, runs the same
// pipeline as the browser worker with the Node pose detector, then the analysis engine. The output
// is the track mode's JSON, with `frames` holding the tracked bar for every decoded frame.
import { z } from "zod";
import { analyseParsedTrack } from "@/lib/analysis/analyse";
import type { AnalysisResult } from "@/lib/analysis/result";
import { CAMERA_VIEWS, LIFTS } from "@/lib/analysis/track";
import { createNodePoseDetector } from "@/lib/pose/node";
import { PoseWeightsMissingError } from "@/lib/pose/model-files";
import {
  checkPipelineOptions,
  PipelineError,
  posePlanFor,
  runPipeline,
  type BarMark,
  type ClipFrame,
  type PipelineResult,
} from "@/lib/pipeline";
import { decodeFrames, probeVideo, VideoDecodeError, type VideoInfo } from "@/lib/video/ffmpeg-frames";

/** Same frame width as the browser worker, so both give the same answer. */
const DEFAULT_MAX_FRAME_WIDTH_PX = 640;

/** node:util parseArgs options of video mode (all strings are checked by videoArgsSchema). */
export const VIDEO_MODE_ARG_OPTIONS = {
  video: { type: "string" },
  lift: { type: "string" },
  view: { type: "string" },
  bar: { type: "string" },
  plate: { type: "string" },
  "plate-diameter-m": { type: "string" },
  "athlete-height-m": { type: "string" },
  "max-frame-width": { type: "string" },
  precise: { type: "boolean" },
} as const;

/** Lines for the command's help text. */
export const VIDEO_MODE_USAGE = [
  "",
  "   or: npm run analyse -- --video <clip> --lift squat|bench|deadlift --view side|front [options]",
  "",
  "  --bar <x,y>              tap on the plate or sleeve end in the first frame (clip pixels); its rim calibrates",
  "  --plate <cx,cy,r>        the plate's circle in the first frame instead of a tap (clip pixels)",
  "                           (neither: the bar is estimated from the athlete's pose, labelled as an estimate)",
  "  --plate-diameter-m <m>   plate diameter (default 0.45, a full-size plate)",
  "  --athlete-height-m <m>   scale from the athlete's height when no plate is marked (wider error)",
  "  --precise                BlazePose full on every frame instead of MoveNet Lightning on a real-time budget",
  "  --max-frame-width <px>   frames are scaled down to this width for tracking and pose (default 640)",
].join("\n");

export class VideoModeInputError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "VideoModeInputError";
  }
}

const numberList = (count: number, names: string) =>
  z
    .string()
    .transform((text) => text.split(",").map((part) => (part.trim() === "" ? Number.NaN : Number(part))))
    .refine((values) => values.length === count && values.every(Number.isFinite), {
      message: `expected ${count} numbers separated by commas (${names}), in pixels of the clip`,
    });

const positiveNumber = (what: string) =>
  z
    .string()
    .transform(Number)
    .refine((v) => Number.isFinite(v) && v > 0, { message: `expected ${what}` });

const videoArgsSchema = z
  .object({
    video: z.string({ error: "required: the clip's path" }).min(1),
    lift: z.enum(LIFTS, { error: `required: one of ${LIFTS.join(", ")}` }),
    view: z.enum(CAMERA_VIEWS, { error: `required: one of ${CAMERA_VIEWS.join(", ")}` }),
    bar: numberList(2, "x,y").optional(),
    plate: numberList(3, "cx,cy,r").optional(),
    "plate-diameter-m": positiveNumber("a plate diameter in metres").optional(),
    "athlete-height-m": positiveNumber("a height in metres").optional(),
    "max-frame-width": positiveNumber("a width in pixels").pipe(z.number().int().min(64)).optional(),
    precise: z.boolean().optional(),
    "load-kg": positiveNumber("a load in kilograms").optional(),
  })
  .refine((a) => !(a.bar && a.plate), { message: "give either --bar or --plate, not both", path: ["bar"] });

export interface VideoModeArgs {
  videoPath: string;
  lift: (typeof LIFTS)[number];
  view: (typeof CAMERA_VIEWS)[number];
  bar: BarMark | null;
  plateDiameterM?: number;
  athleteHeightM?: number;
  maxFrameWidthPx: number;
  precise: boolean;
  loadKg?: number;
}

/** Checks parseArgs values of video mode; throws VideoModeInputError naming the flag. */
export function parseVideoModeArgs(values: Record<string, string | boolean | undefined>): VideoModeArgs {
  const parsed = videoArgsSchema.safeParse(values);
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    throw new VideoModeInputError(`--${issue.path.join(".")}: ${issue.message}`);
  }
  const a = parsed.data;
  const bar: BarMark | null = a.plate
    ? { kind: "plate", cx: a.plate[0], cy: a.plate[1], radiusPx: a.plate[2] }
    : a.bar
      ? { kind: "tap", x: a.bar[0], y: a.bar[1] }
      : null;
  return {
    videoPath: a.video,
    lift: a.lift,
    view: a.view,
    bar,
    plateDiameterM: a["plate-diameter-m"],
    athleteHeightM: a["athlete-height-m"],
    maxFrameWidthPx: a["max-frame-width"] ?? DEFAULT_MAX_FRAME_WIDTH_PX,
    precise: a.precise ?? false,
    loadKg: a["load-kg"],
  };
}

async function* clipFrames(videoPath: string, maxWidth: number): AsyncGenerator<ClipFrame> {
  for await (const decoded of decodeFrames(videoPath, { maxWidth })) {
    yield { tS: decoded.tS, frame: { width: decoded.width, height: decoded.height, data: decoded.rgba } };
  }
}

export interface VideoModeRun {
  info: VideoInfo;
  pipeline: PipelineResult;
  poseModel: string;
  /** Track mode's JSON; `frames` holds the tracked bar of every decoded frame (clip pixels). */
  output: AnalysisResult;
}

/** The bar per decoded frame when it was tracked; the analysis's smoothed estimate otherwise. */
function outputFrames(pipeline: PipelineResult, analysis: AnalysisResult): AnalysisResult["frames"] {
  if (pipeline.barSource === "pose-estimate") return analysis.frames;
  return pipeline.track.frames.map((f) => ({ t: f.t, bar: f.bar ? { x: f.bar.x, y: f.bar.y } : null }));
}

export async function runVideoMode(args: VideoModeArgs): Promise<VideoModeRun> {
  const info = await probeVideo(args.videoPath);
  const plan = posePlanFor(args.precise);
  const options = checkPipelineOptions({
    lift: args.lift,
    view: args.view,
    source: { width: info.width, height: info.height, fps: info.fps, durationS: info.durationS },
    bar: args.bar,
    plateDiameterM: args.plateDiameterM,
    athleteHeightM: args.athleteHeightM,
    poseSchedule: plan.poseSchedule,
  });
  // Smoothing off: the analysis filters every channel with a zero-lag low-pass instead.
  const detector = await createNodePoseDetector({ model: plan.model, smoothing: false });
  try {
    const pipeline = await runPipeline(clipFrames(args.videoPath, args.maxFrameWidthPx), options, { detector });
    const analysis = analyseParsedTrack(pipeline.track, { loadKg: args.loadKg, includeFrames: true });
    return { info, pipeline, poseModel: plan.model, output: { ...analysis, frames: outputFrames(pipeline, analysis) } };
  } finally {
    detector.dispose();
  }
}

/** One line for stderr: what was analysed and how fast. */
export function describeRun({ pipeline, poseModel }: VideoModeRun): string {
  const s = pipeline.stats;
  const plate = pipeline.plate
    ? `plate rim (${pipeline.plate.cx.toFixed(1)}, ${pipeline.plate.cy.toFixed(1)}) r ${pipeline.plate.radiusPx.toFixed(1)} px`
    : "no plate rim";
  return (
    `${s.frameCount} frames (${s.clipDurationS.toFixed(1)} s) at ${s.analysisWidth}x${s.analysisHeight} in ${s.wallS.toFixed(1)} s ` +
    `(${s.realTimeFactor.toFixed(2)}x real time); bar ${pipeline.barSource}, found on ${s.barFrames} frames; ${plate}; ` +
    `pose ${poseModel} on ${s.poseFrames} frames, ${s.poseMsMean.toFixed(0)} ms each`
  );
}

/** What to type instead, for the errors a flag fixes. */
const FLAG_HINTS: Partial<Record<PipelineError["code"], string>> = {
  "no-scale": " (--bar x,y, --plate cx,cy,r or --athlete-height-m)",
  "no-person": " (--bar x,y or --plate cx,cy,r)",
};

/** Runs video mode for the command line: JSON on `out`, a summary or a clear error on `err`; returns the exit code. */
export async function runVideoCommand(
  args: VideoModeArgs,
  io: { out: (text: string) => void; err: (text: string) => void },
  compact: boolean,
): Promise<number> {
  try {
    const run = await runVideoMode(args);
    io.err(`analyse: ${describeRun(run)}\n`);
    io.out(`${JSON.stringify(run.output, null, compact ? undefined : 2)}\n`);
    return 0;
  } catch (error) {
    if (error instanceof PipelineError) {
      io.err(`analyse: ${error.message}${FLAG_HINTS[error.code] ?? ""}\n`);
      return 1;
    }
    if (error instanceof VideoDecodeError || error instanceof PoseWeightsMissingError) {
      io.err(`analyse: ${error.message}\n`);
      return 1;
    }
    throw error;
  }
}
