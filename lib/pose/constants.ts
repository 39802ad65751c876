// Pose model identifiers, input sizes, file locations and keypoint names, shared by the
// browser worker, the command line and the `npm run models` script.
import { z } from "zod";

export const POSE_MODEL_IDS = ["movenet-lightning", "blazepose-full", "blazepose-lite"] as const;
export type PoseModelId = (typeof POSE_MODEL_IDS)[number];
/** For model ids arriving from outside (worker messages, command-line flags, saved settings). */
export const poseModelIdSchema = z.enum(POSE_MODEL_IDS);

/** Fast default; BlazePose full is the precise choice (33 keypoints, heels and toes). */
export const DEFAULT_POSE_MODEL: PoseModelId = "movenet-lightning";
export const PRECISE_POSE_MODEL: PoseModelId = "blazepose-full";

export const POSE_BACKENDS = ["wasm", "webgl", "cpu"] as const;
export type PoseBackend = (typeof POSE_BACKENDS)[number];
export const DEFAULT_POSE_BACKEND: PoseBackend = "wasm";

/** One tfjs graph model: a JSON topology plus the weight files it names (names kept as shipped). */
export interface GraphModelFiles {
  /** Folder under the models root, e.g. `movenet-lightning`. */
  folder: string;
  /** Topology file inside the folder. */
  json: string;
  /** Square input side in pixels the graph was exported with. */
  inputSizePx: number;
}

export const MOVENET_LIGHTNING_GRAPH: GraphModelFiles = {
  folder: "movenet-lightning",
  json: "movenet-lightning.json",
  inputSizePx: 192,
};
export const BLAZEPOSE_DETECTOR_GRAPH: GraphModelFiles = {
  folder: "blazepose-detector",
  json: "blazepose-detector.json",
  inputSizePx: 224,
};
export const BLAZEPOSE_FULL_GRAPH: GraphModelFiles = {
  folder: "blazepose-full",
  json: "blazepose-full.json",
  inputSizePx: 256,
};
export const BLAZEPOSE_LITE_GRAPH: GraphModelFiles = {
  folder: "blazepose-lite",
  json: "blazepose-lite.json",
  inputSizePx: 256,
};

/** Graphs each model id needs: MoveNet's single graph; BlazePose's person detector, then its landmark graph. */
export const POSE_MODEL_GRAPHS: Record<PoseModelId, readonly GraphModelFiles[]> = {
  "movenet-lightning": [MOVENET_LIGHTNING_GRAPH],
  "blazepose-full": [BLAZEPOSE_DETECTOR_GRAPH, BLAZEPOSE_FULL_GRAPH],
  "blazepose-lite": [BLAZEPOSE_DETECTOR_GRAPH, BLAZEPOSE_LITE_GRAPH],
};

/** URL path the browser loads model files from (files live in `public/models/`). */
export const MODELS_URL_PATH = "/models";
/** Folder under the models root holding the tfjs wasm binaries. */
export const TFJS_WASM_FOLDER = "tfjs-wasm";
export const TFJS_WASM_FILES = [
  "tfjs-backend-wasm.wasm",
  "tfjs-backend-wasm-simd.wasm",
  "tfjs-backend-wasm-threaded-simd.wasm",
] as const;

export const MISSING_WEIGHTS_MESSAGE = "Pose model weights are missing: run npm run models";

/** COCO-17 names in MoveNet's output order (as @tensorflow-models/pose-detection names them). */
export const COCO_KEYPOINT_NAMES = [
  "nose",
  "left_eye",
  "right_eye",
  "left_ear",
  "right_ear",
  "left_shoulder",
  "right_shoulder",
  "left_elbow",
  "right_elbow",
  "left_wrist",
  "right_wrist",
  "left_hip",
  "right_hip",
  "left_knee",
  "right_knee",
  "left_ankle",
  "right_ankle",
] as const;

/** BlazePose's 33 names in output order (as @tensorflow-models/pose-detection names them). */
export const BLAZEPOSE_KEYPOINT_NAMES = [
  "nose",
  "left_eye_inner",
  "left_eye",
  "left_eye_outer",
  "right_eye_inner",
  "right_eye",
  "right_eye_outer",
  "left_ear",
  "right_ear",
  "mouth_left",
  "mouth_right",
  "left_shoulder",
  "right_shoulder",
  "left_elbow",
  "right_elbow",
  "left_wrist",
  "right_wrist",
  "left_pinky",
  "right_pinky",
  "left_index",
  "right_index",
  "left_thumb",
  "right_thumb",
  "left_hip",
  "right_hip",
  "left_knee",
  "right_knee",
  "left_ankle",
  "right_ankle",
  "left_heel",
  "right_heel",
  "left_foot_index",
  "right_foot_index",
] as const;

export type CocoKeypointName = (typeof COCO_KEYPOINT_NAMES)[number];
export type BlazePoseKeypointName = (typeof BLAZEPOSE_KEYPOINT_NAMES)[number];
export type PoseKeypointName = CocoKeypointName | BlazePoseKeypointName;

export const POSE_MODEL_KEYPOINT_NAMES: Record<PoseModelId, readonly PoseKeypointName[]> = {
  "movenet-lightning": COCO_KEYPOINT_NAMES,
  "blazepose-full": BLAZEPOSE_KEYPOINT_NAMES,
  "blazepose-lite": BLAZEPOSE_KEYPOINT_NAMES,
};
