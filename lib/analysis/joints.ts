// Joint names the analysis engine understands, and the mapping from the names
// pose models give (COCO-17 from MoveNet, BlazePose's 33 landmarks) onto them.

/** COCO-17 keypoints plus the heel and foot-index points BlazePose adds (needed for mid-foot). */
export const JOINT_NAMES = [
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
  "left_heel",
  "right_heel",
  "left_foot_index",
  "right_foot_index",
] as const;

export type JointName = (typeof JOINT_NAMES)[number];

const JOINT_NAME_SET: ReadonlySet<string> = new Set(JOINT_NAMES);

/**
 * Names already mapped. A track repeats the same few names in every frame, so each is worked out
 * once; the cap keeps a hostile file with endless distinct names from growing the cache.
 */
const normalised = new Map<string, JointName | null>();
const MAX_CACHED_NAMES = 1024;

/**
 * Maps a model's keypoint name onto ours, or null for points we do not use
 * (BlazePose's eye corners, mouth, fingers). Accepts snake_case as
 * pose-detection gives it, and also camelCase, kebab-case or spaced spellings
 * ("leftKnee", "Left Knee") because hand-made track files use them.
 */
export function normaliseJointName(name: string): JointName | null {
  const known = normalised.get(name);
  if (known !== undefined) return known;
  const snake = name
    .trim()
    .replace(/([a-z0-9])([A-Z])/g, "$1_$2")
    .toLowerCase()
    .replace(/[\s-]+/g, "_");
  const joint = JOINT_NAME_SET.has(snake) ? (snake as JointName) : null;
  if (normalised.size < MAX_CACHED_NAMES) normalised.set(name, joint);
  return joint;
}
