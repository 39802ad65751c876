// The analysis worker in headless Chromium on 30 s, 30 fps synthetic clips (1280x720, then
// 1920x1080): bundles workers/analyse-worker.ts with esbuild, serves it with public/models from
// 127.0.0.1, and prints frames per second, real-time factor, where the time went, memory, the
// page's longest stall and accuracy. The first run in the worker pays for loading the model;
// precise mode and a cancel follow.
// Two kinds of clip: "worst case" is encoded at constant quality (CRF 17), which on the noisy
// synthetic scene gives about 20 Mbit/s at 720p and 48 Mbit/s at 1080p; "realistic" is encoded at
// the average bitrates phones record at (8 Mbit/s at 720p30, 16 Mbit/s at 1080p30: common practice,
// from memory of phone camera settings). H.264 decoding costs grow with the bitrate, so both are shown.
// The machine is shared: print `uptime` beside the figures. PLUMBLINE_BENCH_WORKER=realtime runs
// only the real-time runs (no precise mode, memory or cancel), for repeated measurements;
// PLUMBLINE_BENCH_WORKER=ab alternates the realistic clips between decoding in a decode worker (the
// default) and in the analysis worker itself (?decoder=same-worker), so both see the same load.
import { createReadStream } from "node:fs";
import { mkdtemp, rm, stat } from "node:fs/promises";
import { createServer, type Server } from "node:http";
import type { AddressInfo } from "node:net";
import { tmpdir } from "node:os";
import path from "node:path";
import { loadavg } from "node:os";
import { build } from "esbuild";
import { buildAnalysisWorker } from "@/scripts/build-worker";
import type { Page } from "playwright-core";
import { ensureModels } from "@/scripts/models";
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
const workers = {};
function startWorker(query = "") {
  worker = workers[query] ??= new Worker("/analyse-worker.js" + query, { type: "module" });
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
window.decodeOnly = async (clipUrl, copy) => {
  const clip = await loadClip(clipUrl);
  const probe = new Worker("/decode-probe.js", { type: "module" });
  try {
    return await new Promise((resolve) => {
      probe.onerror = (e) => resolve({ error: e.message || "the probe failed to load" });
      probe.onmessage = ({ data }) => resolve(data);
      probe.postMessage({ clip, copy });
    });
  } finally {
    probe.terminate();
  }
};
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
  await build({
    entryPoints: [path.join(import.meta.dirname, "support/decode-probe.ts")],
    outfile: path.join(outDir, "decode-probe.js"),
    bundle: true,
    format: "esm",
    platform: "browser",
    target: "es2022",
    minify: true,
    logLevel: "warning",
  });
}

function load(): string {
  return `load average ${loadavg().map((l) => l.toFixed(1)).join(", ")} on 2 cores`;
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
  const stageS = {
    "waiting for frames (demux + decode)": s.frameWaitS,
    "reading pixels (copy + YUV->RGBA)": s.readS,
    tracking: (s.trackMsMean * s.frameCount) / 1000,
    pose: (s.poseMsMean * s.poseFrames) / 1000,
  };
  const otherS = s.wallS - Object.values(stageS).reduce((a, b) => a + b, 0);
  console.log(
    `  where the worker's ${s.wallS.toFixed(1)} s went: ` +
      Object.entries(stageS)
        .map(([stage, seconds]) => `${stage} ${seconds.toFixed(1)} s`)
        .join(", ") +
      `, other ${otherS.toFixed(1)} s; reading: copy ${s.copyMsMean.toFixed(2)} + convert ${s.convertMsMean.toFixed(2)} ms/frame, ` +
      `${s.regionFrames} of ${s.frameCount} frames read only around the bar`,
  );
  console.log(`  page: longest main-thread stall ${run.page.maxStallMs.toFixed(0)} ms, peak JS heap ${run.page.peakHeapMb.toFixed(1)} MB`);
  const frames = message.track.frames.map((f) => ({ t: f.t, bar: f.bar }));
  console.log(`  ${describeAccuracy(accuracy(frames, message.analysis.scale.metresPerPixel, message.analysis.reps, clip.truth))}`);
}

function bitrateMbps(clip: GeneratedClip, sizeBytes: number): number {
  return (8 * sizeBytes) / 1e6 / (clip.truth.frameCount / clip.truth.options.fps);
}

