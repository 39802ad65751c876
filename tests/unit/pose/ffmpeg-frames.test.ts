// lib/video/ffmpeg-frames against clips made here with Debian's ffmpeg and a real clip from opencv-doc.
import { execFile } from "node:child_process";
import { mkdtemp, rm, writeFile } from "node:fs/promises";
import os from "node:os";
import path from "node:path";
import { promisify } from "node:util";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { decodeFrames, probeVideo, scaledSize, VideoDecodeError, type DecodedFrame } from "@/lib/video/ffmpeg-frames";
import { opencvSample } from "@/tests/fixtures/opencv-doc";

const run = promisify(execFile);
let dir: string;

async function ffmpeg(...args: string[]) {
  await run("ffmpeg", ["-v", "error", "-y", ...args]);
}

async function collect(file: string, options?: { maxWidth?: number }) {
  const frames: DecodedFrame[] = [];
  for await (const frame of decodeFrames(file, options)) frames.push(frame);
  return frames;
}

/** Frame times as ffprobe reports them: an independent reading of the same file. */
async function ffprobeFrameTimes(file: string): Promise<number[]> {
  const { stdout } = await run("ffprobe", [
    ...["-v", "error", "-select_streams", "v:0", "-show_entries", "frame=best_effort_timestamp_time"],
    ...["-of", "csv=p=0", file],
  ]);
  // csv rows may carry a trailing comma or a blank line for frame side data.
  return stdout
    .split("\n")
    .filter((line) => line.trim() !== "")
    .map((line) => Number.parseFloat(line));
}

/** ffmpeg processes started by this test process that are still running. */
async function childFfmpegCount(): Promise<number> {
  try {
    const { stdout } = await run("pgrep", ["-P", String(process.pid), "-x", "ffmpeg"]);
    return stdout.trim().split("\n").length;
  } catch {
    return 0; // pgrep exits 1 when nothing matches
  }
}

// 30 frames nominally at 30 fps, but frames 10.. are pushed 0.5 s later: a variable-rate clip
// whose true times differ from index / fps.
const GAP_S = 0.5;
const expectedGapClipTimes = Array.from({ length: 30 }, (_, n) => n / 30 + (n >= 10 ? GAP_S : 0));

beforeAll(async () => {
  dir = await mkdtemp(path.join(os.tmpdir(), "plumbline-frames-"));
  await ffmpeg(
    ...["-f", "lavfi", "-i", "testsrc2=size=320x240:rate=30", "-frames:v", "30"],
    // Whole ticks of 1/90000 s so no rounding happens while making the clip.
    ...["-vf", `settb=1/90000,setpts='N*3000+gte(N\\,10)*${GAP_S * 90_000}'`, "-fps_mode", "passthrough"],
    ...["-enc_time_base", "1/90000", "-video_track_timescale", "90000"],
    ...["-c:v", "libx264", "-bf", "2", "-pix_fmt", "yuv420p"],
    path.join(dir, "gap.mp4"),
  );
  await ffmpeg(
    ...["-f", "lavfi", "-i", "color=c=0xff0000:size=64x48:rate=10", "-frames:v", "5"],
    ...["-c:v", "libx264", "-pix_fmt", "yuv444p", "-qp", "0", path.join(dir, "red.mp4")],
  );
  // Stored landscape with a quarter-turn display matrix, as phones store portrait clips.
  await ffmpeg("-i", path.join(dir, "red.mp4"), "-c", "copy", "-metadata:s:v", "rotate=90", path.join(dir, "rotated.mp4"));
  await writeFile(path.join(dir, "not-a-video.mp4"), "plain text, not a video\n");
}, 60_000);

afterAll(async () => {
  await rm(dir, { recursive: true, force: true });
});

