// Runs one analysis in the Web Worker (workers/analyse-worker.ts) and hands back its progress and result;
// the page stays responsive because decoding, pose and tracking all happen in the worker.
import {
  parseWorkerResponse,
  type AnalyseRequest,
  type ErrorMessage,
  type ProgressMessage,
  type ResultMessage,
} from "@/workers/analyse-messages";
import { MODEL_FILES } from "@/lib/pose/model-manifest";

/** Where lib/dev/build-worker.ts puts the bundled worker. */
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

export function startAnalysis(request: Omit<AnalyseRequest, "type" | "jobId">, onProgress: (progress: ProgressMessage) => void): AnalysisRun {
  const jobId = crypto.randomUUID();
  // Bundled apart by lib/dev/build-worker.ts into public/ (Next's bundler cannot bundle the pose models' code).
  const worker = new Worker(ANALYSIS_WORKER_URL, { type: "module" });
  let settle: { resolve: (r: ResultMessage) => void; reject: (e: Error) => void } | null = null;
  const result = new Promise<ResultMessage>((resolve, reject) => (settle = { resolve, reject }));
  const finish = (outcome: ResultMessage | Error) => {
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
    if (message.type === "progress") onProgress(message);
    else if (message.type === "result") finish(message);
    else finish(new AnalysisRunError(message.code, message.message));
  };
  worker.onerror = (event) => finish(new AnalysisRunError("internal", `The analysis stopped: ${event.message || "the worker failed"}.`));
  worker.postMessage({ type: "analyse", jobId, ...request } satisfies AnalyseRequest);
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
