// Live read-outs for the frame on screen: knee, hip and torso angles from that frame's pose, and the
// bar's speed from the tracked positions around it. Raw per-frame values (the rep tables hold the
// smoothed measures); the same angle definitions as the analysis engine (lib/analysis/posture.ts).
import { angleToVerticalDeg, interiorAngleDeg, type Point } from "@/lib/analysis/angles";
import { normaliseJointName, type JointName } from "@/lib/analysis/joints";

export interface Keypoint {
  name: string;
  x: number;
  y: number;
  score: number;
}

/** Keypoints below this confidence are not drawn or measured (MoveNet's demo threshold; common practice). */
export const MIN_KEYPOINT_SCORE = 0.3;

export interface FrameAngles {
  side: "left" | "right";
  kneeDeg: number | null;
  hipDeg: number | null;
  torsoDeg: number | null;
}

function jointMap(keypoints: readonly Keypoint[]): Map<JointName, Keypoint> {
  const map = new Map<JointName, Keypoint>();
  for (const k of keypoints) {
    const name = normaliseJointName(k.name);
    if (name && k.score >= MIN_KEYPOINT_SCORE) map.set(name, k);
  }
  return map;
}

/** Image y points down; the engine's angles take y up, so flip it (interior angles do not care, torso does not either, being unsigned). */
const up = (k: Keypoint | undefined): Point | null => (k ? { x: k.x, y: -k.y } : null);

/** Angles on the side of the body the camera sees better (higher summed confidence of hip, knee, ankle, shoulder). */
export function frameAngles(keypoints: readonly Keypoint[]): FrameAngles | null {
  const joints = jointMap(keypoints);
  const confidence = (side: "left" | "right") =>
    ["shoulder", "hip", "knee", "ankle"].reduce((sum, part) => sum + (joints.get(`${side}_${part}` as JointName)?.score ?? 0), 0);
  const side = confidence("left") >= confidence("right") ? "left" : "right";
  const get = (part: string) => up(joints.get(`${side}_${part}` as JointName));
  const [shoulder, hip, knee, ankle] = ["shoulder", "hip", "knee", "ankle"].map(get);
  if (!shoulder && !hip && !knee) return null;
  return {
    side,
    kneeDeg: hip && knee && ankle ? interiorAngleDeg(hip, knee, ankle) : null,
    hipDeg: shoulder && hip && knee ? interiorAngleDeg(shoulder, hip, knee) : null,
    torsoDeg: hip && shoulder ? angleToVerticalDeg(hip, shoulder) : null,
  };
}

/** Pairs of joints joined by a bone in the skeleton overlay (COCO-17 limbs). */
export const BONES: readonly [JointName, JointName][] = [
  ["left_shoulder", "right_shoulder"],
  ["left_hip", "right_hip"],
  ["left_shoulder", "left_hip"],
  ["right_shoulder", "right_hip"],
  ["left_shoulder", "left_elbow"],
  ["left_elbow", "left_wrist"],
  ["right_shoulder", "right_elbow"],
  ["right_elbow", "right_wrist"],
  ["left_hip", "left_knee"],
  ["left_knee", "left_ankle"],
  ["right_hip", "right_knee"],
  ["right_knee", "right_ankle"],
  ["left_ankle", "left_heel"],
  ["left_heel", "left_foot_index"],
  ["right_ankle", "right_heel"],
  ["right_heel", "right_foot_index"],
];

/** Bone segments as flat [x0, y0, x1, y1] in video pixels, for the joints seen confidently. */
export function skeletonSegments(keypoints: readonly Keypoint[]): number[][] {
  const joints = jointMap(keypoints);
  return BONES.flatMap(([a, b]) => {
    const p = joints.get(a);
    const q = joints.get(b);
    return p && q ? [[p.x, p.y, q.x, q.y]] : [];
  });
}

/**
 * Bar speed at frame i in metres per second: the central difference over `halfWindow` frames each side
 * (a plain finite difference; the rep tables use the engine's filtered speed). Null near gaps.
 */
export function barSpeedMps(
  frames: readonly { t: number; bar: { x: number; y: number } | null }[],
  index: number,
  metresPerPixel: number,
  halfWindow = 2,
): number | null {
  const from = frames[Math.max(0, index - halfWindow)];
  const to = frames[Math.min(frames.length - 1, index + halfWindow)];
  if (!from?.bar || !to?.bar || to.t <= from.t) return null;
  return (Math.hypot(to.bar.x - from.bar.x, to.bar.y - from.bar.y) * metresPerPixel) / (to.t - from.t);
}
