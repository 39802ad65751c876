// Selects the tfjs backend once per JS realm; the wasm binaries' location must be set before
// the wasm backend first initialises, so it is remembered here.
import * as tf from "@tensorflow/tfjs";
import { setWasmPaths } from "@tensorflow/tfjs-backend-wasm";
import type { PoseBackend } from "./constants";

let configuredWasmPath: string | null = null;

/**
 * @param wasmPath prefix the wasm backend loads its `.wasm` files from: a folder path in Node,
 * a URL path such as `/models/tfjs-wasm/` in the browser.
 */
export async function usePoseBackend(backend: PoseBackend, wasmPath?: string): Promise<void> {
  if (backend === "wasm" && wasmPath !== undefined && configuredWasmPath !== wasmPath) {
    if (configuredWasmPath !== null) {
      throw new Error(`tfjs wasm binaries already load from ${configuredWasmPath}; cannot switch to ${wasmPath}`);
    }
    setWasmPaths(wasmPath);
    configuredWasmPath = wasmPath;
  }
  if (tf.getBackend() !== backend && !(await tf.setBackend(backend))) {
    throw new Error(`The tfjs "${backend}" backend could not start in this environment`);
  }
  await tf.ready();
}
