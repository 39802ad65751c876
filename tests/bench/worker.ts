// The analysis worker in headless Chromium on 30 s, 30 fps synthetic clips (1280x720, then
// 1920x1080): bundles workers/analyse-worker.ts with esbuild, serves it with public/models from
// 127.0.0.1, and prints frames per second, real-time factor, memory, the page's longest stall and
// accuracy. The first run in the worker pays for loading the model; precise mode and a cancel follow.
import { createReadStream } from "node:fs";
import { mkdtemp, rm, stat } from "node:fs/promises";
import { createServer, type Server } from "node:http";
import type { AddressInfo } from "node:net";
import { tmpdir } from "node:os";
import path from "node:path";
import { buildAnalysisWorker } from "@/lib/dev/build-worker";
import type { Page } from "playwright-core";
import { ensureModels } from "@/lib/dev/models";
import { launchBrowser } from "@/tests/e2e/browser";
import { CLIP_CACHE_DIR, ensureClip, type GeneratedClip } from "@/tests/fixtures/clips/generate-clip";
import { parseWorkerResponse } from "@/workers/analyse-messages";
import { accuracy, describeAccuracy } from "./support/accuracy";
import { sampleProcessTree } from "./support/process-memory";

const REPO_ROOT = path.resolve(import.meta.dirname, "../..");
const MODELS_DIR = path.join(REPO_ROOT, "public/models");

const CONTENT_TYPES: Record<string, string> = {
  ".html": "text/html; charset=utf-8",
  ".js": "text/javascript; charset=utf-8",
  ".json": "application/json",
  ".wasm": "application/wasm",
  ".bin": "application/octet-stream",
  ".mp4": "video/mp4",
};

/** Plain JavaScript run by the page (kept out of the bundled TypeScript so nothing rewrites it). */
const HARNESS = `<!doctype html><meta charset="utf-8"><title>worker bench</title>
<script>
let worker = null;
let workerFailure = null;
function startWorker() {
  worker = new Worker("/analyse-worker.js", { type: "module" });
  worker.onerror = (e) => { workerFailure = e.message || "the worker script failed to load"; };
}
async function loadClip(url) {
  return (await fetch(url)).blob();
}
function watchPage() {
  let last = performance.now(), maxStallMs = 0, peakHeapMb = 0;
  const timer = setInterval(() => {
    const now = performance.now();
    maxStallMs = Math.max(maxStallMs, now - last - 50);
    last = now;
    peakHeapMb = Math.max(peakHeapMb, (performance.memory ? performance.memory.usedJSHeapSize : 0) / 1048576);
  }, 50);
  return () => { clearInterval(timer); return { maxStallMs, peakHeapMb }; };
}
window.analyseOnce = async (request, clipUrl, cancelAfterS) => {
  const clip = await loadClip(clipUrl);
  const stopWatching = watchPage();
  const started = performance.now();
  let progressMessages = 0, firstTrackingS = null, cancelledAtS = null;
  const outcome = await new Promise((resolve) => {
    if (workerFailure) resolve({ type: "error", jobId: null, code: "internal", message: workerFailure });
    worker.onerror = (e) => resolve({ type: "error", jobId: null, code: "internal", message: e.message || "worker error" });
    worker.onmessage = ({ data }) => {
      if (data.type === "progress") {
        progressMessages++;
        if (data.stage === "tracking" && firstTrackingS === null) {
          firstTrackingS = (performance.now() - started) / 1000;
          if (cancelAfterS !== null) setTimeout(() => {
            cancelledAtS = (performance.now() - started) / 1000;
            worker.postMessage({ type: "cancel", jobId: request.jobId });
          }, cancelAfterS * 1000);
        }
      } else resolve(data);
    };
    worker.postMessage({ ...request, clip });
  });
  const wallS = (performance.now() - started) / 1000;
  const page = stopWatching();
  return { wallS, firstTrackingS, cancelledAtS, progressMessages, page, message: outcome };
};
</script>`;

async function bundleWorker(outDir: string): Promise<void> {
  await buildAnalysisWorker(path.join(outDir, "analyse-worker.js"));
}

/** Serves the harness, the bundled worker, public/models under /models and cached clips under /clips. */
function serve(bundleDir: string): Promise<Server> {
  const server = createServer(async (request, response) => {
    const url = new URL(request.url ?? "/", "http://127.0.0.1");
    if (url.pathname === "/") {
      response.writeHead(200, { "content-type": CONTENT_TYPES[".html"] }).end(HARNESS);
      return;
    }
    const [root, relative] = url.pathname.startsWith("/models/")
      ? [MODELS_DIR, url.pathname.slice("/models/".length)]
      : url.pathname.startsWith("/clips/")
        ? [CLIP_CACHE_DIR, url.pathname.slice("/clips/".length)]
        : [bundleDir, url.pathname.slice(1)];
    const file = path.join(root, path.normalize(decodeURIComponent(relative)));
    const info = file.startsWith(root + path.sep) ? await stat(file).catch(() => null) : null;
    if (!info?.isFile()) {
      response.writeHead(404).end();
      return;
    }
    response.writeHead(200, { "content-type": CONTENT_TYPES[path.extname(file)] ?? "application/octet-stream", "content-length": info.size });
    createReadStream(file).pipe(response);
  });
  return new Promise((resolve) => server.listen(0, "127.0.0.1", () => resolve(server)));
}

interface RunSummary {
  wallS: number;
  firstTrackingS: number;
  progressMessages: number;
  page: { maxStallMs: number; peakHeapMb: number };
  message: unknown;
}

