// Messages between the page and the analysis worker, as zod-validated discriminated unions: the
// worker checks what it is asked, the page checks what comes back (never trusting either side).
import { z } from "zod";
import { analysisResultSchema } from "@/lib/analysis/result";
import { CAMERA_VIEWS, LIFTS, trackSchema } from "@/lib/analysis/track";
import { FRAME_DECODERS } from "@/lib/clips/decoder-choice";
import { PIPELINE_ERROR_CODES, barMarkSchema } from "@/lib/pipeline";

const jobId = z.string().min(1).max(100);
const finite = z.number().finite();

/** Frames are scaled down to this width for tracking and pose (taller clips keep their aspect ratio). */
export const DEFAULT_MAX_FRAME_WIDTH_PX = 640;

/** What every analysis needs besides its frames. */
const analysisOptions = {
  jobId,
  lift: z.enum(LIFTS),
  view: z.enum(CAMERA_VIEWS),
  /** Tap on the first frame, or the plate circle, in pixels of the clip; null: bar estimated from pose. */
  bar: barMarkSchema.nullable().default(null),
  plateDiameterM: finite.gt(0).max(1).optional(),
  athleteHeightM: finite.min(1).max(2.5).optional(),
  loadKg: finite.gt(0).max(1000).optional(),
  /** BlazePose full on every frame instead of MoveNet Lightning on a real-time budget. */
  precise: z.boolean().default(false),
};

/** The worker decodes the clip itself (WebCodecs). */
export const analyseRequestSchema = z.object({
  type: z.literal("analyse"),
  ...analysisOptions,
  clip: z.instanceof(Blob, { message: "expected the clip as a File or Blob" }),
  maxFrameWidthPx: z.number().int().min(64).max(3840).default(DEFAULT_MAX_FRAME_WIDTH_PX),
});

/**
 * The page decodes the clip with its <video> element and sends the frames one by one ("frame", then
 * "frames-end"); the worker answers each frame it takes with "frame-taken" so the page never runs ahead.
 */
export const analyseFramesRequestSchema = z.object({
  type: z.literal("analyse-frames"),
  ...analysisOptions,
  /** The clip as stored (display size, rotation applied). */
  source: z.object({
    width: z.number().int().positive().max(16_384),
    height: z.number().int().positive().max(16_384),
    fps: finite.gt(0).max(1000).nullable(),
    durationS: finite.gt(0).nullable(),
  }),
});

export const frameMessageSchema = z
  .object({
    type: z.literal("frame"),
    jobId,
    tS: finite.min(0),
    width: z.number().int().positive().max(3840),
    height: z.number().int().positive().max(3840),
    data: z.instanceof(Uint8ClampedArray, { message: "expected RGBA pixels as a Uint8ClampedArray" }),
  })
  .refine((frame) => frame.data.length === frame.width * frame.height * 4, { message: "pixels do not fill width × height × 4", path: ["data"] });

export const framesEndMessageSchema = z.object({ type: z.literal("frames-end"), jobId });

export const cancelRequestSchema = z.object({ type: z.literal("cancel"), jobId });

export const workerRequestSchema = z.discriminatedUnion("type", [
  analyseRequestSchema,
  analyseFramesRequestSchema,
  frameMessageSchema,
  framesEndMessageSchema,
  cancelRequestSchema,
]);
export type AnalyseRequest = z.input<typeof analyseRequestSchema>;
export type AnalyseFramesRequest = z.input<typeof analyseFramesRequestSchema>;
export type FrameMessage = z.input<typeof frameMessageSchema>;
export type CancelRequest = z.input<typeof cancelRequestSchema>;
export type WorkerRequest = z.input<typeof workerRequestSchema>;

export const PROGRESS_STAGES = ["loading-model", "opening-clip", "tracking", "measuring"] as const;

export const progressMessageSchema = z.object({
  type: z.literal("progress"),
  jobId,
  stage: z.enum(PROGRESS_STAGES),
  /** 0..1 of the clip processed; null while unknown. */
  fraction: finite.min(0).max(1).nullable(),
  framesDone: z.number().int().min(0),
  clipTimeS: finite.min(0),
  elapsedS: finite.min(0),
});

const plateRimSchema = z.object({ cx: finite, cy: finite, radiusPx: finite.gt(0), score: finite.min(0).max(1) });

export const runStatsSchema = z.object({
  frameCount: z.number().int().min(0),
  poseFrames: z.number().int().min(0),
  barFrames: z.number().int().min(0),
  analysisWidth: z.number().int().min(0),
  analysisHeight: z.number().int().min(0),
  clipDurationS: finite.min(0),
  wallS: finite.min(0),
  realTimeFactor: finite.min(0),
  poseMsMean: finite.min(0),
  trackMsMean: finite.min(0),
  poseIntervalS: finite.min(0),
  /** Wall time waiting for the next frame (demux, decode), reading pending frames' pixels, and frames read only around the bar. */
  frameWaitS: finite.min(0),
  readS: finite.min(0),
  regionFrames: z.number().int().min(0),
  poseModel: z.string(),
  /** tfjs tensors alive after the run (stays flat from clip to clip when nothing leaks). */
  liveTensors: z.number().int().min(0),
  /** Time to turn a decoded frame into a small RGBA frame, and how many came straight from YUV planes. */
  readMsMean: finite.min(0),
  /** The two parts of reading: copying the planes out of the decoder's memory, and converting them (means over all frames). */
  copyMsMean: finite.min(0),
  convertMsMean: finite.min(0),
  yuvFrames: z.number().int().min(0),
  /** How the frames were decoded (lib/clips/decoder-choice.ts). */
  decoder: z.enum(FRAME_DECODERS),
});
export type RunStats = z.infer<typeof runStatsSchema>;

export const resultMessageSchema = z.object({
  type: z.literal("result"),
  jobId,
  analysis: analysisResultSchema,
  /** Per-frame keypoints and bar in clip pixels, for the overlays. */
  track: trackSchema,
  barSource: z.enum(["tracked", "pose-estimate"]),
  plate: plateRimSchema.nullable(),
  stats: runStatsSchema,
});

export const WORKER_ERROR_CODES = [
  ...PIPELINE_ERROR_CODES,
  "bad-request",
  "busy",
  "cancelled",
  "unsupported-video",
  "models-missing",
  "internal",
] as const;
export type WorkerErrorCode = (typeof WORKER_ERROR_CODES)[number];

export const errorMessageSchema = z.object({
  type: z.literal("error"),
  /** Null when the request was too malformed to name its job. */
  jobId: jobId.nullable(),
  code: z.enum(WORKER_ERROR_CODES),
  message: z.string().min(1),
});

/** The worker took frames up to this count from the page (the page keeps only a few in flight). */
export const frameTakenMessageSchema = z.object({ type: z.literal("frame-taken"), jobId, framesTaken: z.number().int().min(0) });

export const workerResponseSchema = z.discriminatedUnion("type", [
  progressMessageSchema,
  resultMessageSchema,
  errorMessageSchema,
  frameTakenMessageSchema,
]);
export type ProgressMessage = z.infer<typeof progressMessageSchema>;
export type ResultMessage = z.infer<typeof resultMessageSchema>;
export type ErrorMessage = z.infer<typeof errorMessageSchema>;
export type WorkerResponse = z.infer<typeof workerResponseSchema>;

/** For the page: checks a message from the worker; throws when it does not fit the protocol. */
export function parseWorkerResponse(data: unknown): WorkerResponse {
  return workerResponseSchema.parse(data);
}
