// Pose detection over plain RGBA frames with MoveNet or BlazePose (tfjs), identical in the
// browser worker and in Node; model files arrive through a `loadFile` function.
import * as poseDetection from "@tensorflow-models/pose-detection";
import * as tf from "@tensorflow/tfjs";
import { usePoseBackend } from "./backend";
import {
  DEFAULT_POSE_BACKEND,
  DEFAULT_POSE_MODEL,
  POSE_MODEL_GRAPHS,
  type PoseBackend,
  type PoseModelId,
} from "./constants";
import { loadGraphModelHandler, type ModelFileLoader } from "./model-files";

/** Row-major RGBA pixels; `ImageData` fits this shape. */
export interface RgbaFrame {
  width: number;
  height: number;
  data: Uint8Array | Uint8ClampedArray;
}

/** A keypoint in pixels of the input frame (y down); names as pose-detection gives them. */
export interface PoseKeypoint {
  name: string;
  x: number;
  y: number;
  score: number;
}

export interface DetectedPose {
  /** Whole-pose confidence in 0..1 when the model reports one. */
  score: number | null;
  keypoints: PoseKeypoint[];
}

export interface PoseDetectorOptions {
  model?: PoseModelId;
  backend?: PoseBackend;
  loadFile: ModelFileLoader;
  /** Where the wasm backend finds its `.wasm` files (see lib/pose/node.ts and lib/pose/browser.ts). */
  wasmPath?: string;
  /** pose-detection's own temporal filter across video frames; on by default. */
  smoothing?: boolean;
}

export interface PoseDetector {
  readonly model: PoseModelId;
  readonly backend: PoseBackend;
  /**
   * Finds the most prominent person. Pass `timestampS` (strictly increasing within a clip) for
   * video frames; omit it for unrelated still images, which also forgets the previous frame.
   */
  estimate(frame: RgbaFrame, timestampS?: number): Promise<DetectedPose | null>;
  /** Forgets tracking and smoothing state; call between clips. */
  reset(): void;
  dispose(): void;
}

async function createLibraryDetector(
  model: PoseModelId,
  loadFile: ModelFileLoader,
  enableSmoothing: boolean,
): Promise<poseDetection.PoseDetector> {
  const [first, second] = await Promise.all(POSE_MODEL_GRAPHS[model].map((g) => loadGraphModelHandler(loadFile, g)));
  if (model === "movenet-lightning") {
    return poseDetection.createDetector(poseDetection.SupportedModels.MoveNet, {
      modelType: poseDetection.movenet.modelType.SINGLEPOSE_LIGHTNING,
      modelUrl: first,
      enableSmoothing,
    });
  }
  return poseDetection.createDetector(poseDetection.SupportedModels.BlazePose, {
    runtime: "tfjs",
    modelType: model === "blazepose-full" ? "full" : "lite",
    enableSmoothing,
    enableSegmentation: false,
    detectorModelUrl: first,
    landmarkModelUrl: second,
  });
}

function checkFrame(frame: RgbaFrame) {
  const { width, height, data } = frame;
  if (!Number.isInteger(width) || !Number.isInteger(height) || width <= 0 || height <= 0) {
    throw new Error(`Frame size must be positive whole pixels, got ${width}x${height}`);
  }
  if (data.length !== width * height * 4) {
    throw new Error(`Frame of ${width}x${height} needs ${width * height * 4} RGBA bytes, got ${data.length}`);
  }
}

/** tfjs only accepts a plain Uint8Array as pixel data outside the DOM; this view copies nothing. */
function toPixelTensor(frame: RgbaFrame): tf.Tensor3D {
  const data = new Uint8Array(frame.data.buffer, frame.data.byteOffset, frame.data.byteLength);
  return tf.browser.fromPixels({ width: frame.width, height: frame.height, data }, 3);
}

function toDetectedPose(pose: poseDetection.Pose | undefined): DetectedPose | null {
  if (!pose || pose.keypoints.length === 0) return null;
  return {
    score: pose.score ?? null,
    keypoints: pose.keypoints.map((k) => ({ name: k.name ?? "", x: k.x, y: k.y, score: k.score ?? 0 })),
  };
}

export async function createPoseDetector(options: PoseDetectorOptions): Promise<PoseDetector> {
  const model = options.model ?? DEFAULT_POSE_MODEL;
  const backend = options.backend ?? DEFAULT_POSE_BACKEND;
  await usePoseBackend(backend, options.wasmPath);
  const detector = await createLibraryDetector(model, options.loadFile, options.smoothing ?? true);
  let lastTimestampS = -Infinity;
  let busy = false;
  let disposed = false;

  const reset = () => {
    detector.reset();
    lastTimestampS = -Infinity;
  };

  async function estimate(frame: RgbaFrame, timestampS?: number): Promise<DetectedPose | null> {
    if (disposed) throw new Error("This pose detector was disposed");
    if (busy) throw new Error("estimate() calls must not overlap: await each frame before the next");
    checkFrame(frame);
    if (timestampS === undefined) {
      reset();
    } else if (!Number.isFinite(timestampS) || timestampS <= lastTimestampS) {
      throw new Error(
        `Frame timestamps must increase within a clip (got ${timestampS} s after ${lastTimestampS} s); call reset() between clips`,
      );
    }
    busy = true;
    const pixels = toPixelTensor(frame);
    try {
      // pose-detection takes milliseconds here and converts them to microseconds for its filters.
      const poses = await detector.estimatePoses(
        pixels,
        { maxPoses: 1, flipHorizontal: false },
        timestampS === undefined ? undefined : timestampS * 1000,
      );
      if (timestampS !== undefined) lastTimestampS = timestampS;
      return toDetectedPose(poses[0]);
    } finally {
      pixels.dispose();
      busy = false;
    }
  }

  return {
    model,
    backend,
    estimate,
    reset,
    dispose() {
      if (disposed) return;
      disposed = true;
      detector.dispose();
    },
  };
}
