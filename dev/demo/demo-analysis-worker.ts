// Worker thread of the demo seed: analyses the planned sets it is sent, one message per set, so the
// seed's two cores share the synthetic tracks and the engine while the main thread writes to the database.
import { parentPort } from "node:worker_threads";
import { analyseDemoSet } from "./demo-analysis";
import type { DemoSetPlan } from "./demo-training";

parentPort?.on("message", (plan: DemoSetPlan) => {
  try {
    parentPort?.postMessage({ ok: true, value: analyseDemoSet(plan) });
  } catch (error) {
    parentPort?.postMessage({ ok: false, message: error instanceof Error ? error.message : String(error) });
  }
});
