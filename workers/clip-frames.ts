// Worker side of decoding: opens a clip with mediabunny (WebCodecs underneath) and yields every
// frame in presentation order, with its exact timestamp, shrunk and turned upright for tracking and
// pose. 8-bit 4:2:0 frames are converted straight from their YUV planes (lib/pipeline/yuv-frame.ts);
// anything else is drawn on a canvas, which costs more.
import { ALL_FORMATS, BlobSource, Input, UnsupportedInputFormatError, VideoSampleSink, type InputVideoTrack, type VideoSample } from "mediabunny";
import type { ClipFrame } from "@/lib/pipeline";
import { shrinkFactor, yuvToRgba, type QuarterTurn, type YuvMatrix } from "@/lib/pipeline/yuv-frame";
import type { RgbaFrame } from "@/lib/tracking";

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
  /** Frames converted from YUV planes, and the time spent turning samples into frames. */
  yuvFrames = 0;
  readMs = 0;
  private buffer = new Uint8Array(0);
  private canvas: OffscreenCanvasRenderingContext2D | null = null;

  constructor(clip: { width: number; height: number }, maxWidthPx: number) {
    this.factor = shrinkFactor(clip.width, maxWidthPx);
    this.width = Math.floor(clip.width / this.factor);
    this.height = Math.floor(clip.height / this.factor);
  }

  async read(sample: VideoSample): Promise<RgbaFrame> {
    const started = performance.now();
    const frame = (await this.fromYuv(sample)) ?? this.fromCanvas(sample);
    this.readMs += performance.now() - started;
    return frame;
  }

  private async fromYuv(sample: VideoSample): Promise<RgbaFrame | null> {
    if (!isPlainYuv(sample)) return null;
    const size = sample.allocationSize();
    if (this.buffer.length < size) this.buffer = new Uint8Array(size);
    const planes = await sample.copyTo(this.buffer);
    const frame = yuvToRgba(
      { format: sample.format, width: sample.visibleRect.width, height: sample.visibleRect.height, data: this.buffer, planes },
      { factor: this.factor, rotationDeg: sample.rotation as QuarterTurn, matrix: matrixOf(sample), fullRange: sample.colorSpace.fullRange ?? false },
    );
    // A sample whose size differs from the track's (a mid-stream change) goes through the canvas instead.
    if (frame.width !== this.width || frame.height !== this.height) return null;
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

/** Every decoded frame in presentation order; each sample is closed as soon as it is read. */
export async function* clipFrames(clip: OpenClip, reader: FrameReader): AsyncGenerator<ClipFrame> {
  for await (const sample of new VideoSampleSink(clip.video).samples()) {
    let frame: RgbaFrame;
    try {
      frame = await reader.read(sample);
    } finally {
      sample.close();
    }
    yield { tS: sample.timestamp, frame };
  }
}
