// Turns model files fetched by a `loadFile` function into tfjs IOHandlers, so Node (files on disk)
// and the browser (URLs under /models) load graph models through the same code.
import * as tf from "@tensorflow/tfjs";
import { MISSING_WEIGHTS_MESSAGE, type GraphModelFiles } from "./constants";
import { MODEL_FILES } from "./model-manifest";

/** Reads one file below the models root (e.g. `blazepose-full/blazepose-full.json`). */
export type ModelFileLoader = (relativePath: string) => Promise<Uint8Array>;

export class PoseWeightsMissingError extends Error {
  constructor(readonly relativePath: string) {
    super(`${MISSING_WEIGHTS_MESSAGE} (${relativePath} not found)`);
    this.name = "PoseWeightsMissingError";
  }
}

/** Catches truncated downloads and HTML error pages before tfjs fails with an obscure message. */
function checkSize(relativePath: string, bytes: Uint8Array) {
  const expected = MODEL_FILES.find((entry) => entry.path === relativePath)?.sizeBytes;
  if (expected !== undefined && bytes.byteLength !== expected) {
    throw new Error(
      `Pose model file ${relativePath} has ${bytes.byteLength} bytes, expected ${expected}: run npm run models`,
    );
  }
}

async function loadChecked(loadFile: ModelFileLoader, relativePath: string) {
  const bytes = await loadFile(relativePath);
  checkSize(relativePath, bytes);
  return bytes;
}

function toArrayBuffer(bytes: Uint8Array): ArrayBuffer {
  return bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength) as ArrayBuffer;
}

/** Builds an in-memory IOHandler for one graph model; weight files keep the names its JSON uses. */
export async function loadGraphModelHandler(
  loadFile: ModelFileLoader,
  graph: GraphModelFiles,
): Promise<tf.io.IOHandler> {
  const jsonBytes = await loadChecked(loadFile, `${graph.folder}/${graph.json}`);
  const modelJson = JSON.parse(new TextDecoder().decode(jsonBytes)) as tf.io.ModelJSON;
  const artifacts = await tf.io.getModelArtifactsForJSON(modelJson, async (manifest) => {
    const buffers: ArrayBuffer[] = [];
    for (const group of manifest) {
      for (const name of group.paths) {
        buffers.push(toArrayBuffer(await loadChecked(loadFile, `${graph.folder}/${name}`)));
      }
    }
    return [tf.io.getWeightSpecs(manifest), tf.io.concatenateArrayBuffers(buffers)];
  });
  return tf.io.fromMemory(artifacts);
}

/** Browser loader: fetches files under `baseUrl` (served from public/models/). */
export function fetchModelFiles(baseUrl: string): ModelFileLoader {
  return async (relativePath) => {
    const response = await fetch(`${baseUrl.replace(/\/$/, "")}/${relativePath}`);
    if (response.status === 404) throw new PoseWeightsMissingError(relativePath);
    if (!response.ok) throw new Error(`Could not load pose model file ${relativePath}: HTTP ${response.status}`);
    return new Uint8Array(await response.arrayBuffer());
  };
}
