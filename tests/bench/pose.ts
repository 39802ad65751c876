// Milliseconds per frame for each pose model in Node (tfjs wasm backend) on 640x360 frames, and the
// process's peak resident memory. Two scenes from opencv-doc: one large person drifting across the
// frame (a photo, as in a lift video: BlazePose tracks its region), and a street clip of small
// walkers (BlazePose keeps re-running its person detector: the slow case).
import * as tf from "@tensorflow/tfjs";
import { ensureModels } from "@/scripts/models";
import type { PoseModelId } from "@/lib/pose/constants";
import type { RgbaFrame } from "@/lib/pose/detector";
import { createNodePoseDetector } from "@/lib/pose/node";
import { decodeFrames, type DecodedFrame } from "@/lib/video/ffmpeg-frames";
import { opencvSample } from "@/tests/fixtures/opencv-doc";

const MODELS: PoseModelId[] = ["movenet-lightning", "blazepose-lite", "blazepose-full"];
const WIDTH = 640;
const HEIGHT = 360;
const WARM_UP_FRAMES = 3;
const TIMED_FRAMES = 30;

type Scene = { frame: RgbaFrame; tS: number }[];

/** The street clip scaled to 640x480, then its middle 360 rows. */
async function streetScene(count: number): Promise<Scene> {
  const frames: Scene = [];
  const top = 60;
  for await (const decoded of decodeFrames(await opencvSample("streetClip"), { maxWidth: WIDTH })) {
    const data = decoded.rgba.slice(top * WIDTH * 4, (top + HEIGHT) * WIDTH * 4);
    frames.push({ frame: { width: WIDTH, height: HEIGHT, data }, tS: decoded.tS });
    if (frames.length === count) break;
  }
  return frames;
}

/** The football photo (548x342) on a 640x360 canvas, moving 3 px right per frame at 30 fps. */
async function athleteScene(count: number): Promise<Scene> {
  let photo: DecodedFrame | undefined;
  for await (const frame of decodeFrames(await opencvSample("footballPhoto"))) photo = frame;
  if (!photo) throw new Error("the football photo decoded to no frame");
  const { width, height, rgba } = photo;
  return Array.from({ length: count }, (_, i) => {
    const data = new Uint8Array(WIDTH * HEIGHT * 4);
    const left = Math.min(3 * i, WIDTH - width);
    for (let y = 0; y < height; y++) {
      data.set(rgba.subarray(y * width * 4, (y + 1) * width * 4), ((y + 9) * WIDTH + left) * 4);
    }
    return { frame: { width: WIDTH, height: HEIGHT, data }, tS: i / 30 };
  });
}

const peakRssMb = () => process.resourceUsage().maxRSS / 1024;

function percentile(sorted: number[], p: number) {
  return sorted[Math.min(sorted.length - 1, Math.floor(p * sorted.length))];
}

/** Wall time, and CPU time of this process: the wasm backend runs on one thread, so CPU time
 * approximates the wall time of an idle machine when other work shares the cores. */
async function timeModel(model: PoseModelId, scene: Scene) {
  const detector = await createNodePoseDetector({ model });
  const wallMs: number[] = [];
  let cpuUs = 0;
  for (const [i, { frame, tS }] of scene.entries()) {
    const start = performance.now();
    const cpuStart = process.cpuUsage();
    await detector.estimate(frame, tS);
    const cpu = process.cpuUsage(cpuStart);
    if (i >= WARM_UP_FRAMES) {
      wallMs.push(performance.now() - start);
      cpuUs += cpu.user + cpu.system;
    }
  }
  detector.dispose();
  const sorted = [...wallMs].sort((a, b) => a - b);
  const meanMs = wallMs.reduce((sum, t) => sum + t, 0) / wallMs.length;
  const cpuMs = cpuUs / 1000 / wallMs.length;
  return (
    `wall mean ${meanMs.toFixed(1)} ms, median ${percentile(sorted, 0.5).toFixed(1)} ms, ` +
    `p90 ${percentile(sorted, 0.9).toFixed(1)} ms (${(1000 / meanMs).toFixed(1)} frames/s) | CPU ${cpuMs.toFixed(1)} ms`
  );
}

export async function run(): Promise<void> {
  await ensureModels({ log: () => {} });
  const scenes = {
    "one athlete": await athleteScene(WARM_UP_FRAMES + TIMED_FRAMES),
    "street clip": await streetScene(WARM_UP_FRAMES + TIMED_FRAMES),
  };
  console.log(`frames ${WIDTH}x${HEIGHT}, ${TIMED_FRAMES} timed after ${WARM_UP_FRAMES} warm-up, backend wasm (SIMD)`);
  for (const model of MODELS) {
    for (const [name, scene] of Object.entries(scenes)) {
      console.log(`${model.padEnd(18)} ${name.padEnd(12)} ${await timeModel(model, scene)}`);
    }
    console.log(`${model.padEnd(18)} peak RSS so far ${peakRssMb().toFixed(0)} MB, live tensors ${tf.memory().numTensors}`);
  }
}
