// Node only: probes a clip with ffprobe and streams its frames as RGBA from ffmpeg, each with its
// exact presentation time, for the command line, tests and benchmarks.
import { spawn, execFile } from "node:child_process";
import { createInterface } from "node:readline";
import { promisify } from "node:util";
import { z } from "zod";

const run = promisify(execFile);

/** The `file:` protocol keeps names like `-x.mp4` or `concat:...` from being read as options or protocols. */
const asInput = (filePath: string) => `file:${filePath}`;

export class VideoDecodeError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "VideoDecodeError";
  }
}

export interface VideoInfo {
  /** Display size, after the rotation ffmpeg applies by default. */
  width: number;
  height: number;
  /** Rotation from the container's display matrix (phones store portrait clips this way). */
  rotationDeg: number;
  durationS: number | null;
  /** Average frame rate; null when the container does not state one. */
  fps: number | null;
  codec: string;
  /** From the container header, else by counting packets (no decoding). */
  frameCount: number;
}

export interface DecodedFrame {
  index: number;
  /** Presentation time in seconds from the start of the clip. */
  tS: number;
  width: number;
  height: number;
  rgba: Uint8Array;
}

const numeric = z.union([z.string(), z.number()]).transform(Number).pipe(z.number().finite());

const probeSchema = z.object({
  streams: z
    .array(
      z.object({
        codec_name: z.string(),
        width: z.number().int().positive(),
        height: z.number().int().positive(),
        avg_frame_rate: z.string().optional(),
        r_frame_rate: z.string().optional(),
        duration: numeric.optional(),
        nb_frames: numeric.optional(),
        nb_read_packets: numeric.optional(),
        tags: z.object({ rotate: numeric.optional() }).partial().optional(),
        side_data_list: z.array(z.object({ rotation: numeric.optional() }).loose()).optional(),
      }),
    )
    .min(1),
  format: z.object({ duration: numeric.optional() }).optional(),
});

function parseRate(rate: string | undefined): number | null {
  const [num, den] = (rate ?? "").split("/").map(Number);
  return num > 0 && den > 0 ? num / den : null;
}

async function runFfprobe(filePath: string): Promise<unknown> {
  const args = [
    ...["-v", "error", "-select_streams", "v:0", "-count_packets", "-of", "json"],
    "-show_entries",
    "stream=codec_name,width,height,avg_frame_rate,r_frame_rate,duration,nb_frames,nb_read_packets" +
      ":stream_tags=rotate:stream_side_data_list:format=duration",
    asInput(filePath),
  ];
  try {
    const { stdout } = await run("ffprobe", args, { maxBuffer: 16 * 1024 * 1024 });
    return JSON.parse(stdout);
  } catch (error) {
    const detail = (error as { stderr?: string }).stderr?.trim() || (error as Error).message;
    throw new VideoDecodeError(`Cannot read video ${filePath}: ${detail}`);
  }
}

export async function probeVideo(filePath: string): Promise<VideoInfo> {
  const parsed = probeSchema.safeParse(await runFfprobe(filePath));
  if (!parsed.success) throw new VideoDecodeError(`No video stream found in ${filePath}`);
  const stream = parsed.data.streams[0];
  const rotation = stream.side_data_list?.find((d) => d.rotation !== undefined)?.rotation ?? stream.tags?.rotate ?? 0;
  const quarterTurn = Math.abs(Math.round(rotation / 90)) % 2 === 1;
  const headerCount = stream.nb_frames && stream.nb_frames > 0 ? stream.nb_frames : undefined;
  return {
    width: quarterTurn ? stream.height : stream.width,
    height: quarterTurn ? stream.width : stream.height,
    rotationDeg: rotation,
    durationS: stream.duration ?? parsed.data.format?.duration ?? null,
    fps: parseRate(stream.avg_frame_rate) ?? parseRate(stream.r_frame_rate),
    codec: stream.codec_name,
    frameCount: headerCount ?? stream.nb_read_packets ?? 0,
  };
}

/** Output size keeping the aspect ratio, never wider than `maxWidth`. */
export function scaledSize(width: number, height: number, maxWidth?: number) {
  if (maxWidth !== undefined && (!Number.isInteger(maxWidth) || maxWidth < 1)) {
    throw new VideoDecodeError(`maxWidth must be a whole number >= 1, got ${maxWidth}`);
  }
  if (maxWidth === undefined || width <= maxWidth) return { width, height };
  return { width: maxWidth, height: Math.max(1, Math.round((height * maxWidth) / width)) };
}

/**
 * Collects frame times from ffmpeg's `showinfo` filter on stderr: the integer `pts` of frame `n`
 * times the filter's time base (showinfo's printed `pts_time` keeps only 6 significant digits).
 */
class ShowinfoTimes {
  private timeBase: { num: number; den: number } | null = null;
  private readonly times = new Map<number, number | null>();
  private waiters = new Map<number, () => void>();
  private ended = false;
  readonly tail: string[] = [];

