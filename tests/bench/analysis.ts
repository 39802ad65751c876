// Analysis engine speed: median wall-clock and CPU time of analyseTrack over a 60 s, 60 fps
// synthetic squat track, after warm-up runs, with the share taken by track validation and
// resampling. CPU time (process.cpuUsage) is printed beside wall time because the machine is
// shared: wall time includes waiting for a core, CPU time does not.
import { analyseParsedTrack, analyseTrack } from "@/lib/analysis/analyse";
import { resampleTrack } from "@/lib/analysis/resample";
import { parseTrack, type Track } from "@/lib/analysis/track";
import { generateSyntheticSet } from "@/tests/fixtures/synthetic";

const DURATION_S = 60;
const FPS = 60;
const WARM_UP_RUNS = 3;
const TIMED_RUNS = 15;

function sixtySecondTrack(): Track {
  const { track } = generateSyntheticSet({ lift: "squat", seed: 7, fps: FPS, reps: 16, keypointSet: "blazepose" });
  return parseTrack({ ...track, frames: track.frames.filter((f) => f.t <= DURATION_S) });
}

interface Timing {
  wallMs: number;
  cpuMs: number;
}

const median = (values: number[]) => [...values].sort((a, b) => a - b)[values.length >> 1];

function measure(fn: () => unknown): Timing {
  for (let i = 0; i < WARM_UP_RUNS; i++) fn();
  const wall: number[] = [];
  const cpu: number[] = [];
  for (let i = 0; i < TIMED_RUNS; i++) {
    const cpu0 = process.cpuUsage();
    const t0 = performance.now();
    fn();
    wall.push(performance.now() - t0);
    const used = process.cpuUsage(cpu0);
    cpu.push((used.user + used.system) / 1000);
  }
  return { wallMs: median(wall), cpuMs: median(cpu) };
}

const show = (t: Timing) => `median ${t.wallMs.toFixed(1)} ms wall, ${t.cpuMs.toFixed(1)} ms CPU`;

export async function run(): Promise<void> {
  const track = sixtySecondTrack();
  const json = JSON.parse(JSON.stringify(track)) as unknown;
  const spanS = track.frames[track.frames.length - 1].t - track.frames[0].t;
  const keypoints = track.frames.reduce((n, f) => n + f.keypoints.length, 0);
  const reps = analyseTrack(track).reps.length;
  const total = measure(() => analyseTrack(json));
  const parsed = measure(() => analyseParsedTrack(track));
  const parse = measure(() => parseTrack(json));
  const resample = measure(() => resampleTrack(track));
  console.log(`track: ${track.frames.length} frames over ${spanS.toFixed(1)} s (${FPS} fps nominal), ${keypoints} keypoints, ${reps} reps found`);
  console.log(`analyseTrack (validates the input): ${show(total)} over ${TIMED_RUNS} runs (target: well under 100 ms)`);
  console.log(`analyseParsedTrack (input already parsed): ${show(parsed)}`);
  console.log(`  parseTrack: ${show(parse)}`);
  console.log(`  resampleTrack: ${show(resample)}`);
}
