// The analysis Web Worker: has the clip decoded with exact frame times (mediabunny over WebCodecs,
// in a decode worker it starts, workers/decode-worker.ts) or takes frames the page decoded with its
// <video> element, scales frames down for tracking and pose,
// runs lib/pipeline then the analysis, and reports progress, the result or an error. A "cancel"
// message stops the running job.
import * as tf from "@tensorflow/tfjs";
import { analyseParsedTrack } from "@/lib/analysis/analyse";
import type { PoseModelId } from "@/lib/pose/constants";
import { createBrowserPoseDetector } from "@/lib/pose/browser";
import type { PoseDetector } from "@/lib/pose/detector";
import { PoseWeightsMissingError } from "@/lib/pose/model-files";
import type { FrameDecoder } from "@/lib/clips/decoder-choice";
import { PipelineError, posePlanFor, runPipeline, type PipelineFrame } from "@/lib/pipeline";
import type { PipelineOptions } from "@/lib/pipeline/options";
import {
  workerRequestSchema,
  type ErrorMessage,
  type ProgressMessage,
  type RunStats,
  type WorkerResponse,
} from "./analyse-messages";
import { clipFrames, ClipOpenError, DECODE_WORKER_FILE, decodeWorkerFrames, FrameReader, openClip } from "./clip-frames";
import { FrameInbox } from "./frame-inbox";

type WorkerRequestData = ReturnType<typeof workerRequestSchema.parse>;
type AnalyseJob = Extract<WorkerRequestData, { type: "analyse" | "analyse-frames" }>;

/** Where one job's frames come from, and what the worker measured while reading them. */
interface FrameFeed {
  frames: AsyncIterable<PipelineFrame>;
  source: PipelineOptions["source"];
  decoder: FrameDecoder;
  readStats: () => Pick<RunStats, "readMsMean" | "copyMsMean" | "convertMsMean" | "yuvFrames">;
  close: () => void;
}

const scope = self as unknown as DedicatedWorkerGlobalScope;

/** Models load once per worker; each clip only resets the detector's state. */
const detectors = new Map<PoseModelId, Promise<PoseDetector>>();
let running: { jobId: string; controller: AbortController; inbox: FrameInbox | null } | null = null;

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

async function openFeed(job: AnalyseJob, inbox: FrameInbox | null): Promise<FrameFeed> {
  if (job.type === "analyse-frames") {
    if (!inbox) throw new Error("frames job without an inbox");
    return { frames: inbox, source: job.source, decoder: "video-element", readStats: () => ({ readMsMean: 0, copyMsMean: 0, convertMsMean: 0, yuvFrames: 0 }), close: () => inbox.close() };
  }
  const clip = await openClip(job.clip);
  const reader = new FrameReader(clip, job.maxFrameWidthPx);
  let frameCount = 0;
  return {
    frames: (async function* () {
      // A worker of its own decodes alongside pose where workers can start workers; otherwise this one
      // decodes (also when loaded with ?decoder=same-worker, which the worker benchmark compares).
      const here = typeof Worker === "undefined" || new URL(scope.location.href).searchParams.get("decoder") === "same-worker";
      const frames = here ? clipFrames(clip, reader) : decodeWorkerFrames(job.clip, reader, new URL(DECODE_WORKER_FILE, scope.location.href));
      for await (const frame of frames) {
        frameCount += 1;
        yield frame;
      }
    })(),
    source: { width: clip.width, height: clip.height, fps: clip.fps, durationS: clip.durationS },
    decoder: "webcodecs",
    readStats: () => {
      const frames = Math.max(1, frameCount);
      return { readMsMean: reader.readMs / frames, copyMsMean: reader.copyMs / frames, convertMsMean: reader.convertMs / frames, yuvFrames: reader.yuvFrames };
    },
    close: () => clip.input.dispose(),
  };
}

async function analyse(job: AnalyseJob, signal: AbortSignal, inbox: FrameInbox | null): Promise<void> {
  const plan = posePlanFor(job.precise);
  progress(job, "loading-model");
  const detector = await detectorFor(plan.model);
  signal.throwIfAborted();
  progress(job, "opening-clip");
  const feed = await openFeed(job, inbox);
  try {
    const pipeline = await runPipeline(
      feed.frames,
      {
        lift: job.lift,
        view: job.view,
        source: feed.source,
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
    // A cancel closes the page's frame inbox, which ends the frames early: that is no result.
    signal.throwIfAborted();
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
        ...feed.readStats(),
        poseModel: plan.model,
        liveTensors: tf.memory().numTensors,
        decoder: feed.decoder,
      },
    });
  } finally {
    feed.close();
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
  const inbox = job.type === "analyse-frames" ? new FrameInbox((framesTaken) => post({ type: "frame-taken", jobId: job.jobId, framesTaken })) : null;
  running = { jobId: job.jobId, controller, inbox };
  try {
    await analyse(job, controller.signal, inbox);
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
  switch (request.type) {
    case "cancel":
      if (running?.jobId === request.jobId) {
        running.controller.abort();
        running.inbox?.close();
      }
      return;
    case "frame":
      if (running?.jobId === request.jobId) running.inbox?.push({ tS: request.tS, frame: { width: request.width, height: request.height, data: request.data } });
      return;
    case "frames-end":
      if (running?.jobId === request.jobId) running.inbox?.close();
      return;
    default:
      void start(request);
  }
};
