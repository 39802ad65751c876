// Runs the real pose models (tfjs wasm backend in Node) on real photos of people from Debian's
// opencv-doc package and checks the keypoints are where a body is.
import * as poseDetection from "@tensorflow-models/pose-detection";
import * as tf from "@tensorflow/tfjs";
import { cp, mkdtemp, rm, truncate } from "node:fs/promises";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { ensureModels } from "@/scripts/models";
import { POSE_MODEL_KEYPOINT_NAMES, type PoseModelId } from "@/lib/pose/constants";
import type { DetectedPose, PoseDetector, RgbaFrame } from "@/lib/pose/detector";
import { createNodePoseDetector, NODE_MODELS_DIR } from "@/lib/pose/node";
import { decodeFrames } from "@/lib/video/ffmpeg-frames";
import { opencvSample, type OpencvSample } from "@/tests/fixtures/opencv-doc";

interface Box {
  xMin: number;
  xMax: number;
  yMin: number;
  yMax: number;
}

// Real inference: a frame takes 0.1-0.5 s on two shared cores, more than the default 5 s allows per test.
vi.setConfig({ testTimeout: 60_000 });

const MODELS: PoseModelId[] = ["movenet-lightning", "blazepose-full", "blazepose-lite"];
// pose-detection's MoveNet drops poses below this score (DEFAULT_MIN_POSE_SCORE in its movenet/constants).
const MIN_POSE_SCORE = 0.25;
const BODY_KEYPOINTS = [
  "nose",
  "left_shoulder",
  "right_shoulder",
  "left_hip",
  "right_hip",
  "left_knee",
  "right_knee",
  "left_ankle",
  "right_ankle",
];

const detectors = new Map<PoseModelId, PoseDetector>();

async function decodeStill(name: OpencvSample): Promise<RgbaFrame> {
  for await (const frame of decodeFrames(await opencvSample(name))) {
    return { width: frame.width, height: frame.height, data: frame.rgba };
  }
  throw new Error(`${name} decoded to no frame`);
}

function crop(frame: RgbaFrame, box: { x: number; width: number }): RgbaFrame {
  const data = new Uint8Array(box.width * frame.height * 4);
  for (let y = 0; y < frame.height; y++) {
    const start = (y * frame.width + box.x) * 4;
    data.set(frame.data.subarray(start, start + box.width * 4), y * box.width * 4);
  }
  return { width: box.width, height: frame.height, data };
}

function point(pose: DetectedPose, name: string) {
  const keypoint = pose.keypoints.find((k) => k.name === name);
  if (!keypoint) throw new Error(`no ${name} keypoint`);
  return keypoint;
}

const midY = (pose: DetectedPose, a: string, b: string) => (point(pose, a).y + point(pose, b).y) / 2;

/** Head above shoulders above hips above ankles, and the body's keypoints inside the person's box. */
function expectUprightPersonIn(pose: DetectedPose | null, box: Box) {
  expect(pose).not.toBeNull();
  const found = pose as DetectedPose;
  expect(found.score ?? 0).toBeGreaterThan(MIN_POSE_SCORE);
  expect(point(found, "nose").y).toBeLessThan(midY(found, "left_shoulder", "right_shoulder"));
  expect(midY(found, "left_shoulder", "right_shoulder")).toBeLessThan(midY(found, "left_hip", "right_hip"));
  expect(midY(found, "left_hip", "right_hip")).toBeLessThan(midY(found, "left_ankle", "right_ankle"));
  for (const name of BODY_KEYPOINTS) {
    const { x, y } = point(found, name);
    expect({ name, x, y, inside: x >= box.xMin && x <= box.xMax && y >= box.yMin && y <= box.yMax }).toMatchObject({
      inside: true,
    });
  }
}

beforeAll(async () => {
  await ensureModels({ log: () => {} });
  for (const model of MODELS) detectors.set(model, await createNodePoseDetector({ model }));
}, 120_000);

afterAll(() => {
  for (const detector of detectors.values()) detector.dispose();
});

