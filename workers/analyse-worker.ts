// The analysis Web Worker: decodes the clip with exact frame times (mediabunny over WebCodecs),
// scales frames down for tracking and pose, runs lib/pipeline then the analysis, and reports
// progress, the result or an error. A "cancel" message stops the running job.
import * as tf from "@tensorflow/tfjs";
import { analyseParsedTrack } from "@/lib/analysis/analyse";
import type { PoseModelId } from "@/lib/pose/constants";
import { createBrowserPoseDetector } from "@/lib/pose/browser";
import type { PoseDetector } from "@/lib/pose/detector";
import { PoseWeightsMissingError } from "@/lib/pose/model-files";
import { PipelineError, posePlanFor, runPipeline } from "@/lib/pipeline";
import {
  workerRequestSchema,
  type ErrorMessage,
  type ProgressMessage,
  type WorkerResponse,
} from "./analyse-messages";
import { clipFrames, ClipOpenError, FrameReader, openClip } from "./clip-frames";

type AnalyseJob = Extract<ReturnType<typeof workerRequestSchema.parse>, { type: "analyse" }>;

const scope = self as unknown as DedicatedWorkerGlobalScope;

/** Models load once per worker; each clip only resets the detector's state. */
const detectors = new Map<PoseModelId, Promise<PoseDetector>>();
let running: { jobId: string; controller: AbortController } | null = null;

function post(message: WorkerResponse): void {
  scope.postMessage(message);
}

function detectorFor(model: PoseModelId): Promise<PoseDetector> {
  let detector = detectors.get(model);
  if (!detector) {
    // Smoothing off: the analysis filters every channel with a zero-lag low-pass instead.
    detector = createBrowserPoseDetector({ model, smoothing: false });
    detectors.set(model, detector);
    detector.catch(() => detectors.delete(model));
  }
  return detector;
}

function progress(job: AnalyseJob, stage: ProgressMessage["stage"], rest: Partial<ProgressMessage> = {}): void {
  post({ type: "progress", jobId: job.jobId, stage, fraction: null, framesDone: 0, clipTimeS: 0, elapsedS: 0, ...rest });
}

async function analyse(job: AnalyseJob, signal: AbortSignal): Promise<void> {
  const plan = posePlanFor(job.precise);
  progress(job, "loading-model");
  const detector = await detectorFor(plan.model);
  signal.throwIfAborted();
  progress(job, "opening-clip");
  const clip = await openClip(job.clip);
  try {
    const reader = new FrameReader(clip, job.maxFrameWidthPx);
    const pipeline = await runPipeline(
      clipFrames(clip, reader),
      {
        lift: job.lift,
        view: job.view,
        source: { width: clip.width, height: clip.height, fps: clip.fps, durationS: clip.durationS },
        bar: job.bar,
        plateDiameterM: job.plateDiameterM,
        athleteHeightM: job.athleteHeightM,
        poseSchedule: plan.poseSchedule,
      },
      {
        detector,
        signal,
        onProgress: (p) =>
          progress(job, "tracking", { fraction: p.fraction, framesDone: p.framesDone, clipTimeS: p.clipTimeS, elapsedS: p.elapsedS }),
      },
    );
    progress(job, "measuring", { fraction: 1, framesDone: pipeline.stats.frameCount });
    const analysis = analyseParsedTrack(pipeline.track, { loadKg: job.loadKg, includeFrames: true });
    post({
      type: "result",
      jobId: job.jobId,
      analysis,
      track: pipeline.track,
      barSource: pipeline.barSource,
      plate: pipeline.plate,
      stats: {
        ...pipeline.stats,
        poseModel: plan.model,
        liveTensors: tf.memory().numTensors,
        readMsMean: reader.readMs / Math.max(1, pipeline.stats.frameCount),
        yuvFrames: reader.yuvFrames,
      },
    });
  } finally {
    clip.input.dispose();
  }
}

function toErrorMessage(jobId: string | null, error: unknown, signal?: AbortSignal): ErrorMessage {
  if (signal?.aborted) return { type: "error", jobId, code: "cancelled", message: "Analysis cancelled" };
  if (error instanceof PipelineError) return { type: "error", jobId, code: error.code, message: error.message };
  if (error instanceof ClipOpenError) return { type: "error", jobId, code: "unsupported-video", message: error.message };
  if (error instanceof PoseWeightsMissingError) return { type: "error", jobId, code: "models-missing", message: error.message };
  const message = error instanceof Error && error.message ? error.message : String(error);
  return { type: "error", jobId, code: "internal", message: `Analysis failed: ${message}` };
}

async function start(job: AnalyseJob): Promise<void> {
  if (running) {
    post({ type: "error", jobId: job.jobId, code: "busy", message: `Job ${running.jobId} is still running: cancel it or wait` });
    return;
  }
  const controller = new AbortController();
  running = { jobId: job.jobId, controller };
  try {
    await analyse(job, controller.signal);
  } catch (error) {
    post(toErrorMessage(job.jobId, error, controller.signal));
  } finally {
    running = null;
  }
}

scope.onmessage = (event: MessageEvent<unknown>) => {
  const parsed = workerRequestSchema.safeParse(event.data);
  if (!parsed.success) {
    const data = event.data as { jobId?: unknown } | null;
    const jobId = typeof data?.jobId === "string" && data.jobId.length > 0 && data.jobId.length <= 100 ? data.jobId : null;
    const issue = parsed.error.issues[0];
    post({ type: "error", jobId, code: "bad-request", message: `${issue.path.join(".") || "message"}: ${issue.message}` });
    return;
  }
  const request = parsed.data;
  if (request.type === "cancel") {
    if (running?.jobId === request.jobId) running.controller.abort();
    return;
  }
  void start(request);
};
