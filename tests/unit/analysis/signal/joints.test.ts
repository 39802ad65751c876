import { describe, expect, it } from "vitest";
import { JOINT_NAMES, normaliseJointName } from "@/lib/analysis/joints";

describe("JOINT_NAMES", () => {
  it("holds the 17 COCO keypoints plus heels and foot indices", () => {
    expect(JOINT_NAMES).toHaveLength(21);
    expect(new Set(JOINT_NAMES).size).toBe(21);
    expect(JOINT_NAMES).toContain("left_foot_index");
    expect(JOINT_NAMES).toContain("right_heel");
  });
});

describe("normaliseJointName", () => {
  it("keeps the names pose-detection gives for MoveNet (COCO-17)", () => {
    for (const name of JOINT_NAMES) expect(normaliseJointName(name)).toBe(name);
  });

  it("maps other spellings onto ours", () => {
    expect(normaliseJointName("leftKnee")).toBe("left_knee");
    expect(normaliseJointName("Right Hip")).toBe("right_hip");
    expect(normaliseJointName(" left-foot-index ")).toBe("left_foot_index");
  });

  it("ignores BlazePose landmarks we do not use", () => {
    for (const name of ["left_eye_inner", "mouth_left", "left_pinky", "right_thumb", "", "bar"]) {
      expect(normaliseJointName(name)).toBeNull();
    }
  });
});
