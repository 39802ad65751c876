// Browser side of lib/pose (the analysis worker): model files and tfjs wasm binaries are served
// from public/models/ by `npm run models`.
import { MODELS_URL_PATH, TFJS_WASM_FOLDER } from "./constants";
import { createPoseDetector, type PoseDetector, type PoseDetectorOptions } from "./detector";
import { fetchModelFiles } from "./model-files";

export const BROWSER_WASM_PATH = `${MODELS_URL_PATH}/${TFJS_WASM_FOLDER}/`;

export function createBrowserPoseDetector(options: Partial<PoseDetectorOptions> = {}): Promise<PoseDetector> {
  return createPoseDetector({
    loadFile: fetchModelFiles(MODELS_URL_PATH),
    wasmPath: BROWSER_WASM_PATH,
    ...options,
  });
}
