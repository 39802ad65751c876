// Which frames get pose: every frame in precise mode, a fixed spacing, or a spacing that follows
// pose's measured speed and what the rest of the run costs, within the real-time budget.
import { describe, expect, it } from "vitest";
import { createPoseScheduler, MAX_POSE_INTERVAL_S } from "@/lib/pipeline";

const FRAME_S = 1 / 30;

/** Frame times at 30 fps that a scheduler picks when every pose call takes `poseMs`. */
function picked(schedule: Parameters<typeof createPoseScheduler>[0], poseMs: number, otherShare: number, seconds = 10): number[] {
  const scheduler = createPoseScheduler(schedule);
  const times: number[] = [];
  for (let i = 0; i < seconds * 30; i++) {
    const tS = i * FRAME_S;
    if (scheduler.isDue(tS, FRAME_S)) {
      scheduler.recordPose(tS, poseMs);
      times.push(tS);
    }
    scheduler.recordProgress(tS, otherShare * tS);
  }
  return times;
}

function spacing(times: number[]): number {
  const late = times.slice(Math.floor(times.length / 2));
  return (late[late.length - 1] - late[0]) / (late.length - 1);
}

describe("pose scheduler", () => {
  it("runs pose on every frame in precise mode", () => {
    expect(picked({ kind: "every-frame" }, 130, 0.1, 2)).toHaveLength(60);
  });

  it("keeps a fixed spacing when asked", () => {
    const times = picked({ kind: "interval", intervalS: 0.1 }, 60, 0.1, 3);
    expect(spacing(times)).toBeCloseTo(0.1, 2);
  });

  it("spends at most the pose share of real time when the rest is cheap", () => {
    // 60 ms per pose at most half of real time: one pose per 0.12 s, i.e. every 4th frame at 30 fps.
    const times = picked({ kind: "adaptive", realTimeShare: 0.9, maxPoseShare: 0.5 }, 60, 0.1);
    const poseShare = (times.length * 0.06) / 10;
    expect(poseShare).toBeLessThanOrEqual(0.5);
    expect(poseShare).toBeGreaterThan(0.35);
    expect(spacing(times)).toBeCloseTo(4 * FRAME_S, 2);
  });

  it("gives pose less room when decoding and tracking take more of the budget", () => {
    const cheap = picked({ kind: "adaptive", realTimeShare: 0.9, maxPoseShare: 0.5 }, 40, 0.1);
    const costly = picked({ kind: "adaptive", realTimeShare: 0.9, maxPoseShare: 0.5 }, 40, 0.6);
    expect(costly.length).toBeLessThan(cheap.length);
    // 0.9 - 0.6 leaves 0.3 of real time: 40 ms per pose fits 7.5 a second.
    expect((costly.length * 0.04) / 10).toBeLessThanOrEqual(0.3 + 0.02);
  });

  it("never leaves more than the analysis can bridge between pose frames", () => {
    const times = picked({ kind: "adaptive", realTimeShare: 0.9, maxPoseShare: 0.5 }, 1400, 0.1);
    expect(spacing(times)).toBeLessThanOrEqual(MAX_POSE_INTERVAL_S + FRAME_S);
  });

  it("does not count the first, warm-up call", () => {
    const scheduler = createPoseScheduler({ kind: "adaptive", realTimeShare: 0.9, maxPoseShare: 0.5 });
    scheduler.recordPose(0, 900);
    expect(scheduler.intervalS).toBeLessThan(0.2);
  });
});
