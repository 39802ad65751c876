// Worker side of decoding: opens a clip with mediabunny (WebCodecs underneath) and yields every
// frame in presentation order, with its exact timestamp, shrunk and turned upright for tracking and
// pose. 8-bit 4:2:0 frames are converted straight from their YUV planes (lib/pipeline/yuv-frame.ts),
// and only where the pipeline asks: on most frames that is the tracker's small window around the
// bar, the whole frame only for pose. Anything else is drawn on a canvas, which costs more.
import { ALL_FORMATS, BlobSource, Input, UnsupportedInputFormatError, VideoSample, VideoSampleSink, type InputVideoTrack } from "mediabunny";
import type { PendingFrame } from "@/lib/pipeline";
import { planesAsIfWhole, shrinkFactor, shrunkSize, sourceCrop, yuvToRgba, type QuarterTurn, type YuvMatrix } from "@/lib/pipeline/yuv-frame";
import type { PixelRect, RgbaFrame } from "@/lib/tracking";
import { decodeResponseSchema, type DecodeRequest, type DecodeResponse } from "./decode-messages";

export class ClipOpenError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "ClipOpenError";
  }
}

export interface OpenClip {
  input: Input;
  video: InputVideoTrack;
  /** Display size (rotation applied). */
  width: number;
  height: number;
  fps: number | null;
  durationS: number | null;
}

/** Packets sampled to estimate the frame rate (the timestamps, not the header, decide it). */
const FRAME_RATE_PACKETS = 120;

export async function openClip(clip: Blob): Promise<OpenClip> {
  const input = new Input({ source: new BlobSource(clip), formats: ALL_FORMATS });
  try {
    const video = await input.getPrimaryVideoTrack();
    if (!video) throw new ClipOpenError("The file has no video track");
    if (!(await video.canDecode())) {
      const codec = (await video.getCodec()) ?? "unknown";
      throw new ClipOpenError(
        `This browser cannot decode ${codec} video. Phones often record HEVC: choose H.264 ("most compatible") in the camera settings or convert the clip.`,
      );
    }
    const stats = await video.computePacketStats(FRAME_RATE_PACKETS);
    return {
      input,
      video,
      width: await video.getDisplayWidth(),
      height: await video.getDisplayHeight(),
      fps: stats.averagePacketRate > 0 ? stats.averagePacketRate : null,
      durationS: await video.computeDuration(),
    };
  } catch (error) {
    input.dispose();
    if (error instanceof UnsupportedInputFormatError) {
      throw new ClipOpenError("This file is not a video that can be read here (MP4, MOV, WebM or MKV expected)");
    }
    throw error;
  }
}

/** Untagged video: HD sizes are BT.709, smaller ones BT.601 (common practice of players and encoders). */
function matrixOf(sample: VideoSample): YuvMatrix {
  const tagged = sample.colorSpace.matrix;
  if (tagged === "bt709") return "bt709";
  if (tagged === "bt470bg" || tagged === "smpte170m") return "bt601";
  return sample.visibleRect.height >= 720 ? "bt709" : "bt601";
}

function isPlainYuv(sample: VideoSample): sample is VideoSample & { format: "I420" | "NV12" } {
  const { num, den } = sample.pixelAspectRatio;
  return (sample.format === "I420" || sample.format === "NV12") && !sample.flip && num === den;
}

/** Turns decoded samples into RGBA frames of one fixed size. */
export class FrameReader {
  readonly factor: number;
  readonly width: number;
  readonly height: number;
  /** Frames converted from YUV planes, and the time spent turning samples into frames (copying the planes out, converting). */
  yuvFrames = 0;
  readMs = 0;
  copyMs = 0;
  convertMs = 0;
  private buffer = new Uint8Array(0);
  /** One output frame, refilled for every sample: the pipeline is done with a frame before it reads the next. */
  private pixels: Uint8ClampedArray;
  private canvas: OffscreenCanvasRenderingContext2D | null = null;

  constructor(clip: { width: number; height: number }, maxWidthPx: number) {
    this.factor = shrinkFactor(clip.width, maxWidthPx);
    this.width = Math.floor(clip.width / this.factor);
    this.height = Math.floor(clip.height / this.factor);
    this.pixels = new Uint8ClampedArray(this.width * this.height * 4);
  }

  /** The whole frame, or only `region` of it (frame pixels, upright) when given. */
  async read(sample: VideoSample, region: PixelRect | null = null): Promise<RgbaFrame> {
    const started = performance.now();
    const frame = (await this.fromYuv(sample, region)) ?? this.fromCanvas(sample);
    this.readMs += performance.now() - started;
    return frame;
  }

