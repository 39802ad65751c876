// Converts a clip to H.264 in an MP4 with Debian's ffmpeg, for browsers that cannot decode the original
// (HEVC from phones: Debian's Chromium has no HEVC decoder). Frame times are kept as recorded.
import { execFile } from "node:child_process";
import { promisify } from "node:util";

const run = promisify(execFile);

/** A 3-minute 1080p clip converts in a few minutes on 2 cores; far longer means ffmpeg is stuck. */
const CONVERT_TIMEOUT_MS = 20 * 60 * 1000;

export class ClipConversionError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "ClipConversionError";
  }
}

export async function convertToH264(inputPath: string, outputPath: string): Promise<void> {
  const args = [
    ...["-hide_banner", "-loglevel", "error", "-y", "-i", inputPath],
    // The first video stream and, when there is one, the first audio stream.
    ...["-map", "0:v:0", "-map", "0:a:0?"],
    // Keep each frame's own timestamp: phones record with variable frame rates, and the analysis needs exact times.
    ...["-fps_mode", "passthrough"],
    // yuv420p with even sides: the profile every H.264 decoder plays (common practice).
    ...["-vf", "scale=trunc(iw/2)*2:trunc(ih/2)*2", "-c:v", "libx264", "-preset", "veryfast", "-crf", "20", "-pix_fmt", "yuv420p"],
    ...["-c:a", "aac", "-movflags", "+faststart", outputPath],
  ];
  try {
    await run("ffmpeg", args, { timeout: CONVERT_TIMEOUT_MS, maxBuffer: 4 * 1024 * 1024 });
  } catch (error) {
    const detail = String((error as { stderr?: string }).stderr ?? "").trim().split("\n").slice(-2).join(" ");
    throw new ClipConversionError(`ffmpeg could not convert the clip${detail ? `: ${detail}` : "."}`);
  }
}
