// Stick figures for rep compare: the pose of the stored track at a rep's start, bottom or lockout, in
// metres relative to the feet (mid-point of the ankles), so figures from different clips, distances and
// camera positions can be laid over each other. Pure: the page reads the track, this picks and scales.
import { normaliseJointName, type JointName } from "@/lib/analysis/joints";
import type { Track } from "@/lib/analysis/track";

export const COMPARE_PHASES = ["start", "bottom", "lockout"] as const;
export type ComparePhase = (typeof COMPARE_PHASES)[number];

/** Keypoints below this score are left out of the figure (common practice for MoveNet-style scores). */
const MIN_SCORE = 0.3;

/** Bones drawn between joints, one side of the body at a time. */
export const BONES: readonly [JointName, JointName][] = [
  ["left_shoulder", "right_shoulder"],
  ["left_hip", "right_hip"],
  ...(["left", "right"] as const).flatMap((side): [JointName, JointName][] => [
    [`${side}_shoulder`, `${side}_elbow`],
    [`${side}_elbow`, `${side}_wrist`],
    [`${side}_shoulder`, `${side}_hip`],
    [`${side}_hip`, `${side}_knee`],
    [`${side}_knee`, `${side}_ankle`],
    [`${side}_ankle`, `${side}_heel`],
    [`${side}_heel`, `${side}_foot_index`],
    [`${side}_ankle`, `${side}_foot_index`],
  ]),
];

/** Joint positions in metres: x to image right, y up, origin between the ankles. */
export type StickFigure = Partial<Record<JointName, { xM: number; yM: number }>>;

/** The frame nearest a time (frames are in time order). */
export function nearestFrameIndex(times: readonly number[], timeS: number): number {
  let lo = 0;
  let hi = times.length - 1;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (times[mid] < timeS) lo = mid + 1;
    else hi = mid;
  }
  return lo > 0 && Math.abs(times[lo - 1] - timeS) <= Math.abs(times[lo] - timeS) ? lo - 1 : lo;
}

/** The figure at a time, or null when the feet were not seen in that frame. */
export function stickFigureAt(track: Pick<Track, "frames">, timeS: number, metresPerPixel: number): StickFigure | null {
  if (track.frames.length === 0) return null;
  const frame = track.frames[nearestFrameIndex(track.frames.map((f) => f.t), timeS)];
  const pixels = new Map<JointName, { x: number; y: number }>();
  for (const kp of frame.keypoints) {
    const name = normaliseJointName(kp.name);
    if (name && kp.score >= MIN_SCORE) pixels.set(name, { x: kp.x, y: kp.y });
  }
  const ankles = [pixels.get("left_ankle"), pixels.get("right_ankle")].filter((p) => p !== undefined);
  if (ankles.length === 0) return null;
  const ox = ankles.reduce((s, p) => s + p.x, 0) / ankles.length;
  const oy = ankles.reduce((s, p) => s + p.y, 0) / ankles.length;
  const figure: StickFigure = {};
  for (const [name, p] of pixels) figure[name] = { xM: (p.x - ox) * metresPerPixel, yM: (oy - p.y) * metresPerPixel };
  return figure;
}
