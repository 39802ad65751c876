// Which way the athlete faces and which body side is nearer the camera, so that side-view
// measures use the better-seen joints and horizontal distances have a meaning (toward the feet).
import type { JointName } from "./joints";
import { normaliseJointName } from "./joints";
import type { CameraView, Lift, Track } from "./track";

export type Side = "left" | "right";

export interface Signal {
  x: number[];
  y: number[];
  valid: boolean[];
}

/** Joints whose keypoint scores decide the nearer side. */
const SIDE_EVIDENCE = ["shoulder", "elbow", "wrist", "hip", "knee", "ankle"] as const;

/** The side with the higher mean keypoint score over the clip (the far side is partly hidden); null when no side joint was seen. */
export function nearerSide(track: Track): Side | null {
  const total = { left: 0, right: 0 };
  // Keypoint names repeat every frame: classify each distinct name once.
  const sideOf = new Map<string, Side | null>();
  const classify = (raw: string): Side | null => {
    const name = normaliseJointName(raw);
    if (!name) return null;
    const [side, joint] = splitName(name);
    return side && (SIDE_EVIDENCE as readonly string[]).includes(joint) ? side : null;
  };
  for (const frame of track.frames) {
    for (const k of frame.keypoints) {
      let side = sideOf.get(k.name);
      if (side === undefined) sideOf.set(k.name, (side = classify(k.name)));
      if (side) total[side] += k.score;
    }
  }
  if (total.left === 0 && total.right === 0) return null;
  return total.left >= total.right ? "left" : "right";
}

function splitName(name: JointName): [Side | null, string] {
  if (name.startsWith("left_")) return ["left", name.slice(5)];
  if (name.startsWith("right_")) return ["right", name.slice(6)];
  return [null, name];
}

/** The named joint of a side, falling back to the other side when that one was never seen. */
export function sideJoint(joints: Partial<Record<JointName, Signal>>, side: Side, joint: string): Signal | undefined {
  const other: Side = side === "left" ? "right" : "left";
  return joints[`${side}_${joint}` as JointName] ?? joints[`${other}_${joint}` as JointName];
}

export interface Facing {
  /** +1 when the athlete's feet (toes; on the bench, feet rather than head) are toward image right. */
  sign: 1 | -1;
  /** What positive horizontal distances mean in the output. */
  axis: "toward-feet" | "image-right";
  basis: string;
}

/** Mean of a − b over samples where both are valid, or null with too few of them. */
function meanDifference(a: Signal | undefined, b: Signal | undefined): number | null {
  if (!a || !b) return null;
  let sum = 0;
  let n = 0;
  for (let i = 0; i < a.x.length; i++) {
    if (a.valid[i] && b.valid[i]) {
      sum += a.x[i] - b.x[i];
      n++;
    }
  }
  return n >= Math.max(3, 0.1 * a.x.length) && sum !== 0 ? sum / n : null;
}

/**
 * Side view only. Toes ahead of heels when the feet are seen; else the nose ahead of the ear; else
 * bent knees ahead of the ankles. On the bench, the hips lie toward the feet from the shoulders.
 */
export function facing(lift: Lift, view: CameraView, joints: Partial<Record<JointName, Signal>>, side: Side | null): Facing {
  const unknown: Facing = { sign: 1, axis: "image-right", basis: "front view or orientation unknown: positive is image right" };
  if (view !== "side" || side === null) return unknown;
  const j = (name: string) => sideJoint(joints, side, name);
  const tests: [string, number | null][] =
    lift === "bench"
      ? [["hips toward the feet from the shoulders", meanDifference(j("hip"), j("shoulder"))]]
      : [
          ["toes ahead of heels", meanDifference(j("foot_index"), j("heel"))],
          ["nose ahead of the ear", meanDifference(joints.nose, j("ear"))],
          ["knees ahead of the ankles", meanDifference(j("knee"), j("ankle"))],
        ];
  for (const [basis, d] of tests) if (d !== null) return { sign: d > 0 ? 1 : -1, axis: "toward-feet", basis };
  return unknown;
}
