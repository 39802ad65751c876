// Runs one analysis in the Web Worker (workers/analyse-worker.ts) and hands back its progress and result;
// the page stays responsive because decoding (WebCodecs), pose and tracking all happen in the worker.
// Where the clip must be decoded by the page's <video> element instead, the page only draws frames
// and sends them, a few ahead of the worker.
import {
  DEFAULT_MAX_FRAME_WIDTH_PX,
  parseWorkerResponse,
  type AnalyseFramesRequest,
  type AnalyseRequest,
  type ErrorMessage,
  type FrameMessage,
  type ProgressMessage,
  type ResultMessage,
} from "@/workers/analyse-messages";
import type { FrameDecoder } from "@/lib/clips/decoder-choice";
import { MODEL_FILES } from "@/lib/pose/model-manifest";
import { readClipTimeline, VideoElementError, VideoElementFrames } from "./video-element-frames";

/** Where scripts/build-worker.ts puts the bundled worker. */
const ANALYSIS_WORKER_URL = "/workers/analyse-worker.js";

export class AnalysisRunError extends Error {
  constructor(
    readonly code: ErrorMessage["code"],
    message: string,
  ) {
    super(message);
    this.name = "AnalysisRunError";
  }
}

export interface AnalysisRun {
  result: Promise<ResultMessage>;
  cancel: () => void;
}

/** Frames sent to the worker and not yet taken by its pipeline. */
const FRAMES_IN_FLIGHT = 4;

export type AnalysisRequest = Omit<AnalyseRequest, "type" | "jobId" | "maxFrameWidthPx"> & { decoder: FrameDecoder };

/** Decodes on the page and sends each frame to the worker, never more than a few ahead of it. */
async function feedFrames(
  worker: Worker,
  jobId: string,
  request: Omit<AnalysisRequest, "decoder">,
  signal: AbortSignal,
  frameTaken: { count: number; wait: () => Promise<void> },
): Promise<void> {
  const timeline = await readClipTimeline(request.clip);
  const frames = await VideoElementFrames.open(request.clip, timeline, DEFAULT_MAX_FRAME_WIDTH_PX);
  try {
    const { clip: _clip, ...options } = request;
    worker.postMessage({
      type: "analyse-frames",
      jobId,
      ...options,
      source: { width: timeline.width, height: timeline.height, fps: timeline.fps, durationS: timeline.durationS },
    } satisfies AnalyseFramesRequest);
    let sent = 0;
    for await (const frame of frames.frames(signal)) {
      while (sent - frameTaken.count >= FRAMES_IN_FLIGHT) {
        await frameTaken.wait();
        // A finished or cancelled run wakes the waiters once: stop here rather than wait forever.
        signal.throwIfAborted();
      }
      const message: FrameMessage = { type: "frame", jobId, tS: frame.tS, width: frames.width, height: frames.height, data: frame.data };
      worker.postMessage(message, [frame.data.buffer]);
      sent += 1;
    }
    worker.postMessage({ type: "frames-end", jobId });
  } finally {
    frames.dispose();
  }
}

export function startAnalysis(request: AnalysisRequest, onProgress: (progress: ProgressMessage) => void): AnalysisRun {
  const jobId = crypto.randomUUID();
  const { decoder, ...options } = request;
  const feeding = new AbortController();
  const frameTaken = {
    count: 0,
    waiters: [] as (() => void)[],
    wait() {
      return new Promise<void>((resolve) => this.waiters.push(resolve));
    },
  };
  // Bundled apart by scripts/build-worker.ts into public/ (Next's bundler cannot bundle the pose models' code).
  const worker = new Worker(ANALYSIS_WORKER_URL, { type: "module" });
  let settle: { resolve: (r: ResultMessage) => void; reject: (e: Error) => void } | null = null;
  const result = new Promise<ResultMessage>((resolve, reject) => (settle = { resolve, reject }));
  const finish = (outcome: ResultMessage | Error) => {
    feeding.abort();
    for (const wake of frameTaken.waiters.splice(0)) wake();
    worker.terminate();
    if (outcome instanceof Error) settle?.reject(outcome);
    else settle?.resolve(outcome);
    settle = null;
  };
  worker.onmessage = (event: MessageEvent<unknown>) => {
    let message;
    try {
      message = parseWorkerResponse(event.data);
    } catch {
      finish(new AnalysisRunError("internal", "The analysis sent back something this page does not understand."));
      return;
    }
    if (message.jobId !== null && message.jobId !== jobId) return;
    if (message.type === "frame-taken") {
      frameTaken.count = message.framesTaken;
      for (const wake of frameTaken.waiters.splice(0)) wake();
    } else if (message.type === "progress") onProgress(message);
    else if (message.type === "result") finish(message);
    else finish(new AnalysisRunError(message.code, message.message));
  };
  worker.onerror = (event) => finish(new AnalysisRunError("internal", `The analysis stopped: ${event.message || "the worker failed"}.`));
  if (decoder === "webcodecs") worker.postMessage({ type: "analyse", jobId, ...options } satisfies AnalyseRequest);
  else {
    feedFrames(worker, jobId, options, feeding.signal, frameTaken).catch((error: unknown) => {
      if (feeding.signal.aborted) return;
      const message = error instanceof Error ? error.message : String(error);
      finish(new AnalysisRunError(error instanceof VideoElementError ? "unsupported-video" : "internal", message));
    });
  }
  return {
    result,
    // Stopping the worker outright frees the page at once; the next run starts a fresh one.
    cancel: () => finish(new AnalysisRunError("cancelled", "Analysis cancelled.")),
  };
}

/** A model's version: the first 12 hex digits of its topology file's SHA-256 (lib/pose/model-manifest.ts). */
export function poseModelVersion(modelId: string): string {
  const file = MODEL_FILES.find((f) => f.path.startsWith(`${modelId}/`) && f.path.endsWith(".json"));
  return file ? file.sha256.slice(0, 12) : "unknown";
}
