// Decides which frames get pose detection. The bar is tracked on every frame; pose is the costly
// part, so by default it runs only as often as its measured speed allows: the whole run (decoding,
// tracking, pose) should take a set share of the clip's duration, with pose capped at its own share.
import type { PoseSchedule } from "./options";

/** MoveNet Lightning's time per call on a 2-core machine (wasm backend), used until pose has been timed. */
const PRIOR_POSE_MS = 70;
/** Share of real time taken by everything but pose, assumed until a second of clip has been seen. */
const PRIOR_OTHER_SHARE = 0.15;
const MIN_CLIP_FOR_MEASURED_SHARE_S = 1;
/** Pose keeps at least this share of real time however slow the rest is (common practice: some pose beats none). */
const MIN_POSE_SHARE = 0.1;
/** Weight of the newest timing in the running mean (common practice for a smoothed rate estimate). */
const TIMING_GAIN = 0.2;
/**
 * Widest spacing between pose frames: gaps up to 0.25 s are bridged by the analysis (resample's
 * default maxGapS), so joints stay measurable even when pose is slow, at the cost of real time.
 */
export const MAX_POSE_INTERVAL_S = 0.2;
/** A frame counts as due when it is at most this share of a frame interval early. */
const DUE_SLACK = 0.25;

export interface PoseScheduler {
  /** True when this frame (presentation time `tS`, seconds) should get pose detection. */
  isDue(tS: number, frameIntervalS: number): boolean;
  /** Reports how long the pose call on the frame at `tS` took. */
  recordPose(tS: number, durationMs: number): void;
  /** Reports the run so far: clip seconds processed, and wall seconds spent outside pose. */
  recordProgress(clipElapsedS: number, otherWallS: number): void;
  /** Current spacing between pose frames in clip seconds (0 = every frame). */
  readonly intervalS: number;
}

export function createPoseScheduler(schedule: PoseSchedule): PoseScheduler {
  let lastRunS = -Infinity;
  let calls = 0;
  let poseMs = PRIOR_POSE_MS;
  let otherShare = PRIOR_OTHER_SHARE;

  const intervalS = (): number => {
    if (schedule.kind === "every-frame") return 0;
    if (schedule.kind === "interval") return schedule.intervalS;
    const poseShare = Math.min(schedule.maxPoseShare, Math.max(MIN_POSE_SHARE, schedule.realTimeShare - otherShare));
    return Math.min(MAX_POSE_INTERVAL_S, poseMs / 1000 / poseShare);
  };

  return {
    get intervalS() {
      return intervalS();
    },
    isDue(tS, frameIntervalS) {
      return tS - lastRunS >= intervalS() - DUE_SLACK * frameIntervalS;
    },
    recordPose(tS, durationMs) {
      lastRunS = tS;
      calls += 1;
      // The first call compiles kernels and warms caches: far slower than the rest, so not counted.
      if (calls > 1) poseMs += TIMING_GAIN * (durationMs - poseMs);
    },
    recordProgress(clipElapsedS, otherWallS) {
      if (clipElapsedS >= MIN_CLIP_FOR_MEASURED_SHARE_S) otherShare = otherWallS / clipElapsedS;
    },
  };
}
