// Decodes a clip on the page with a hidden <video> element, for browsers whose WebCodecs is missing or
// cannot decode the clip (lib/clips/decoder-choice.ts). Frame times come from the container (mediabunny
// demuxes packets without decoding them). The element plays at normal speed and each frame it presents
// (requestVideoFrameCallback names its media time) is drawn at the analysis size; a frame the element
// skipped is fetched by seeking to the middle of its display interval. Seeking alone would be exact too,
// but every seek decodes again from the previous key frame: about 0.1–0.3 s a frame in Chromium on a
// 640×360 clip with the encoder's default key-frame spacing, against one frame time when playing.
import { ALL_FORMATS, BlobSource, EncodedPacketSink, Input } from "mediabunny";
import { chooseFrameDecoder, type FrameDecoder } from "@/lib/clips/decoder-choice";
import { frameIndexAt, seekTargetS, sortedFrameTimes } from "@/lib/clips/frame-times";
import { shrinkFactor } from "@/lib/pipeline/yuv-frame";

export interface ClipDecoding {
  decoder: FrameDecoder | null;
  codec: string | null;
}

/** Which decoder this browser can use for the clip (demuxing only). */
export async function probeClipDecoding(file: Blob): Promise<ClipDecoding> {
  const input = new Input({ source: new BlobSource(file), formats: ALL_FORMATS });
  try {
    const video = await input.getPrimaryVideoTrack();
    if (!video) return { decoder: null, codec: null };
    const videoDecoder = typeof VideoDecoder !== "undefined";
    const element = document.createElement("video");
    const decoder = chooseFrameDecoder({
      videoDecoder,
      webCodecsDecodes: videoDecoder && (await video.canDecode()),
      videoElementPlays: element.canPlayType(await input.getMimeType()),
      videoFrameCallback: typeof element.requestVideoFrameCallback === "function",
    });
    return { decoder, codec: await video.getCodec() };
  } finally {
    input.dispose();
  }
}

export interface ClipTimeline {
  /** Presentation times of every frame, seconds, ascending. */
  timesS: number[];
  /** Display size (rotation applied). */
  width: number;
  height: number;
  fps: number | null;
  durationS: number | null;
}

/** Every frame's presentation time, from the container's packets (their data is never read). */
export async function readClipTimeline(file: Blob): Promise<ClipTimeline> {
  const input = new Input({ source: new BlobSource(file), formats: ALL_FORMATS });
  try {
    const video = await input.getPrimaryVideoTrack();
    if (!video) throw new Error("The file has no video track.");
    const times: number[] = [];
    for await (const packet of new EncodedPacketSink(video).packets(undefined, undefined, { metadataOnly: true })) times.push(packet.timestamp);
    const timesS = sortedFrameTimes(times);
    if (timesS.length === 0) throw new Error("The clip has no video frames.");
    const spanS = timesS[timesS.length - 1] - timesS[0];
    return {
      timesS,
      width: await video.getDisplayWidth(),
      height: await video.getDisplayHeight(),
      fps: timesS.length > 1 && spanS > 0 ? (timesS.length - 1) / spanS : null,
      durationS: await video.computeDuration(),
    };
  } finally {
    input.dispose();
  }
}

export interface ElementFrame {
  tS: number;
  data: ImageData["data"];
}

/** Frames captured ahead of the reader before the element is paused. */
const HIGH_WATER = 6;
/** A presented frame not seen within this time counts as none (a stalled or finished element). */
const FRAME_WAIT_MS = 3000;

export class VideoElementError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "VideoElementError";
  }
}

/** A queue between the element's frame callbacks and the reader. */
class FrameChannel {
  private readonly queue: ElementFrame[] = [];
  private done = false;
  private failure: unknown = null;
  private wakeReader: (() => void) | null = null;
  private wakeWriter: (() => void) | null = null;

  get size(): number {
    return this.queue.length;
  }

  push(frame: ElementFrame): void {
    this.queue.push(frame);
    this.wake();
  }

  end(failure: unknown = null): void {
    this.done = true;
    this.failure = failure;
    this.wake();
    this.wakeWriter?.();
  }

  private wake(): void {
    const wake = this.wakeReader;
    this.wakeReader = null;
    wake?.();
  }

  /** Resolves once the reader has taken frames below the high-water mark again (or stopped). */
  roomFreed(): Promise<void> {
    return this.queue.length < HIGH_WATER || this.done ? Promise.resolve() : new Promise((resolve) => (this.wakeWriter = resolve));
  }

  async *read(): AsyncGenerator<ElementFrame> {
    for (;;) {
      const frame = this.queue.shift();
      if (frame) {
        if (this.queue.length < HIGH_WATER) {
          const wake = this.wakeWriter;
          this.wakeWriter = null;
          wake?.();
        }
        yield frame;
      } else if (this.failure) throw this.failure;
      else if (this.done) return;
      else await new Promise<void>((resolve) => (this.wakeReader = resolve));
    }
  }
}

/** A hidden <video> element on the page that yields the clip's frames at the analysis size. */
export class VideoElementFrames {
  readonly width: number;
  readonly height: number;
  private readonly context: CanvasRenderingContext2D;

  private constructor(
    private readonly video: HTMLVideoElement,
    private readonly url: string,
    readonly timeline: ClipTimeline,
    maxWidthPx: number,
  ) {
    const factor = shrinkFactor(timeline.width, maxWidthPx);
    this.width = Math.floor(timeline.width / factor);
    this.height = Math.floor(timeline.height / factor);
    const canvas = document.createElement("canvas");
    canvas.width = this.width;
    canvas.height = this.height;
    const context = canvas.getContext("2d", { willReadFrequently: true, alpha: false });
    if (!context) throw new VideoElementError("This browser has no 2D canvas.");
    this.context = context;
  }