  onLine(line: string) {
    this.tail.push(line);
    if (this.tail.length > 20) this.tail.shift();
    const config = /\[Parsed_showinfo_\d+ @ [^\]]+\] config in time_base: (\d+)\/(\d+)/.exec(line);
    if (config) this.timeBase = { num: Number(config[1]), den: Number(config[2]) };
    const frame = /\[Parsed_showinfo_\d+ @ [^\]]+\] n:\s*(\d+) pts:\s*(-?\d+|NOPTS)/.exec(line);
    if (!frame) return;
    const n = Number(frame[1]);
    const tb = this.timeBase;
    const pts = frame[2] === "NOPTS" || tb === null ? null : (Number(frame[2]) * tb.num) / tb.den;
    this.times.set(n, pts);
    this.waiters.get(n)?.();
    this.waiters.delete(n);
  }

  end() {
    this.ended = true;
    for (const wake of this.waiters.values()) wake();
    this.waiters.clear();
  }

  /** Waits for frame `n`'s line; `undefined` if ffmpeg ended without printing it. */
  async take(n: number): Promise<number | null | undefined> {
    if (!this.times.has(n) && !this.ended) await new Promise<void>((wake) => this.waiters.set(n, wake));
    const time = this.times.get(n);
    this.times.delete(n);
    return time;
  }
}

function ffmpegArgs(filePath: string, width: number, height: number) {
  return [
    ...["-hide_banner", "-nostdin", "-nostats", "-loglevel", "info", "-i", asInput(filePath)],
    ...["-map", "0:v:0", "-an", "-sn", "-dn"],
    ...["-vf", `scale=${width}:${height}:flags=area,format=rgba,showinfo`],
    // passthrough: every decoded frame leaves exactly once, with its own timestamp (no dup/drop).
    ...["-fps_mode", "passthrough", "-f", "rawvideo", "-pix_fmt", "rgba", "pipe:1"],
  ];
}

/** Cuts the raw byte stream into whole frames, copying each into its own buffer. */
async function* rawFrames(stream: AsyncIterable<Buffer>, frameBytes: number): AsyncGenerator<Uint8Array> {
  let frame = new Uint8Array(frameBytes);
  let filled = 0;
  for await (const chunk of stream) {
    let offset = 0;
    while (offset < chunk.length) {
      const take = Math.min(frameBytes - filled, chunk.length - offset);
      frame.set(chunk.subarray(offset, offset + take), filled);
      filled += take;
      offset += take;
      if (filled === frameBytes) {
        yield frame;
        frame = new Uint8Array(frameBytes);
        filled = 0;
      }
    }
  }
  if (filled !== 0) throw new VideoDecodeError(`ffmpeg output ended inside a frame (${filled} of ${frameBytes} bytes)`);
}

/**
 * Decodes the first video stream one frame at a time (ffmpeg waits while the consumer is busy,
 * so memory holds a few frames, not the clip). Frames are scaled down to `maxWidth` if wider.
 */
export async function* decodeFrames(
  filePath: string,
  options: { maxWidth?: number } = {},
): AsyncGenerator<DecodedFrame> {
  const info = await probeVideo(filePath);
  const { width, height } = scaledSize(info.width, info.height, options.maxWidth);
  const ffmpeg = spawn("ffmpeg", ffmpegArgs(filePath, width, height), { stdio: ["ignore", "pipe", "pipe"] });
  const exited = new Promise<number | null>((resolve, reject) => {
    ffmpeg.once("error", (error) => reject(new VideoDecodeError(`Cannot start ffmpeg: ${error.message}`)));
    ffmpeg.once("close", (code) => resolve(code));
  });
  exited.catch(() => undefined); // awaited below; this only keeps an early `break` from leaving it unhandled
  const times = new ShowinfoTimes();
  const lines = createInterface({ input: ffmpeg.stderr });
  lines.on("line", (line) => times.onLine(line));
  lines.once("close", () => times.end());

  let index = 0;
  try {
    for await (const rgba of rawFrames(ffmpeg.stdout, width * height * 4)) {
      const time = await times.take(index);
      if (time === undefined) throw new VideoDecodeError(`ffmpeg gave no timestamp for frame ${index} of ${filePath}`);
      // Frames without a stored time (rare raw streams) fall back to the nominal frame rate.
      const tS = time ?? index / (info.fps ?? 30);
      yield { index, tS, width, height, rgba };
      index += 1;
    }
    const code = await exited;
    if (code !== 0) {
      throw new VideoDecodeError(`ffmpeg failed on ${filePath} (exit ${code}): ${times.tail.slice(-3).join(" | ")}`);
    }
  } finally {
    if (ffmpeg.exitCode === null && ffmpeg.signalCode === null) ffmpeg.kill("SIGTERM");
    lines.close();
  }
}
