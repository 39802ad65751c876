// Runs the demo analyses on worker threads (at most two: the machine's cores), so the synthetic tracks
// and the engine share the cores while the main thread writes to the database. Workers load TypeScript
// through tsx; when one cannot start or fails, its work and all later work run in this thread instead.
import { availableParallelism } from "node:os";
import path from "node:path";
import { pathToFileURL } from "node:url";
import { Worker } from "node:worker_threads";
import { log } from "@/scripts/run";
import { analyseDemoSet, type AnalysedDemoSet } from "./demo-analysis";
import type { DemoSetPlan } from "./demo-training";

type Reply = { ok: true; value: AnalysedDemoSet } | { ok: false; message: string };

interface Lane {
  worker: Worker;
  pending: { resolve: (v: AnalysedDemoSet) => void; reject: (e: Error) => void }[];
}

export interface DemoAnalysisPool {
  analyse(plan: DemoSetPlan): Promise<AnalysedDemoSet>;
  close(): Promise<void>;
}

const repoRoot = path.resolve(import.meta.dirname, "../..");

function startLane(): Lane {
  // A worker's entry cannot be TypeScript on Node 20 even with tsx imported first: a small JavaScript
  // entry registers tsx's loader, then imports the TypeScript worker through it.
  const entry = pathToFileURL(path.join(import.meta.dirname, "demo-analysis-worker.ts")).href;
  const bootstrap = `import("tsx/esm/api").then(({ register }) => { register(); return import(${JSON.stringify(entry)}); })`;
  const worker = new Worker(bootstrap, {
    eval: true,
    // tsx resolves the "@/" paths from the repository's tsconfig, wherever the seed was started from.
    env: { ...process.env, TSX_TSCONFIG_PATH: path.join(repoRoot, "tsconfig.json") },
  });
  const lane: Lane = { worker, pending: [] };
  const failAll = (error: Error) => {
    for (const p of lane.pending.splice(0)) p.reject(error);
  };
  worker.on("message", (reply: Reply) => {
    const next = lane.pending.shift();
    if (reply.ok) next?.resolve(reply.value);
    else next?.reject(new Error(reply.message));
  });
  worker.on("error", failAll);
  worker.on("exit", (code) => failAll(new Error(`demo analysis worker exited (code ${code})`)));
  return lane;
}

export function startDemoAnalysisPool(): DemoAnalysisPool {
  const lanes = Array.from({ length: Math.max(1, Math.min(2, availableParallelism())) }, startLane);
  let turn = 0;
  let inThread = false;
  return {
    async analyse(plan) {
      if (inThread) return analyseDemoSet(plan);
      const lane = lanes[turn++ % lanes.length];
      try {
        return await new Promise<AnalysedDemoSet>((resolve, reject) => {
          lane.pending.push({ resolve, reject });
          lane.worker.postMessage(plan);
        });
      } catch (error) {
        if (!inThread) log(`demo sets: analysing in the main thread (a worker thread failed: ${error instanceof Error ? error.message : String(error)})`);
        inThread = true;
        return analyseDemoSet(plan);
      }
    },
    async close() {
      await Promise.all(lanes.map((l) => l.worker.terminate()));
    },
  };
}
