// Analysis engine speed: median time of analyseTrack over a 60 s, 60 fps synthetic squat track,
// after warm-up runs, with the share taken by track validation and resampling.
import { analyseTrack } from "@/lib/analysis/analyse";
import { resampleTrack } from "@/lib/analysis/resample";
import { parseTrack, type Track } from "@/lib/analysis/track";
import { generateSyntheticSet } from "@/tests/fixtures/synthetic";

const DURATION_S = 60;
const FPS = 60;
const WARM_UP_RUNS = 3;
const TIMED_RUNS = 9;

function sixtySecondTrack(): Track {
  const { track } = generateSyntheticSet({ lift: "squat", seed: 7, fps: FPS, reps: 16, keypointSet: "blazepose" });
  return parseTrack({ ...track, frames: track.frames.filter((f) => f.t <= DURATION_S) });
}

function medianMs(fn: () => unknown): number {
  for (let i = 0; i < WARM_UP_RUNS; i++) fn();
  const times: number[] = [];
  for (let i = 0; i < TIMED_RUNS; i++) {
    const t0 = performance.now();
    fn();
    times.push(performance.now() - t0);
  }
  return [...times].sort((a, b) => a - b)[TIMED_RUNS >> 1];
}

export async function run(): Promise<void> {
  const track = sixtySecondTrack();
  const spanS = track.frames[track.frames.length - 1].t - track.frames[0].t;
  const reps = analyseTrack(track).reps.length;
  const totalMs = medianMs(() => analyseTrack(track));
  const parseMs = medianMs(() => parseTrack(track));
  const resampleMs = medianMs(() => resampleTrack(track));
  console.log(`track: ${track.frames.length} frames over ${spanS.toFixed(1)} s (${FPS} fps nominal, BlazePose keypoints), ${reps} reps found`);
  console.log(`analyseTrack: median ${totalMs.toFixed(1)} ms over ${TIMED_RUNS} runs (target: well under 100 ms)`);
  console.log(`  of which parseTrack ≈ ${parseMs.toFixed(1)} ms, resampleTrack ≈ ${resampleMs.toFixed(1)} ms, the rest ≈ ${Math.max(0, totalMs - parseMs - resampleMs).toFixed(1)} ms`);
}
