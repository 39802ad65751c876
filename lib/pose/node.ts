// Node side of lib/pose (command line, tests, benchmarks): model files come from public/models/
// on disk and the wasm binaries straight from node_modules.
import { readFile } from "node:fs/promises";
import path from "node:path";
import { createPoseDetector, type PoseDetector, type PoseDetectorOptions } from "./detector";
import { PoseWeightsMissingError, type ModelFileLoader } from "./model-files";

const repoRoot = path.resolve(import.meta.dirname, "../..");

export const NODE_MODELS_DIR = path.join(repoRoot, "public/models");
/** Trailing separator: the wasm backend appends the binary's file name to this prefix. */
export const NODE_WASM_PATH = path.join(repoRoot, "node_modules/@tensorflow/tfjs-backend-wasm/dist") + path.sep;

export function diskModelFiles(modelsDir: string = NODE_MODELS_DIR): ModelFileLoader {
  return async (relativePath) => {
    try {
      return new Uint8Array(await readFile(path.join(modelsDir, relativePath)));
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code === "ENOENT") throw new PoseWeightsMissingError(relativePath);
      throw error;
    }
  };
}

export function createNodePoseDetector(
  options: Partial<PoseDetectorOptions> & { modelsDir?: string } = {},
): Promise<PoseDetector> {
  const { modelsDir, ...rest } = options;
  return createPoseDetector({
    loadFile: diskModelFiles(modelsDir),
    wasmPath: NODE_WASM_PATH,
    ...rest,
  });
}
