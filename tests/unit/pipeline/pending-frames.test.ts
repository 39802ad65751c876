// Frames whose pixels the pipeline reads on demand (the analysis worker's WebCodecs path): reading
// only the tracker's window on frames without pose must give exactly the track that whole frames
// give, and every decoded frame must be released once, also when the run stops early.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { runPipeline, type ClipFrame, type PendingFrame, type PipelineOptions } from "@/lib/pipeline";
import { createNodePoseDetector } from "@/lib/pose/node";
import type { PoseDetector } from "@/lib/pose/detector";
import type { PixelRect } from "@/lib/tracking";
import { createScene, type SceneOptions } from "@/tests/fixtures/clips/scene";

const SCENE: SceneOptions = {
  width: 640,
  height: 360,
  fps: 30,
  durationS: 4,
  seed: 5,
  plateRadiusFraction: 0.11,
  noiseSigma: 3,
  shutterFraction: 0.5,
  brightnessGain: 0.72,
  occluderWidthRadii: 1.3,
};

const scene = createScene(SCENE);
const start = scene.plateCentrePx(0);
const options: PipelineOptions = {
  lift: "squat",
  view: "side",
  source: { width: SCENE.width, height: SCENE.height, fps: SCENE.fps, durationS: SCENE.durationS },
  bar: { kind: "tap", x: start.x + 3, y: start.y - 2 },
  poseSchedule: { kind: "interval", intervalS: 0.5 },
};

async function* wholeFrames(): AsyncGenerator<ClipFrame> {
  for (let i = 0; i < scene.frameCount; i++) {
    yield { tS: i / SCENE.fps, frame: { width: SCENE.width, height: SCENE.height, data: scene.renderFrame(i).slice() } };
  }
}

interface PendingLog {
  regions: (PixelRect | null)[];
  yielded: number;
  released: number;
}

/** Pending frames that fill only the asked region and leave noise elsewhere, as a stale buffer would hold. */
async function* pendingFrames(log: PendingLog, onRead?: (index: number) => void): AsyncGenerator<PendingFrame> {
  const data = new Uint8ClampedArray(SCENE.width * SCENE.height * 4);
  for (let i = 0; i < scene.frameCount; i++) {
    log.yielded += 1;
    yield {
      tS: i / SCENE.fps,
      read: async (region) => {
        onRead?.(i);
        log.regions.push(region);
        const pixels = scene.renderFrame(i);
        for (let k = 0; k < data.length; k++) data[k] = (k * 7919 + i * 104729) & 255;
        const r = region ?? { x: 0, y: 0, width: SCENE.width, height: SCENE.height };
        for (let y = Math.max(0, r.y); y < Math.min(SCENE.height, r.y + r.height); y++) {
          const from = (y * SCENE.width + Math.max(0, r.x)) * 4;
          const to = (y * SCENE.width + Math.min(SCENE.width, r.x + r.width)) * 4;
          data.set(pixels.subarray(from, to), from);
        }
        return { width: SCENE.width, height: SCENE.height, data };
      },
      release: () => {
        log.released += 1;
      },
    };
  }
}

describe("pending frames", () => {
  let detector: PoseDetector;

  beforeAll(async () => {
    detector = await createNodePoseDetector({ smoothing: false });
  }, 120_000);

  afterAll(() => detector?.dispose());

  it("reads only the tracker's window between pose frames and tracks exactly as with whole frames", async () => {
    const whole = await runPipeline(wholeFrames(), options, { detector });
    const log: PendingLog = { regions: [], yielded: 0, released: 0 };
    const pending = await runPipeline(pendingFrames(log), options, { detector });

    expect(pending.track.frames).toEqual(whole.track.frames);
    expect(pending.plate).toEqual(whole.plate);
    expect(whole.stats.barFrames).toBeGreaterThan(0.9 * scene.frameCount);
    expect(log.released).toBe(scene.frameCount);
    // The first frame and each pose frame are read whole; the rest only around the bar.
    const wholeReads = log.regions.filter((r) => r === null).length;
    expect(wholeReads).toBe(pending.stats.poseFrames);
    expect(pending.stats.regionFrames).toBe(scene.frameCount - wholeReads);
    const meanShare =
      log.regions.filter((r): r is PixelRect => r !== null).reduce((sum, r) => sum + (r.width * r.height) / (SCENE.width * SCENE.height), 0) /
      pending.stats.regionFrames;
    expect(meanShare).toBeLessThan(0.25);
  }, 120_000);

  it("releases every frame it was given when the run stops early", async () => {
    const controller = new AbortController();
    const log: PendingLog = { regions: [], yielded: 0, released: 0 };
    const frames = pendingFrames(log, (index) => {
      if (index === 20) controller.abort(new Error("stopped"));
    });
    await expect(runPipeline(frames, options, { detector, signal: controller.signal })).rejects.toThrow("stopped");
    expect(log.yielded).toBe(21);
    expect(log.released).toBe(21);
  }, 120_000);
});
