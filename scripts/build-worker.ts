// Bundles the analysis Web Worker (workers/analyse-worker.ts, with tfjs and the pose models' code) into
// public/workers/analyse-worker.js with esbuild. Next's bundler cannot bundle pose-detection's optional
// MediaPipe import, so the worker is built apart and the page loads it by URL. Runs before `next build`
// and `next dev` (scripts/start.ts, the browser tests' global setup); `tsx scripts/build-worker.ts` runs it alone.
import path from "node:path";
import { pathToFileURL } from "node:url";
import { build } from "esbuild";

const repoRoot = path.resolve(import.meta.dirname, "..");

/** Where the page loads the worker from (ANALYSIS_WORKER_URL in lib/client/analysis-runner.ts). */
const ANALYSIS_WORKER_PATH = "workers/analyse-worker.js";

/**
 * Builds into public/ for the app, or into `outfile` (the worker benchmark's own folder); the decode
 * worker the analysis worker starts goes beside it as decode-worker.js (DECODE_WORKER_FILE).
 */
export async function buildAnalysisWorker(outfile = path.join(repoRoot, "public", ANALYSIS_WORKER_PATH)): Promise<string> {
  await Promise.all([bundle("workers/analyse-worker.ts", outfile), bundle("workers/decode-worker.ts", path.join(path.dirname(outfile), "decode-worker.js"))]);
  return outfile;
}

async function bundle(entry: string, outfile: string): Promise<void> {
  await build({
    entryPoints: [path.join(repoRoot, entry)],
    outfile,
    bundle: true,
    format: "esm",
    platform: "browser",
    target: "es2022",
    minify: true,
    sourcemap: false,
    tsconfig: path.join(repoRoot, "tsconfig.json"),
    // As Next does for client code: in the browser, environment variables other than NODE_ENV read as undefined.
    define: { "process.env.NODE_ENV": '"production"', "process.env": "{}" },
    logLevel: "warning",
  });
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  console.log(`[plumbline] analysis worker bundled: ${path.relative(repoRoot, await buildAnalysisWorker())}`);
}
