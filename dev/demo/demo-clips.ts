// Renders a demo set's clip: the synthetic scene behind its track drawn frame by frame as a stick-figure
// lifter (dev/demo/stick-figure.ts) and encoded to H.264 mp4 by Debian's ffmpeg. Clips are cached under
// .data/cache/demo-clips, keyed by what they show, so a second `npm start` reuses them.
import { spawn } from "node:child_process";
import { createHash } from "node:crypto";
import { once } from "node:events";
import { existsSync } from "node:fs";
import { mkdir, rename, rm } from "node:fs/promises";
import path from "node:path";
import type { SyntheticOptions, SyntheticScene } from "@/lib/synthetic";
import { drawLifter, gymBackground } from "./stick-figure";

/** Bump when the drawing changes, so cached clips are drawn again. */
const RENDERER_VERSION = 1;
export const DEMO_CLIP_FPS = 30;

const repoRoot = path.resolve(import.meta.dirname, "../..");
export const DEMO_CLIP_CACHE_DIR = path.join(repoRoot, ".data", "cache", "demo-clips");

export function demoClipPath(options: SyntheticOptions): string {
  const key = createHash("sha256")
    .update(JSON.stringify({ version: RENDERER_VERSION, fps: DEMO_CLIP_FPS, options }))
    .digest("hex")
    .slice(0, 16);
  return path.join(DEMO_CLIP_CACHE_DIR, `demo-${key}.mp4`);
}

/** The cached clip for this scene, rendered and encoded first when there is none. */
export async function ensureDemoClip(options: SyntheticOptions, scene: SyntheticScene): Promise<string> {
  const target = demoClipPath(options);
  if (existsSync(target)) return target;
  await mkdir(DEMO_CLIP_CACHE_DIR, { recursive: true });
  // Two seeds running at once each write their own file and rename it into place.
  const temporary = `${target}.${process.pid}-${Math.random().toString(36).slice(2)}.tmp.mp4`;
  try {
    await encode(scene, temporary);
    await rename(temporary, target);
    return target;
  } finally {
    await rm(temporary, { force: true });
  }
}

async function encode(scene: SyntheticScene, outputPath: string): Promise<void> {
  const { width, height } = scene.set.track;
  const ffmpeg = spawn(
    "ffmpeg",
    [
      ...["-hide_banner", "-loglevel", "error", "-y"],
      ...["-f", "rawvideo", "-pix_fmt", "rgba", "-s", `${width}x${height}`, "-framerate", String(DEMO_CLIP_FPS), "-i", "-"],
      ...["-c:v", "libx264", "-preset", "veryfast", "-crf", "23", "-pix_fmt", "yuv420p", "-movflags", "+faststart"],
      outputPath,
    ],
    { stdio: ["pipe", "ignore", "pipe"] },
  );
  let stderr = "";
  ffmpeg.stderr.on("data", (chunk: Buffer) => (stderr += chunk.toString()));
  const exited = new Promise<number | null>((resolve, reject) => {
    ffmpeg.on("error", reject);
    ffmpeg.on("close", resolve);
  });
  // A dying ffmpeg closes its input; the exit code below says why.
  ffmpeg.stdin.on("error", () => undefined);
  const first = scene.poseAt(0);
  const floorY = Math.max(first.keypoints.left_heel.y, first.keypoints.right_heel.y) + 0.02 * scene.pxPerM;
  const background = gymBackground(width, height, floorY, scene.set.track.frames.length);
  const style = { nearSide: scene.set.truth.nearSide, pxPerM: scene.pxPerM, plateRadiusPx: scene.plateRadiusPx, bench: scene.set.track.lift === "bench" };
  const frameCount = Math.floor(scene.durationS * DEMO_CLIP_FPS);
  for (let index = 0; index < frameCount; index++) {
    // A fresh copy per frame: ffmpeg's pipe may still hold the previous one.
    const frame = { width, height, data: background.data.slice() };
    drawLifter(frame, scene.poseAt(index / DEMO_CLIP_FPS), style);
    if (!ffmpeg.stdin.write(frame.data)) await Promise.race([once(ffmpeg.stdin, "drain"), exited]);
  }
  ffmpeg.stdin.end();
  const code = await exited;
  if (code !== 0) throw new Error(`ffmpeg could not encode the demo clip (exit ${code}): ${stderr.trim()}`);
}
