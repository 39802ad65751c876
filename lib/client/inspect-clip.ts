// Looks at a clip in the browser before it is uploaded or analysed: what its first bytes say it is,
// its size, and (demuxing only, no decoding) its duration, picture size and codec; and, for the
// analysis step, whether this browser can decode it and what its first frame looks like.
import { ALL_FORMATS, BlobSource, Input, VideoSampleSink } from "mediabunny";
import { MAX_CLIP_BYTES, MAX_CLIP_DURATION_S, formatMegabytes } from "@/lib/clips/limits";
import type { FrameDecoder } from "@/lib/clips/decoder-choice";
import { SNIFF_BYTES, sniffVideo, type VideoContainer } from "@/lib/clips/sniff";
import { probeClipDecoding, VideoElementFrames } from "./video-element-frames";

export interface ClipFacts {
  container: VideoContainer;
  sizeBytes: number;
  /** Null when the browser cannot read the container's index (the server checks again). */
  durationS: number | null;
  widthPx: number | null;
  heightPx: number | null;
  codec: string | null;
}

export type ClipInspection = { ok: true; facts: ClipFacts } | { ok: false; message: string };

async function demux(file: Blob) {
  const input = new Input({ source: new BlobSource(file), formats: ALL_FORMATS });
  try {
    const video = await input.getPrimaryVideoTrack();
    if (!video) return null;
    return {
      durationS: await video.computeDuration(),
      widthPx: await video.getDisplayWidth(),
      heightPx: await video.getDisplayHeight(),
      codec: await video.getCodec(),
    };
  } catch {
    return null;
  } finally {
    input.dispose();
  }
}

export async function inspectClip(file: Blob): Promise<ClipInspection> {
  if (file.size === 0) return { ok: false, message: "The file is empty." };
  if (file.size > MAX_CLIP_BYTES) {
    return { ok: false, message: `The clip is larger than ${formatMegabytes(MAX_CLIP_BYTES)}. Trim it to the set and try again.` };
  }
  const sniffed = sniffVideo(new Uint8Array(await file.slice(0, SNIFF_BYTES).arrayBuffer()));
  if (sniffed.kind !== "video") return { ok: false, message: `This file is not a video we can read. ${sniffed.reason}` };
  const found = await demux(file);
  if (found && found.durationS > MAX_CLIP_DURATION_S) {
    return {
      ok: false,
      message: `The clip is ${Math.round(found.durationS)} s long; the limit is ${MAX_CLIP_DURATION_S / 60} minutes. Trim it to the set and try again.`,
    };
  }
  return {
    ok: true,
    facts: {
      container: sniffed.container,
      sizeBytes: file.size,
      durationS: found?.durationS ?? null,
      widthPx: found?.widthPx ?? null,
      heightPx: found?.heightPx ?? null,
      codec: found?.codec ?? null,
    },
  };
}

export interface FirstFrame {
  /** Full clip resolution (display size, rotation applied), as the worker reports coordinates. */
  image: ImageData;
  codec: string | null;
  /** How the analysis will decode this clip in this browser. */
  decoder: FrameDecoder;
}

export class UndecodableClipError extends Error {
  constructor(readonly codec: string | null) {
    super(`This browser cannot decode ${codec ?? "this"} video.`);
    this.name = "UndecodableClipError";
  }
}

/**
 * Picks the decoder (lib/clips/decoder-choice.ts) and decodes the first frame with it; throws
 * UndecodableClipError when this browser can decode the codec neither way.
 */
export async function decodeFirstFrame(file: Blob): Promise<FirstFrame> {
  const { decoder, codec } = await probeClipDecoding(file);
  if (decoder === null) throw new UndecodableClipError(codec);
  if (decoder === "video-element") return { image: await VideoElementFrames.firstFrame(file), codec, decoder };
  const input = new Input({ source: new BlobSource(file), formats: ALL_FORMATS });
  try {
    const video = await input.getPrimaryVideoTrack();
    if (!video) throw new Error("The file has no video track.");
    const width = await video.getDisplayWidth();
    const height = await video.getDisplayHeight();
    const sample = await new VideoSampleSink(video).getSample(await video.getFirstTimestamp());
    if (!sample) throw new Error("The clip has no frame to show.");
    const canvas = new OffscreenCanvas(width, height);
    const context = canvas.getContext("2d", { willReadFrequently: true });
    if (!context) throw new Error("This browser has no 2D canvas.");
    try {
      sample.draw(context, 0, 0, width, height);
    } finally {
      sample.close();
    }
    return { image: context.getImageData(0, 0, width, height), codec, decoder };
  } finally {
    input.dispose();
  }
}
