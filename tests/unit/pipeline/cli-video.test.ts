// The command line's video mode end to end on synthetic clips with known motion: ffmpeg decoding,
// the bar tracker on every frame, MoveNet on a real-time budget (it finds no person in these clips,
// so the analysis works from the bar alone), plate calibration, reps and velocities.
import { execFile } from "node:child_process";
import { mkdtemp, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { promisify } from "node:util";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { analysisResultSchema, type AnalysisResult } from "@/lib/analysis/result";
import { ensureClip, type ClipOptions, type ClipTruth } from "@/tests/fixtures/clips/generate-clip";
import { opencvSample } from "@/tests/fixtures/opencv-doc";

const run = promisify(execFile);
const REPO_ROOT = path.resolve(import.meta.dirname, "../../..");

interface CliRun {
  code: number;
  stdout: string;
  stderr: string;
}

/** Runs `npm run analyse -- <args>` as a real process (node with tsx, as the npm script does). */
async function analyseCli(args: string[]): Promise<CliRun> {
  try {
    const { stdout, stderr } = await run(process.execPath, ["--import", "tsx", "lib/cli/analyse.ts", ...args], {
      cwd: REPO_ROOT,
      maxBuffer: 64 * 1024 * 1024,
    });
    return { code: 0, stdout, stderr };
  } catch (error) {
    const failed = error as { code?: number; stdout?: string; stderr?: string };
    if (typeof failed.code !== "number") throw error;
    return { code: failed.code, stdout: failed.stdout ?? "", stderr: failed.stderr ?? "" };
  }
}

function rms(values: number[]): number {
  return Math.sqrt(values.reduce((s, v) => s + v * v, 0) / values.length);
}

/** Distance (metres) between the tracked bar's displacement from its start and the true one, per frame. */
function barErrorsM(result: AnalysisResult, truth: ClipTruth): number[] {
  const frames = result.frames ?? [];
  const first = frames[0].bar!;
  const mpp = result.scale.metresPerPixel;
  return frames.flatMap((f, i) =>
    f.bar ? [Math.hypot((f.bar.x - first.x) * mpp - truth.frames[i].xM, (f.bar.y - first.y) * mpp - truth.frames[i].yM)] : [],
  );
}

type Mark = "plate" | "tap";

const CASES: { name: string; options: ClipOptions; mark: Mark }[] = [
  { name: "640x360 H.264, plate circle given", options: { width: 640, height: 360 }, mark: "plate" },
  { name: "1280x720 H.264 with a passer-by and a lighting drop, one tap", options: { width: 1280, height: 720 }, mark: "tap" },
  { name: "640x360 VP9, one tap", options: { width: 640, height: 360, codec: "vp9", seed: 2 }, mark: "tap" },
];

function markArgs(mark: Mark, truth: ClipTruth): string[] {
  const start = truth.frames[0];
  // A person taps near the plate's centre, not on it exactly.
  if (mark === "tap") return ["--bar", `${start.cx + 3},${start.cy - 2}`];
  return ["--plate", `${start.cx},${start.cy},${truth.plateRadiusPx}`];
}

describe.each(CASES)("npm run analyse -- --video: $name", ({ options, mark }) => {
  let truth: ClipTruth;
  let cli: CliRun;
  let result: AnalysisResult;

  beforeAll(async () => {
    const clip = await ensureClip(options);
    truth = clip.truth;
    cli = await analyseCli(["--video", clip.videoPath, "--lift", "squat", "--view", "side", ...markArgs(mark, truth), "--compact"]);
    if (cli.code !== 0) throw new Error(`analyse exited with ${cli.code}: ${cli.stderr}`);
    result = analysisResultSchema.parse(JSON.parse(cli.stdout));
    const errors = barErrorsM(result, truth);
    console.log(`${options.width}x${options.height} ${options.codec ?? "h264"} (${mark}): bar RMS ${(100 * rms(errors)).toFixed(3)} cm; ${cli.stderr.trim()}`);
  }, 600_000);

  it("gives the bar for every decoded frame, at the clip's frame times", () => {
    expect(result.frames).toHaveLength(truth.frameCount);
    result.frames!.forEach((f, i) => expect(Math.abs(f.t - truth.frames[i].t)).toBeLessThan(0.002));
    expect(result.settings.barSource).toBe("tracked");
    expect(result.scale.method).toBe("plate");
  });

  it("reports the bar in pixels of the original clip, although frames were shrunk for tracking", () => {
    const squares = result.frames!.flatMap((f, i) => (f.bar ? [(f.bar.x - truth.frames[i].cx) ** 2 + (f.bar.y - truth.frames[i].cy) ** 2] : []));
    // Sub-pixel tracking is the point of template matching (common practice); a missed half-pixel shift would show here.
    expect(Math.sqrt(squares.reduce((s, v) => s + v, 0) / squares.length)).toBeLessThan(0.5);
  });

  it("keeps the bar position within 1 cm RMS of the truth after plate calibration", () => {
    const errors = barErrorsM(result, truth);
    // Brief's quality target: bar position error under 1 cm RMS on synthetic clips.
    expect(rms(errors)).toBeLessThan(0.01);
    expect(errors.length).toBeGreaterThan(0.97 * truth.frameCount);
  });

  it("finds every rep and invents none", () => {
    expect(result.reps).toHaveLength(truth.reps.length);
    truth.reps.forEach((rep, k) => {
      // Half of the shortest phase in the scripted set (1 s eccentric) separates neighbouring reps' events.
      expect(Math.abs(result.reps[k].concentricStartS - rep.concentricStartS)).toBeLessThan(0.25);
      expect(Math.abs(result.reps[k].concentricEndS - rep.concentricEndS)).toBeLessThan(0.25);
    });
  });

  it("measures each rep's mean concentric velocity within 0.03 m/s", () => {
    truth.reps.forEach((rep, k) => {
      // Brief's quality target: mean concentric velocity error under 0.03 m/s.
      expect(Math.abs(result.reps[k].meanConcentricVelocityMps - rep.meanConcentricVelocityMps)).toBeLessThan(0.03);
    });
  });
});

describe("npm run analyse -- --video without a bar mark, on a clip with people", () => {
  let dir: string;

  beforeAll(async () => {
    dir = await mkdtemp(path.join(tmpdir(), "plumbline-cli-pose-"));
  });

  afterAll(async () => {
    await rm(dir, { recursive: true, force: true });
  });

  it("estimates the bar from the pose and labels it as an estimate", async () => {
    // OpenCV's street clip (768x576, 10 fps): people walking, the nearest pose stands in for the athlete.
    const clipPath = path.join(dir, "street.mp4");
    await run("ffmpeg", ["-hide_banner", "-loglevel", "error", "-t", "6", "-i", await opencvSample("streetClip"), "-c:v", "libx264", "-pix_fmt", "yuv420p", clipPath]);
    const cli = await analyseCli(["--video", clipPath, "--lift", "deadlift", "--view", "front", "--athlete-height-m", "1.75", "--compact"]);
    expect(cli.code).toBe(0);
    const result = analysisResultSchema.parse(JSON.parse(cli.stdout));
    expect(result.settings.barSource).toBe("pose-estimate");
    expect(result.scale.method).toBe("athlete-height");
    expect(result.cautions.join(" ")).toMatch(/bar position is estimated from the athlete's wrists/);
    const bars = (result.frames ?? []).flatMap((f) => (f.bar ? [f.bar] : []));
    expect(bars.length).toBeGreaterThan(0);
    expect(bars.every((b) => b.x >= 0 && b.x <= 768 && b.y >= 0 && b.y <= 576)).toBe(true);
  }, 180_000);
});

describe("npm run analyse -- --video: input the user must fix", () => {
  let dir: string;

  beforeAll(async () => {
    dir = await mkdtemp(path.join(tmpdir(), "plumbline-cli-video-"));
  });

  afterAll(async () => {
    await rm(dir, { recursive: true, force: true });
  });

  it("stops with a clear message when no bar is marked and no person is in the clip", async () => {
    const { videoPath } = await ensureClip({ width: 640, height: 360, durationS: 3 });
    const cli = await analyseCli(["--video", videoPath, "--lift", "squat", "--view", "side", "--athlete-height-m", "1.8"]);
    expect(cli.code).toBe(1);
    expect(cli.stdout).toBe("");
    expect(cli.stderr).toMatch(/No person was found in the clip and no bar was marked/);
    expect(cli.stderr).toMatch(/--bar x,y/);
  }, 120_000);

  it("asks for a scale when neither a plate nor the athlete's height is given", async () => {
    const { videoPath } = await ensureClip({ width: 640, height: 360, durationS: 3 });
    const cli = await analyseCli(["--video", videoPath, "--lift", "bench", "--view", "side"]);
    expect(cli.code).toBe(1);
    expect(cli.stderr).toMatch(/No scale to turn pixels into metres/);
  }, 60_000);

  it("says so when the file is not a video", async () => {
    const notVideo = path.join(dir, "set.mp4");
    await writeFile(notVideo, "squat 3x5 at 140 kg\n");
    const cli = await analyseCli(["--video", notVideo, "--lift", "squat", "--view", "side", "--bar", "10,10"]);
    expect(cli.code).toBe(1);
    expect(cli.stdout).toBe("");
    expect(cli.stderr).toMatch(/Cannot read video .*set\.mp4/);
  }, 60_000);

  it("rejects a tap outside the clip", async () => {
    const { videoPath } = await ensureClip({ width: 640, height: 360, durationS: 3 });
    const cli = await analyseCli(["--video", videoPath, "--lift", "squat", "--view", "side", "--bar", "700,20"]);
    expect(cli.code).toBe(1);
    expect(cli.stderr).toMatch(/tap \(700, 20\) lies outside the 640x360 clip/);
  }, 60_000);

  it("explains a malformed flag and shows the usage", async () => {
    const cli = await analyseCli(["--video", "clip.mp4", "--lift", "squat", "--view", "side", "--plate", "1,2"]);
    expect(cli.code).toBe(2);
    expect(cli.stderr).toMatch(/--plate: expected 3 numbers separated by commas/);
    expect(cli.stderr).toMatch(/--video <clip>/);
  }, 60_000);
});
