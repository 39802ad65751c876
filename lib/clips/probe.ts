// Reads a stored clip's duration, codec and frame size with Debian's ffprobe, through a short-lived
// presigned URL (ffprobe fetches only the byte ranges it needs). A file it cannot read is broken.
import "server-only";
import { execFile } from "node:child_process";
import { promisify } from "node:util";
import { z } from "zod";

const run = promisify(execFile);

const PROBE_TIMEOUT_MS = 60_000;

const probeSchema = z.object({
  streams: z
    .array(
      z.object({
        codec_name: z.string().optional(),
        width: z.number().optional(),
        height: z.number().optional(),
        tags: z.record(z.string(), z.string()).optional(),
        side_data_list: z.array(z.object({ rotation: z.number().optional() }).loose()).optional(),
      }),
    )
    .default([]),
  format: z.object({ duration: z.string().optional() }).optional(),
});

export interface ClipProbe {
  codec: string;
  durationS: number;
  /** Display size: after the rotation a phone records in the file's metadata. */
  widthPx: number;
  heightPx: number;
}

export class ClipProbeError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "ClipProbeError";
  }
}

function rotationDeg(stream: z.infer<typeof probeSchema>["streams"][number]): number {
  const fromSideData = stream.side_data_list?.find((d) => d.rotation !== undefined)?.rotation;
  const fromTag = stream.tags?.rotate === undefined ? undefined : Number(stream.tags.rotate);
  return Math.abs(fromSideData ?? fromTag ?? 0) % 180;
}

export async function probeClip(url: string): Promise<ClipProbe> {
  let stdout: string;
  try {
    ({ stdout } = await run(
      "ffprobe",
      ["-v", "error", "-print_format", "json", "-show_format", "-show_streams", "-select_streams", "v:0", url],
      { timeout: PROBE_TIMEOUT_MS, maxBuffer: 4 * 1024 * 1024 },
    ));
  } catch {
    throw new ClipProbeError("The video could not be read: the file may be damaged or cut short. Export it again and retry.");
  }
  const parsed = probeSchema.safeParse(JSON.parse(stdout || "{}"));
  const stream = parsed.success ? parsed.data.streams[0] : undefined;
  const durationS = Number(parsed.success ? parsed.data.format?.duration : Number.NaN);
  if (!stream?.codec_name || !stream.width || !stream.height) {
    throw new ClipProbeError("The file holds no video picture that can be read.");
  }
  if (!Number.isFinite(durationS) || durationS <= 0) {
    throw new ClipProbeError("The video has no readable duration: the file may be damaged or cut short.");
  }
  const turned = rotationDeg(stream) === 90;
  return {
    codec: stream.codec_name,
    durationS,
    widthPx: turned ? stream.height : stream.width,
    heightPx: turned ? stream.width : stream.height,
  };
}

/**
 * Where the video's pictures really end, in seconds: the end of the last packet ffprobe can read, from
 * `fromS` on (it seeks, so only the clip's tail is fetched). A file cut short keeps its header's full
 * duration but its pictures stop where the bytes do.
 */
export async function lastPictureEndS(url: string, fromS: number): Promise<number> {
  let stdout: string;
  try {
    ({ stdout } = await run(
      "ffprobe",
      ["-v", "quiet", "-read_intervals", `${Math.max(0, fromS).toFixed(3)}%`, "-select_streams", "v:0", "-show_entries", "packet=pts_time,duration_time", "-of", "csv=p=0", url],
      { timeout: PROBE_TIMEOUT_MS, maxBuffer: 16 * 1024 * 1024 },
    ));
  } catch {
    throw new ClipProbeError("The video could not be read: the file may be damaged or cut short. Export it again and retry.");
  }
  let end = 0;
  for (const line of stdout.split("\n")) {
    const [pts, duration] = line.split(",").map(Number);
    if (Number.isFinite(pts)) end = Math.max(end, pts + (Number.isFinite(duration) ? duration : 0));
  }
  return end;
}