function analyseRequest(jobId: string, clip: GeneratedClip, precise = false) {
  const start = clip.truth.frames[0];
  // A tap a few pixels off the plate's centre, as a person would give it.
  return { type: "analyse", jobId, lift: "squat", view: "side", bar: { kind: "tap", x: start.cx + 3, y: start.cy - 2 }, precise };
}

function clipUrl(clip: GeneratedClip): string {
  return `/clips/${path.basename(clip.videoPath)}`;
}

async function describeClip(clip: GeneratedClip): Promise<string> {
  const { width, height, fps, bitrateMbps: target } = clip.truth.options;
  const rate = bitrateMbps(clip, (await stat(clip.videoPath)).size);
  const kind = target === undefined ? "worst case, CRF 17" : "realistic";
  return `${width}x${height}, ${clip.truth.frameCount} frames at ${fps} fps (H.264, ${rate.toFixed(1)} Mbit/s, ${kind})`;
}

async function timedRun(page: Page, label: string, clip: GeneratedClip, precise = false): Promise<void> {
  const request = analyseRequest(label, clip, precise);
  const before = load();
  const run = (await page.evaluate(`analyseOnce(${JSON.stringify(request)}, ${JSON.stringify(clipUrl(clip))}, null)`)) as RunSummary;
  printRun(`${label}, ${await describeClip(clip)} [${before}]`, run, clip);
}

/** Decoding alone in a worker (and with each frame's planes copied out): the floor under the analysis. */
async function timedDecode(page: Page, clip: GeneratedClip, copy: boolean): Promise<void> {
  const before = load();
  const result = (await page.evaluate(`decodeOnly(${JSON.stringify(clipUrl(clip))}, ${copy})`)) as { frames?: number; wallS?: number; error?: string };
  if (result.error !== undefined || result.frames === undefined || result.wallS === undefined) throw new Error(`decode probe: ${result.error}`);
  const clipS = clip.truth.frameCount / clip.truth.options.fps;
  console.log(
    `decode only${copy ? " + copy every frame out" : ""}, ${await describeClip(clip)}: ${result.frames} frames in ${result.wallS.toFixed(1)} s, ` +
      `real-time factor ${(clipS / result.wallS).toFixed(2)} [${before}]`,
  );
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
  const hdRealistic = await ensureClip({ width: 1280, height: 720, durationS: 30, bitrateMbps: 8 });
  const fullHdRealistic = await ensureClip({ width: 1920, height: 1080, durationS: 30, bitrateMbps: 16 });
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
    if (process.env.PLUMBLINE_BENCH_WORKER === "ab") {
      for (let round = 1; round <= 2; round++) {
        for (const [query, label] of [["", "decode worker"], ["?decoder=same-worker", "same worker"]] as const) {
          await page.evaluate(`startWorker(${JSON.stringify(query)})`);
          await timedRun(page, `round ${round}, ${label}`, fullHdRealistic);
          await timedRun(page, `round ${round}, ${label}`, hdRealistic);
        }
      }
      return;
    }
    const memory = sampleProcessTree(process.pid, { includeRoot: false });
    await timedRun(page, "run 1 (loads the model)", hd);
    await timedRun(page, "run 2 (same worker)", hd);
    await timedRun(page, "run 3 (same worker)", fullHd);
    await timedRun(page, "run 4 (same worker)", hdRealistic);
    await timedRun(page, "run 5 (same worker)", fullHdRealistic);
    for (const clip of [fullHd, fullHdRealistic]) {
      await timedDecode(page, clip, false);
      await timedDecode(page, clip, true);
    }
    if (process.env.PLUMBLINE_BENCH_WORKER === "realtime") return;
    // Precise mode (BlazePose full on every frame) is several times slower: a 12 s clip measures it.
    await timedRun(page, "run 6 (precise mode)", await ensureClip({ width: 1280, height: 720, durationS: 12 }), true);
    const report = memory.stop();
    const largest = report.processes[0];
    console.log(
      `Chromium memory over the six runs: peak ${report.peakTotalMb.toFixed(0)} MB resident summed over ${report.processes.length} processes ` +
        `(shared pages counted in each); largest process ${largest.name} ${largest.peakRssMb.toFixed(0)} MB (the renderer holding page and worker)`,
    );
    await timedCancel(page, hd);
  } finally {
    await browser.close();
    server?.close();
    await rm(bundleDir, { recursive: true, force: true });
  }
}