function printRun(label: string, run: RunSummary, clip: GeneratedClip): void {
  // The page of the app checks every worker message the same way.
  const message = parseWorkerResponse(run.message);
  if (message.type !== "result") throw new Error(`worker answered ${JSON.stringify(message)}`);
  const clipS = clip.truth.frameCount / clip.truth.options.fps;
  const s = message.stats;
  console.log(
    `${label}: ${s.frameCount} frames in ${run.wallS.toFixed(1)} s = ${(s.frameCount / run.wallS).toFixed(1)} frames/s, ` +
      `real-time factor ${(clipS / run.wallS).toFixed(2)} from posting the clip to the result ` +
      `(decode + track + pose ${s.realTimeFactor.toFixed(2)}; first frame after ${run.firstTrackingS.toFixed(1)} s)`,
  );
  console.log(
    `  frames ${s.analysisWidth}x${s.analysisHeight}; pose ${s.poseModel} on ${s.poseFrames} frames, ${s.poseMsMean.toFixed(0)} ms each; ` +
      `tracker ${s.trackMsMean.toFixed(2)} ms/frame; frame read ${s.readMsMean.toFixed(1)} ms/frame (${s.yuvFrames} straight from YUV); ` +
      `${run.progressMessages} progress messages; live tensors after ${s.liveTensors}`,
  );
  console.log(`  page: longest main-thread stall ${run.page.maxStallMs.toFixed(0)} ms, peak JS heap ${run.page.peakHeapMb.toFixed(1)} MB`);
  const frames = message.track.frames.map((f) => ({ t: f.t, bar: f.bar }));
  console.log(`  ${describeAccuracy(accuracy(frames, message.analysis.scale.metresPerPixel, message.analysis.reps, clip.truth))}`);
}

function analyseRequest(jobId: string, clip: GeneratedClip, precise = false) {
  const start = clip.truth.frames[0];
  // A tap a few pixels off the plate's centre, as a person would give it.
  return { type: "analyse", jobId, lift: "squat", view: "side", bar: { kind: "tap", x: start.cx + 3, y: start.cy - 2 }, precise };
}

function clipUrl(clip: GeneratedClip): string {
  return `/clips/${path.basename(clip.videoPath)}`;
}

function describeClip(clip: GeneratedClip): string {
  const { width, height, fps } = clip.truth.options;
  return `${width}x${height}, ${clip.truth.frameCount} frames at ${fps} fps (H.264)`;
}

async function timedRun(page: Page, label: string, clip: GeneratedClip, precise = false): Promise<void> {
  const request = analyseRequest(label, clip, precise);
  const run = (await page.evaluate(`analyseOnce(${JSON.stringify(request)}, ${JSON.stringify(clipUrl(clip))}, null)`)) as RunSummary;
  printRun(`${label}, ${describeClip(clip)}`, run, clip);
}

/** Cancels two seconds into a run and reports how soon the worker answered. */
async function timedCancel(page: Page, clip: GeneratedClip): Promise<void> {
  const request = analyseRequest("cancel", clip);
  const cancelled = (await page.evaluate(`analyseOnce(${JSON.stringify(request)}, ${JSON.stringify(clipUrl(clip))}, 2)`)) as {
    message: { type: string; code?: string };
    wallS: number;
    cancelledAtS: number | null;
  };
  const latencyMs = cancelled.cancelledAtS === null ? Number.NaN : 1000 * (cancelled.wallS - cancelled.cancelledAtS);
  console.log(`cancel: answered ${cancelled.message.type} "${cancelled.message.code ?? ""}" ${latencyMs.toFixed(0)} ms after the cancel message`);
}

export async function run(): Promise<void> {
  await ensureModels({ log: () => {} });
  const hd = await ensureClip({ width: 1280, height: 720, durationS: 30 });
  const fullHd = await ensureClip({ width: 1920, height: 1080, durationS: 30 });
  const bundleDir = await mkdtemp(path.join(tmpdir(), "plumbline-worker-bench-"));
  let server: Server | null = null;
  const browser = await launchBrowser();
  try {
    await bundleWorker(bundleDir);
    server = await serve(bundleDir);
    const page = await browser.newPage();
    await page.goto(`http://127.0.0.1:${(server.address() as AddressInfo).port}/`);
    await page.evaluate("startWorker()");
    console.log("headless Chromium, one worker, WebCodecs decoding, frames shrunk to at most 640 px wide");
    const memory = sampleProcessTree(process.pid, { includeRoot: false });
    await timedRun(page, "run 1 (loads the model)", hd);
    await timedRun(page, "run 2 (same worker)", hd);
    await timedRun(page, "run 3 (same worker)", fullHd);
    // Precise mode (BlazePose full on every frame) is several times slower: a 12 s clip measures it.
    await timedRun(page, "run 4 (precise mode)", await ensureClip({ width: 1280, height: 720, durationS: 12 }), true);
    const report = memory.stop();
    const largest = report.processes[0];
    console.log(
      `Chromium memory over the four runs: peak ${report.peakTotalMb.toFixed(0)} MB resident summed over ${report.processes.length} processes ` +
        `(shared pages counted in each); largest process ${largest.name} ${largest.peakRssMb.toFixed(0)} MB (the renderer holding page and worker)`,
    );
    await timedCancel(page, hd);
  } finally {
    await browser.close();
    server?.close();
    await rm(bundleDir, { recursive: true, force: true });
  }
}