  static async open(file: Blob, timeline: ClipTimeline, maxWidthPx: number): Promise<VideoElementFrames> {
    const video = document.createElement("video");
    video.muted = true;
    video.playsInline = true;
    video.preload = "auto";
    // In the document (browsers present frames of attached elements only) but invisible and inert.
    video.setAttribute("aria-hidden", "true");
    Object.assign(video.style, { position: "fixed", left: "0", top: "0", width: "2px", height: "2px", opacity: "0", pointerEvents: "none" });
    const url = URL.createObjectURL(file);
    document.body.append(video);
    const frames = new VideoElementFrames(video, url, timeline, maxWidthPx);
    try {
      await new Promise<void>((resolve, reject) => {
        video.addEventListener("loadeddata", () => resolve(), { once: true });
        video.addEventListener("error", () => reject(new VideoElementError("This browser could not play the clip.")), { once: true });
        video.src = url;
      });
    } catch (error) {
      frames.dispose();
      throw error;
    }
    return frames;
  }

  /** The first frame at full size, as the element shows it once loaded (for marking the plate). */
  static async firstFrame(file: Blob): Promise<ImageData> {
    const timeline = await readClipTimeline(file);
    const frames = await VideoElementFrames.open(file, timeline, timeline.width);
    try {
      frames.draw();
      return frames.context.getImageData(0, 0, frames.width, frames.height);
    } finally {
      frames.dispose();
    }
  }

  dispose(): void {
    this.video.pause();
    this.video.removeAttribute("src");
    this.video.load();
    this.video.remove();
    URL.revokeObjectURL(this.url);
  }

  /** Every frame in presentation order, each drawn once. Stops (and pauses the element) on abort. */
  async *frames(signal: AbortSignal): AsyncGenerator<ElementFrame> {
    const channel = new FrameChannel();
    const stop = new AbortController();
    const onAbort = () => stop.abort(signal.reason);
    signal.addEventListener("abort", onAbort, { once: true });
    void this.produce(channel, stop.signal).then(
      () => channel.end(),
      (error: unknown) => channel.end(error),
    );
    try {
      yield* channel.read();
    } finally {
      signal.removeEventListener("abort", onAbort);
      stop.abort();
      this.video.pause();
    }
  }

  /** Draws the frame the element shows, at the analysis size. */
  private draw(): void {
    this.context.drawImage(this.video, 0, 0, this.width, this.height);
  }

  private capture(index: number): ElementFrame {
    this.draw();
    return { tS: this.timeline.timesS[index], data: this.context.getImageData(0, 0, this.width, this.height).data };
  }

  /** Media time of the next frame the element presents; null when none comes (ended, stalled). */
  private presented(signal: AbortSignal): Promise<number | null> {
    const video = this.video;
    return new Promise((resolve, reject) => {
      const cleanUp = () => {
        video.cancelVideoFrameCallback(callback);
        video.removeEventListener("ended", onEnded);
        video.removeEventListener("error", onError);
        signal.removeEventListener("abort", onAbort);
        clearTimeout(timer);
      };
      const finish = (value: number | null) => {
        cleanUp();
        resolve(value);
      };
      const fail = (error: unknown) => {
        cleanUp();
        reject(error);
      };
      const callback = video.requestVideoFrameCallback((_, metadata) => finish(metadata.mediaTime));
      const onEnded = () => finish(null);
      const onError = () => fail(new VideoElementError("The clip stopped playing part way: it may be damaged."));
      const onAbort = () => fail(signal.reason);
      const timer = setTimeout(() => finish(null), FRAME_WAIT_MS);
      video.addEventListener("ended", onEnded, { once: true });
      video.addEventListener("error", onError, { once: true });
      signal.addEventListener("abort", onAbort, { once: true });
    });
  }

  /** Seeks to the middle of a frame's display interval and draws it once the element presents it. */
  private async seekCapture(index: number, signal: AbortSignal): Promise<ElementFrame> {
    const video = this.video;
    const shown = this.presented(signal);
    const seeked = new Promise<void>((resolve) => video.addEventListener("seeked", () => resolve(), { once: true }));
    video.currentTime = seekTargetS(this.timeline.timesS, index);
    await seeked;
    // The frame callback can lag the seeked event; when it never comes the frame shown is already the one asked for.
    await shown;
    return this.capture(index);
  }

  private async produce(channel: FrameChannel, signal: AbortSignal): Promise<void> {
    const video = this.video;
    const times = this.timeline.timesS;
    let next = 0;
    while (next < times.length) {
      signal.throwIfAborted();
      if (channel.size >= HIGH_WATER) {
        video.pause();
        await channel.roomFreed();
        continue;
      }
      if (video.ended) {
        channel.push(await this.seekCapture(next, signal));
        next += 1;
        continue;
      }
      const shown = this.presented(signal);
      if (video.paused) await video.play();
      const mediaTimeS = await shown;
      if (mediaTimeS === null) {
        if (!video.ended) {
          channel.push(await this.seekCapture(next, signal));
          next += 1;
        }
        continue;
      }
      // Drawn at once: the callback's frame stays on the element until this task ends.
      const index = frameIndexAt(times, mediaTimeS);
      if (index < next) continue;
      const current = this.capture(index);
      if (index > next) {
        video.pause();
        for (; next < index; next++) channel.push(await this.seekCapture(next, signal));
      }
      channel.push(current);
      next = index + 1;
    }
    video.pause();
  }
}
