// Bar tracker speed: milliseconds per frame on synthetic 1280x720 and 640x360 frames held in
// memory (no decoding), plus the one-off plate-rim search from the tap.
import { createBarTracker, suggestPlateCircle, type RgbaFrame } from "@/lib/tracking";
import { createScene } from "@/tests/fixtures/clips/scene";

const FRAMES = 150;

function percentile(sorted: number[], p: number): number {
  return sorted[Math.min(sorted.length - 1, Math.floor(p * sorted.length))];
}

async function measure(width: number, height: number): Promise<void> {
  const scene = createScene({
    width,
    height,
    fps: 30,
    durationS: 12,
    seed: 11,
    plateRadiusFraction: 0.11,
    noiseSigma: 3,
    shutterFraction: 0.5,
    brightnessGain: 0.72,
    occluderWidthRadii: 1.3,
  });
  // Frames from the start of the second rep on, so the set includes motion and the occlusion.
  const firstIndex = Math.round(scene.motion.reps[1].startS * 30) - 30;
  const frames: RgbaFrame[] = Array.from({ length: FRAMES }, (_, k) => ({
    width,
    height,
    data: scene.renderFrame(firstIndex + k).slice(),
  }));
  const tap = scene.plateCentrePx(firstIndex / 30);
  const circleStart = performance.now();
  const circle = suggestPlateCircle(frames[0], tap.x + 2, tap.y - 2);
  const circleMs = performance.now() - circleStart;
  if (!circle) throw new Error(`no plate found in the ${width}x${height} bench frame`);
  const timings: number[] = [];
  for (let round = 0; round < 2; round++) {
    const tracker = createBarTracker({ tapX: circle.cx, tapY: circle.cy, firstFrame: frames[0], radiusPx: circle.radiusPx });
    for (const frame of frames) {
      const start = performance.now();
      tracker.track(frame);
      // The first round warms up the JIT; only the second one counts.
      if (round === 1) timings.push(performance.now() - start);
    }
    tracker.dispose();
  }
  timings.sort((a, b) => a - b);
  const mean = timings.reduce((s, t) => s + t, 0) / timings.length;
  console.log(
    `${width}x${height}: track ${mean.toFixed(2)} ms/frame mean, ${percentile(timings, 0.5).toFixed(2)} median, ` +
      `${percentile(timings, 0.95).toFixed(2)} p95 over ${timings.length} frames; plate rim search ${circleMs.toFixed(1)} ms`,
  );
}

export async function run(): Promise<void> {
  await measure(1280, 720);
  await measure(640, 360);
}