describe.each(MODELS)("%s on real photos", (model) => {
  it("finds the player in the football photo", async () => {
    const frame = await decodeStill("footballPhoto");
    const pose = await detectors.get(model)!.estimate(frame);
    // The player's extent in the 548x342 photo, measured by eye from the image (hands to boot, hair to boot).
    expectUprightPersonIn(pose, { xMin: 55, xMax: 470, yMin: 45, yMax: 342 });
  });

  it("finds the standing man in the basketball photo (left part)", async () => {
    // The left 260 px hold only the man with the ball; the other person is cut off at the right edge.
    const frame = crop(await decodeStill("basketballPhoto"), { x: 0, width: 260 });
    const pose = await detectors.get(model)!.estimate(frame);
    // His extent in the photo, measured by eye: x 35..165, head at y 80, feet at the bottom edge.
    expectUprightPersonIn(pose, { xMin: 20, xMax: 200, yMin: 60, yMax: 480 });
  });

  it("names keypoints as pose-detection does, in its order", async () => {
    const pose = await detectors.get(model)!.estimate(await decodeStill("footballPhoto"));
    const expected = POSE_MODEL_KEYPOINT_NAMES[model];
    const library = poseDetection.util.getKeypointIndexByName(
      model === "movenet-lightning" ? poseDetection.SupportedModels.MoveNet : poseDetection.SupportedModels.BlazePose,
    );
    expect(pose?.keypoints.map((k) => k.name)).toEqual([...expected]);
    expect(Object.keys(library).sort((a, b) => library[a] - library[b])).toEqual([...expected]);
  });
});

describe.each(MODELS)("%s on a moving clip", (model) => {
  // The football photo slides right by 12 px a frame on a wider canvas, 10 frames at 10 fps.
  async function* slidingClip() {
    const photo = await decodeStill("footballPhoto");
    const width = photo.width + 120;
    for (let i = 0; i < 10; i++) {
      const data = new Uint8Array(width * photo.height * 4);
      for (let y = 0; y < photo.height; y++) {
        data.set(photo.data.subarray(y * photo.width * 4, (y + 1) * photo.width * 4), (y * width + 12 * i) * 4);
      }
      yield { frame: { width, height: photo.height, data }, tS: i / 10, shiftPx: 12 * i };
    }
  }

  it("follows the person, keeps tensor count flat, and frees everything on dispose", async () => {
    const tensorsBefore = tf.memory().numTensors;
    const detector = await createNodePoseDetector({ model });
    const tensorCounts: number[] = [];
    const noseOffsets: number[] = [];
    for await (const { frame, tS, shiftPx } of slidingClip()) {
      const pose = await detector.estimate(frame, tS);
      expect(pose).not.toBeNull();
      noseOffsets.push(point(pose!, "nose").x - shiftPx);
      tensorCounts.push(tf.memory().numTensors);
    }
    // Nose position relative to the photo stays put while the photo moves (within 15 px, common practice).
    for (const offset of noseOffsets) expect(Math.abs(offset - noseOffsets[0])).toBeLessThan(15);
    expect(new Set(tensorCounts.slice(1)).size).toBe(1);
    detector.dispose();
    expect(tf.memory().numTensors).toBe(tensorsBefore);
  });

  it("refuses timestamps that do not increase until reset()", async () => {
    const detector = detectors.get(model)!;
    const frame = await decodeStill("footballPhoto");
    detector.reset();
    await detector.estimate(frame, 1);
    await expect(detector.estimate(frame, 1)).rejects.toThrow(/timestamps must increase.*reset\(\)/);
    detector.reset();
    await expect(detector.estimate(frame, 0.5)).resolves.not.toBeNull();
  });
});

describe("bad input", () => {
  it("rejects a frame whose pixel buffer does not match its size", async () => {
    const detector = detectors.get("movenet-lightning")!;
    await expect(detector.estimate({ width: 10, height: 10, data: new Uint8Array(300) })).rejects.toThrow(
      /needs 400 RGBA bytes, got 300/,
    );
  });

  it("says how to get the weights when they are missing", async () => {
    const emptyDir = await mkdtemp(path.join(os.tmpdir(), "plumbline-no-models-"));
    try {
      await expect(createNodePoseDetector({ model: "blazepose-full", modelsDir: emptyDir })).rejects.toThrow(
        "Pose model weights are missing: run npm run models",
      );
    } finally {
      await rm(emptyDir, { recursive: true, force: true });
    }
  });

  it("says how to repair a truncated weight file", async () => {
    const copyDir = await mkdtemp(path.join(os.tmpdir(), "plumbline-bad-models-"));
    try {
      await cp(path.join(NODE_MODELS_DIR, "movenet-lightning"), path.join(copyDir, "movenet-lightning"), {
        recursive: true,
      });
      await truncate(path.join(copyDir, "movenet-lightning/movenet-lightning.bin"), 1000);
      await expect(createNodePoseDetector({ modelsDir: copyDir })).rejects.toThrow(
        /movenet-lightning\.bin has 1000 bytes, expected 4650216: run npm run models/,
      );
    } finally {
      await rm(copyDir, { recursive: true, force: true });
    }
  });
});
