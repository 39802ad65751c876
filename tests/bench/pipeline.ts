// Command-line video mode on a 30 s, 30 fps, 1280x720 synthetic clip (one tap on the plate): frames
// per second, real-time factor and peak resident memory of the whole run (Node startup, model
// loading, ffmpeg decoding, tracking, pose, analysis), plus accuracy against the clip's truth; then
// precise mode on a 12 s clip.
import { spawn } from "node:child_process";
import path from "node:path";
import { analysisResultSchema } from "@/lib/analysis/result";
import { ensureModels } from "@/scripts/models";
import { ensureClip, type GeneratedClip } from "@/tests/fixtures/clips/generate-clip";
import { accuracy, describeAccuracy } from "./support/accuracy";
import { sampleProcessTree } from "./support/process-memory";

const REPO_ROOT = path.resolve(import.meta.dirname, "../..");

async function timeCli(clip: GeneratedClip, extraArgs: string[]): Promise<void> {
  const start = clip.truth.frames[0];
  const args = ["--video", clip.videoPath, "--lift", "squat", "--view", "side", "--bar", `${start.cx + 3},${start.cy - 2}`, "--compact", ...extraArgs];
  const started = performance.now();
  const child = spawn(process.execPath, ["--import", "tsx", "lib/cli/analyse.ts", ...args], { cwd: REPO_ROOT, stdio: ["ignore", "pipe", "pipe"] });
  const memory = sampleProcessTree(child.pid!);
  let stdout = "";
  let stderr = "";
  child.stdout.on("data", (chunk: Buffer) => (stdout += chunk.toString()));
  child.stderr.on("data", (chunk: Buffer) => (stderr += chunk.toString()));
  const code = await new Promise<number | null>((resolve) => child.on("close", resolve));
  const wallS = (performance.now() - started) / 1000;
  const report = memory.stop();
  if (code !== 0) throw new Error(`analyse exited with ${code}: ${stderr}`);
  const result = analysisResultSchema.parse(JSON.parse(stdout));
  const frames = result.frames ?? [];
  const clipS = clip.truth.frameCount / clip.truth.options.fps;
  const node = report.processes.find((p) => p.name.startsWith("node"));
  const ffmpeg = report.processes.find((p) => p.name.startsWith("ffmpeg"));
  console.log(`mode ${extraArgs.includes("--precise") ? "precise (BlazePose full, every frame)" : "default (MoveNet Lightning, adaptive)"}`);
  console.log(
    `  whole command: ${frames.length} frames in ${wallS.toFixed(1)} s = ${(frames.length / wallS).toFixed(1)} frames/s, ` +
      `real-time factor ${(clipS / wallS).toFixed(2)} (clip ${clipS.toFixed(1)} s; above 1 = faster than playback)`,
  );
  console.log(`  ${stderr.trim().replace(/^analyse: /, "pipeline only: ")}`);
  console.log(
    `  peak RSS: node ${node?.peakRssMb.toFixed(0) ?? "?"} MB, ffmpeg ${ffmpeg?.peakRssMb.toFixed(0) ?? "?"} MB, ` +
      `tree ${report.peakTotalMb.toFixed(0)} MB at once`,
  );
  console.log(`  ${describeAccuracy(accuracy(frames, result.scale.metresPerPixel, result.reps, clip.truth))}`);
}

export async function run(): Promise<void> {
  await ensureModels({ log: () => {} });
  for (const [options, extraArgs] of [
    [{ width: 1280, height: 720, durationS: 30 }, []],
    // Precise mode runs BlazePose on every frame, several times slower: a 12 s clip is enough to measure it.
    [{ width: 1280, height: 720, durationS: 12 }, ["--precise"]],
  ] as const) {
    const clip = await ensureClip(options);
    console.log(`clip ${options.width}x${options.height}, ${clip.truth.frameCount} frames at ${clip.truth.options.fps} fps, frames scaled to 640 wide`);
    await timeCli(clip, [...extraArgs]);
  }
}
