import { describe, expect, it } from "vitest";
import { ANKLE_HEIGHT_RATIO, EYE_HEIGHT_RATIO, FULL_SIZE_PLATE_DIAMETER_M, resolveScale } from "@/lib/analysis/calibration";
import { resampleTrack } from "@/lib/analysis/resample";
import { parseTrack, TrackInputError } from "@/lib/analysis/track";

type Pose = Record<string, { x: number; y: number }>;

/** Side-view athlete 1.80 m tall drawn at 0.002 m/px: eye-to-ankle = 1.80 * (0.936 - 0.039) m = 807.3 px. */
const HEIGHT_M = 1.8;
const TRUE_MPP = 0.002;
const EYE_TO_ANKLE_PX = (HEIGHT_M * (EYE_HEIGHT_RATIO - ANKLE_HEIGHT_RATIO)) / TRUE_MPP;

function standing(dropPx = 0): Pose {
  const ankleY = 950;
  return {
    left_eye: { x: 500, y: ankleY - EYE_TO_ANKLE_PX + dropPx },
    left_hip: { x: 500, y: ankleY - 0.491 * EYE_TO_ANKLE_PX },
    left_knee: { x: 505, y: ankleY - 0.25 * EYE_TO_ANKLE_PX },
    left_ankle: { x: 500, y: ankleY },
  };
}

function squatting(): Pose {
  return {
    left_eye: { x: 470, y: 500 },
    left_hip: { x: 380, y: 700 },
    left_knee: { x: 600, y: 720 },
    left_ankle: { x: 500, y: 950 },
  };
}

function trackOf(poses: Pose[], calibration: unknown = { athleteHeightM: HEIGHT_M }) {
  return parseTrack({
    version: 1,
    lift: "squat",
    view: "side",
    fps: 30,
    width: 1080,
    height: 1920,
    calibration,
    frames: poses.map((pose, i) => ({
      t: i / 30,
      bar: null,
      keypoints: Object.entries(pose).map(([name, p]) => ({ name, ...p, score: 0.9 })),
    })),
  });
}

describe("FULL_SIZE_PLATE_DIAMETER_M", () => {
  it("is 450 mm", () => {
    expect(FULL_SIZE_PLATE_DIAMETER_M).toBe(0.45); // IWF Technical and Competition Rules (discs), IPF Technical Rules (discs)
  });
});

describe("resolveScale from a plate", () => {
  it("divides the plate diameter by its pixel diameter", () => {
    const scale = resolveScale({ plate: { cx: 0, cy: 0, radiusPx: 75, diameterM: 0.45 } });
    expect(scale.method).toBe("plate");
    expect(scale.metresPerPixel).toBeCloseTo(0.003, 12);
    // ±1 px on a 75 px radius and ±1 mm on 450 mm: hypot(1/75, 1/450) = 1.352 %.
    expect(scale.uncertaintyPct).toBeCloseTo(1.352, 3);
  });

  it("gets wider error from a smaller plate image", () => {
    expect(resolveScale({ plate: { cx: 0, cy: 0, radiusPx: 20, diameterM: 0.45 } }).uncertaintyPct).toBeGreaterThan(5);
  });
});

describe("resolveScale from a given scale", () => {
  it("passes it through and says when its error is unknown", () => {
    expect(resolveScale({ metresPerPixel: 0.0021 })).toMatchObject({ metresPerPixel: 0.0021, method: "scale", uncertaintyPct: 0 });
    expect(resolveScale({ metresPerPixel: 0.0021 }).note).toMatch(/unknown/);
    expect(resolveScale({ metresPerPixel: 0.0021, uncertaintyPct: 2 }).uncertaintyPct).toBe(2);
  });
});

describe("resolveScale from the athlete's height", () => {
  it("measures eye-to-ankle in standing frames and ignores squatting ones", () => {
    const poses = [...Array(10)].map((_, i) => (i >= 3 && i <= 6 ? squatting() : standing()));
    const track = trackOf(poses);
    const scale = resolveScale(track.calibration, resampleTrack(track));
    expect(scale.method).toBe("athlete-height");
    expect(scale.metresPerPixel).toBeCloseTo(TRUE_MPP, 9);
    expect(scale.uncertaintyPct).toBe(10);
    expect(scale.note).toMatch(/Drillis & Contini/);
  });

  it("falls back to the nose, 0.03 H below the eyes (from memory), when no eye is seen", () => {
    const poses = [...Array(6)].map(() => {
      const { left_eye, ...rest } = standing();
      return { ...rest, nose: { x: left_eye.x, y: left_eye.y + (0.03 * HEIGHT_M) / TRUE_MPP } };
    });
    const track = trackOf(poses);
    expect(resolveScale(track.calibration, resampleTrack(track)).metresPerPixel).toBeCloseTo(TRUE_MPP, 9);
  });

  it("explains when the athlete never stands (a bench press)", () => {
    const lying: Pose = {
      left_eye: { x: 200, y: 600 },
      left_hip: { x: 700, y: 620 },
      left_knee: { x: 900, y: 500 },
      left_ankle: { x: 950, y: 800 },
    };
    const track = trackOf([lying, lying, lying, lying]);
    expect(() => resolveScale(track.calibration, resampleTrack(track))).toThrow(TrackInputError);
    expect(() => resolveScale(track.calibration, resampleTrack(track))).toThrow(/^calibration\.athleteHeightM: cannot calibrate/);
  });

  it("does not take a squat's bottom position as standing", () => {
    const track = trackOf([squatting(), squatting(), squatting(), squatting()]);
    expect(() => resolveScale(track.calibration, resampleTrack(track))).toThrow(/cannot calibrate/);
  });

  it("needs the resampled track", () => {
    expect(() => resolveScale({ athleteHeightM: 1.8 })).toThrow(/resampled track/);
  });
});