describe("probeVideo", () => {
  it("reads size, codec, frame rate, duration and frame count", async () => {
    const info = await probeVideo(path.join(dir, "red.mp4"));
    expect(info).toMatchObject({ width: 64, height: 48, codec: "h264", fps: 10, frameCount: 5, rotationDeg: 0 });
    expect(info.durationS).toBeCloseTo(0.5, 6);
  });

  it("reports the display size of a rotated clip", async () => {
    const info = await probeVideo(path.join(dir, "rotated.mp4"));
    expect(Math.abs(info.rotationDeg)).toBe(90);
    expect([info.width, info.height]).toEqual([48, 64]);
  });

  it("reads the real opencv-doc street clip", async () => {
    const info = await probeVideo(await opencvSample("streetClip"));
    // The street clip: 768x576 at 10 fps, 795 frames (ffprobe's own report of the file).
    expect(info).toMatchObject({ width: 768, height: 576, fps: 10, frameCount: 795, codec: "msmpeg4v3" });
  }, 120_000);

  it("rejects missing files and files that are not video", async () => {
    await expect(probeVideo(path.join(dir, "absent.mp4"))).rejects.toThrow(/Cannot read video .*absent\.mp4/);
    await expect(probeVideo(path.join(dir, "not-a-video.mp4"))).rejects.toBeInstanceOf(VideoDecodeError);
  });
});

describe("decodeFrames", () => {
  it("yields every frame with its exact presentation time, not index / fps", async () => {
    const file = path.join(dir, "gap.mp4");
    const frames = await collect(file);
    expect(frames.map((f) => f.index)).toEqual(expectedGapClipTimes.map((_, i) => i));
    frames.forEach((frame, i) => expect(frame.tS).toBeCloseTo(expectedGapClipTimes[i], 6));
    const probed = await ffprobeFrameTimes(file);
    expect(probed).toHaveLength(30);
    frames.forEach((frame, i) => expect(frame.tS).toBeCloseTo(probed[i], 5));
  });

  it("gives RGBA pixels of the right size and colour", async () => {
    const frames = await collect(path.join(dir, "red.mp4"));
    expect(frames).toHaveLength(5);
    for (const frame of frames) {
      expect([frame.width, frame.height, frame.rgba.length]).toEqual([64, 48, 64 * 48 * 4]);
      const [r, g, b, a] = frame.rgba.subarray(4 * (24 * 64 + 32));
      // Pure red through lossless yuv444 and back lands within a few levels of 255/0/0.
      expect(r).toBeGreaterThan(245);
      expect(g).toBeLessThan(10);
      expect(b).toBeLessThan(10);
      expect(a).toBe(255);
    }
  });

  it("applies the display rotation", async () => {
    const [frame] = await collect(path.join(dir, "rotated.mp4"));
    expect([frame.width, frame.height]).toEqual([48, 64]);
  });

  it("scales frames wider than maxWidth, keeping the aspect ratio", async () => {
    const frames = await collect(path.join(dir, "gap.mp4"), { maxWidth: 100 });
    expect(frames).toHaveLength(30);
    expect([frames[0].width, frames[0].height, frames[0].rgba.length]).toEqual([100, 75, 100 * 75 * 4]);
    expect(scaledSize(768, 576, 640)).toEqual({ width: 640, height: 480 });
    expect(scaledSize(320, 240, 640)).toEqual({ width: 320, height: 240 });
    expect(() => scaledSize(320, 240, 0)).toThrow(/maxWidth must be a whole number/);
  });

  it("streams a long real clip without holding it in memory, and stops ffmpeg on break", async () => {
    const file = await opencvSample("streetClip");
    const rssBeforeMb = process.memoryUsage().rss / 1e6;
    let count = 0;
    let lastTimeS = -1;
    for await (const frame of decodeFrames(file)) {
      expect(frame.tS).toBeGreaterThan(lastTimeS);
      lastTimeS = frame.tS;
      if (++count === 300) break;
    }
    expect(lastTimeS).toBeCloseTo(29.9, 6); // 10 fps clip: frame 299 at 29.9 s
    // 300 frames of 768x576 RGBA are 531 MB; streaming keeps growth to a small fraction of that.
    expect(process.memoryUsage().rss / 1e6 - rssBeforeMb).toBeLessThan(150);
    await expect.poll(childFfmpegCount, { timeout: 5_000 }).toBe(0);
  }, 120_000);

  it("fails clearly on a file that is not video", async () => {
    await expect(collect(path.join(dir, "not-a-video.mp4"))).rejects.toBeInstanceOf(VideoDecodeError);
  });
});