  private async fromYuv(sample: VideoSample, region: PixelRect | null): Promise<RgbaFrame | null> {
    if (!isPlainYuv(sample)) return null;
    const rotationDeg = sample.rotation as QuarterTurn;
    const { width, height } = shrunkSize(sample.visibleRect.width, sample.visibleRect.height, this.factor, rotationDeg);
    // A sample whose size differs from the track's (a mid-stream change) goes through the canvas instead.
    if (width !== this.width || height !== this.height) return null;
    if (region && (region.width <= 0 || region.height <= 0)) return { width, height, data: this.pixels };
    const copyStarted = performance.now();
    const visible = sample.visibleRect;
    // Only the part of the frame the region is made from leaves the decoder's memory.
    const crop = region ? sourceCrop(visible.width, visible.height, region, this.factor, rotationDeg) : null;
    const options = crop ? { rect: { x: visible.left + crop.x, y: visible.top + crop.y, width: crop.width, height: crop.height } } : {};
    const size = sample.allocationSize(options);
    if (this.buffer.length < size) this.buffer = new Uint8Array(size);
    const copied = await sample.copyTo(this.buffer, options);
    const planes = crop ? planesAsIfWhole(sample.format, copied, crop) : copied;
    const convertStarted = performance.now();
    this.copyMs += convertStarted - copyStarted;
    const frame = yuvToRgba(
      { format: sample.format, width: sample.visibleRect.width, height: sample.visibleRect.height, data: this.buffer, planes },
      {
        factor: this.factor,
        rotationDeg,
        matrix: matrixOf(sample),
        fullRange: sample.colorSpace.fullRange ?? false,
        region: region ?? undefined,
        into: this.pixels,
      },
    );
    this.convertMs += performance.now() - convertStarted;
    this.yuvFrames += 1;
    return frame;
  }

  private fromCanvas(sample: VideoSample): RgbaFrame {
    if (!this.canvas) {
      // willReadFrequently keeps the canvas in CPU memory, so reading pixels back does not stall on the GPU.
      this.canvas = new OffscreenCanvas(this.width, this.height).getContext("2d", { willReadFrequently: true, alpha: false });
      if (!this.canvas) throw new Error("No 2D canvas in this worker");
    }
    sample.draw(this.canvas, 0, 0, this.width, this.height);
    return this.canvas.getImageData(0, 0, this.width, this.height);
  }
}

/** Every decoded frame in presentation order; the pipeline reads what it needs of each, then releases it. */
export async function* clipFrames(clip: OpenClip, reader: FrameReader): AsyncGenerator<PendingFrame> {
  for await (const sample of new VideoSampleSink(clip.video).samples()) {
    yield { tS: sample.timestamp, read: (region) => reader.read(sample, region), release: () => sample.close() };
  }
}

/** The decode worker's bundle, beside the analysis worker's (scripts/build-worker.ts). */
export const DECODE_WORKER_FILE = "decode-worker.js";

/**
 * The same frames, decoded in a worker of their own (workers/decode-worker.ts, which says why);
 * each frame is handed back to that worker's budget when the pipeline releases it.
 */
export async function* decodeWorkerFrames(clip: Blob, reader: FrameReader, workerUrl: URL): AsyncGenerator<PendingFrame> {
  const worker = new Worker(workerUrl, { type: "module" });
  const inbox: DecodeResponse[] = [];
  let wake: (() => void) | null = null;
  const receive = (message: DecodeResponse) => {
    inbox.push(message);
    const resume = wake;
    wake = null;
    resume?.();
  };
  worker.onmessage = (event: MessageEvent<unknown>) => {
    const parsed = decodeResponseSchema.safeParse(event.data);
    receive(parsed.success ? parsed.data : { type: "error", message: "the decode worker sent a malformed message" });
  };
  worker.onerror = (event) => {
    event.preventDefault();
    receive({ type: "error", message: event.message || "the decode worker failed to start" });
  };
  const send = (request: DecodeRequest) => worker.postMessage(request);
  let released = 0;
  try {
    send({ type: "decode", clip });
    for (;;) {
      const message = inbox.shift();
      if (!message) {
        await new Promise<void>((resolve) => (wake = resolve));
        continue;
      }
      if (message.type === "end") return;
      if (message.type === "error") throw new Error(`Decoding failed: ${message.message}`);
      const sample = new VideoSample(message.frame, { rotation: message.rotation, flip: message.flip, timestamp: message.tS });
      yield {
        tS: message.tS,
        read: (region) => reader.read(sample, region),
        release: () => {
          sample.close();
          released += 1;
          send({ type: "released", framesReleased: released });
        },
      };
    }
  } finally {
    for (const message of inbox) if (message.type === "frame") message.frame.close();
    worker.terminate();
  }
}
