// Turns decoded frames into a Track (version 1): the bar tracked on every frame, pose on the frames
// the scheduler picks, everything in pixels of the original clip. Shared by the analysis worker and
// the command line; the caller decodes frames and owns the pose detector.
import { DEFAULT_MIN_SCORE } from "@/lib/analysis/resample";
import { parseTrack, type Track, type TrackFrame } from "@/lib/analysis/track";
import type { DetectedPose, PoseDetector } from "@/lib/pose/detector";
import type { BarTracker, PixelRect, RgbaFrame } from "@/lib/tracking";
import { frameScale, startBarTracker, toClipPoint, type FrameScale, type PlateRim } from "./bar-start";
import { PipelineError } from "./errors";
import { parsePipelineOptions, type PipelineOptions, type ResolvedPipelineOptions } from "./options";
import { createPoseScheduler, type PoseScheduler } from "./pose-scheduler";

export interface ClipFrame {
  /** Presentation time in seconds from the start of the clip. */
  tS: number;
  /** Pixels, possibly scaled down from the clip. */
  frame: RgbaFrame;
}

/**
 * A decoded frame whose pixels are read on demand: the pipeline asks for the whole frame only when
 * pose runs on it (or it is the first), otherwise for the tracker's window alone.
 */
export interface PendingFrame {
  /** Presentation time in seconds from the start of the clip. */
  tS: number;
  /** The frame with every pixel, or with only `region` filled in (other pixels hold anything). */
  read(region: PixelRect | null): Promise<RgbaFrame>;
  /** Frees the decoded frame; the pipeline calls it exactly once, whatever happens. */
  release(): void;
}

export type PipelineFrame = ClipFrame | PendingFrame;

/** Asks for no pixels at all: a frame that neither pose nor the tracker will look at. */
const NO_PIXELS: PixelRect = { x: 0, y: 0, width: 0, height: 0 };

export interface PipelineProgress {
  framesDone: number;
  poseFrames: number;
  /** Presentation time of the latest frame. */
  clipTimeS: number;
  /** 0..1 of the clip's duration, or null when the duration is unknown. */
  fraction: number | null;
  elapsedS: number;
}

export interface PipelineRuntime {
  detector: PoseDetector;
  onProgress?: (progress: PipelineProgress) => void;
  signal?: AbortSignal;
}

export interface PipelineStats {
  frameCount: number;
  poseFrames: number;
  /** Frames where the tracker found the bar. */
  barFrames: number;
  analysisWidth: number;
  analysisHeight: number;
  clipDurationS: number;
  wallS: number;
  /** Clip seconds analysed per wall-clock second (above 1 = faster than playback). */
  realTimeFactor: number;
  poseMsMean: number;
  trackMsMean: number;
  /** Wall time spent waiting for the next frame (demuxing, decoding, and reading frames that come as pixels). */
  frameWaitS: number;
  /** Wall time spent reading the pixels of pending frames, and how many were read only around the bar. */
  readS: number;
  regionFrames: number;
  /** Final spacing of pose frames, clip seconds (0 = every frame). */
  poseIntervalS: number;
}

export interface PipelineResult {
  track: Track;
  /** "pose-estimate" when no bar was marked: the analysis places the bar from the athlete's hands or shoulders. */
  barSource: "tracked" | "pose-estimate";
  plate: PlateRim | null;
  stats: PipelineStats;
}

/** Progress is reported at most this often (wall seconds). */
const PROGRESS_EVERY_S = 0.2;
/** Let the event loop run (a cancel message, the page) at least this often (wall seconds). */
const YIELD_EVERY_S = 0.05;
/** A pose counts as a person when at least this many keypoints clear the analysis's score floor (common practice). */
const MIN_PERSON_KEYPOINTS = 5;

const NO_SCALE_MESSAGE =
  "No scale to turn pixels into metres: mark the plate (a tap on the first frame, or its circle) or give the athlete's height";

const yieldToEventLoop = () => new Promise<void>((resolve) => setTimeout(resolve, 0));

function isPerson(pose: DetectedPose | null): pose is DetectedPose {
  return pose !== null && pose.keypoints.filter((k) => k.score >= DEFAULT_MIN_SCORE).length >= MIN_PERSON_KEYPOINTS;
}

/** Mutable state of one run. */
class PipelineRun {
  readonly frames: TrackFrame[] = [];
  readonly scheduler: PoseScheduler;
  tracker: BarTracker | null = null;
  plate: PlateRim | null = null;
  scale: FrameScale | null = null;
  analysisSize = { width: 0, height: 0 };
  personFrames = 0;
  poseFrames = 0;
  barFrames = 0;
  poseMs = 0;
  trackMs = 0;
  readMs = 0;
  regionFrames = 0;
  frameWaitMs = 0;
  readonly startMs = performance.now();
  lastYieldMs = this.startMs;
  lastProgressMs = -Infinity;

  constructor(
    readonly options: ResolvedPipelineOptions,
    readonly runtime: PipelineRuntime,
  ) {
    this.scheduler = createPoseScheduler(options.poseSchedule);
  }

  start(first: RgbaFrame): void {
    this.scale = frameScale(this.options.source, first);
    this.analysisSize = { width: first.width, height: first.height };
    if (!this.options.bar) return;
    const started = startBarTracker(this.options.bar, first, this.scale);
    this.tracker = started.tracker;
    this.plate = started.plate;
    if (!this.plate && this.options.athleteHeightM === undefined) {
      throw new PipelineError("no-scale", `${NO_SCALE_MESSAGE} (no plate rim was found around the tap)`);
    }
  }

  trackBar(frame: RgbaFrame): TrackFrame["bar"] {
    if (!this.tracker || !this.scale) return null;
    const started = performance.now();
    const sample = this.tracker.track(frame);
    this.trackMs += performance.now() - started;
    if (!sample) return null;
    this.barFrames += 1;
    return { ...toClipPoint(this.scale, sample.x, sample.y), score: sample.score };
  }

  async pose(frame: RgbaFrame, tS: number, due: boolean): Promise<TrackFrame["keypoints"]> {
    if (!this.scale || !due) return [];
    const started = performance.now();
    const pose = await this.runtime.detector.estimate(frame, tS);
    const durationMs = performance.now() - started;
    this.scheduler.recordPose(tS, durationMs);
    this.poseMs += durationMs;
    this.poseFrames += 1;
    if (!isPerson(pose)) return [];
    this.personFrames += 1;
    // Pose models give continuous image coordinates (pixel i spans i..i+1), which scale plainly.
    const { x: sx, y: sy } = this.scale;
    return pose.keypoints
      .filter((k) => Number.isFinite(k.x) && Number.isFinite(k.y) && Number.isFinite(k.score))
      .map((k) => ({ name: k.name, x: k.x * sx, y: k.y * sy, score: Math.min(1, Math.max(0, k.score)) }));
  }

  /** The region of the frame anyone will read: all of it for the first frame and pose frames. */
  private neededRegion(poseDue: boolean): PixelRect | null {
    if (!this.scale || poseDue) return null;
    return this.tracker ? this.tracker.nextRegion() : NO_PIXELS;
  }

  private async pixels(input: PipelineFrame, poseDue: boolean): Promise<RgbaFrame> {
    if ("frame" in input) return input.frame;
    const region = this.neededRegion(poseDue);
    const started = performance.now();
    const frame = await input.read(region);
    this.readMs += performance.now() - started;
    if (region) this.regionFrames += 1;
    return frame;
  }

  async step(input: PipelineFrame): Promise<void> {
    try {
      await this.stepOn(input);
    } finally {
      if (!("frame" in input)) input.release();
    }
  }

  private async stepOn(input: PipelineFrame): Promise<void> {
    const { tS } = input;
    const previous = this.frames[this.frames.length - 1];
    // Frames before the clip's start are never shown; a repeated time would break the increasing-time rule.
    if (tS < 0 || (previous && tS <= previous.t)) return;
    const frameIntervalS = previous ? tS - previous.t : 1 / (this.options.source.fps ?? 30);
    const poseDue = this.scheduler.isDue(tS, frameIntervalS);
    const frame = await this.pixels(input, poseDue);
    if (!this.scale) this.start(frame);
    const bar = this.trackBar(frame);
    const keypoints = await this.pose(frame, tS, poseDue);
    this.frames.push({ t: tS, keypoints, bar });
    const wallS = (performance.now() - this.startMs) / 1000;
    this.scheduler.recordProgress(tS - this.frames[0].t, wallS - this.poseMs / 1000);
    await this.breathe(tS);
  }

  private async breathe(tS: number): Promise<void> {
    const now = performance.now();
    if (now - this.lastProgressMs >= PROGRESS_EVERY_S * 1000) {
      this.lastProgressMs = now;
      this.report(tS);
    }
    if (now - this.lastYieldMs >= YIELD_EVERY_S * 1000) {
      await yieldToEventLoop();
      this.lastYieldMs = performance.now();
    }
    this.runtime.signal?.throwIfAborted();
  }

  report(tS: number): void {
    const durationS = this.options.source.durationS;
    this.runtime.onProgress?.({
      framesDone: this.frames.length,
      poseFrames: this.poseFrames,
      clipTimeS: tS,
      fraction: durationS ? Math.min(1, tS / durationS) : null,
      elapsedS: (performance.now() - this.startMs) / 1000,
    });
  }

  dispose(): void {
    this.tracker?.dispose();
  }
}

function fpsOf(frames: TrackFrame[], given: number | null): number {
  if (given) return given;
  if (frames.length < 2) return 30;
  return (frames.length - 1) / (frames[frames.length - 1].t - frames[0].t);
}

function buildTrack(run: PipelineRun): Track {
  const { options, frames, plate } = run;
  const calibration = plate
    ? { plate: { cx: plate.cx, cy: plate.cy, radiusPx: plate.radiusPx, diameterM: options.plateDiameterM } }
    : { athleteHeightM: options.athleteHeightM as number };
  return parseTrack({
    version: 1,
    lift: options.lift,
    view: options.view,
    fps: fpsOf(frames, options.source.fps),
    width: options.source.width,
    height: options.source.height,
    calibration,
    frames,
  });
}

function stats(run: PipelineRun): PipelineStats {
  const { frames } = run;
  const wallS = (performance.now() - run.startMs) / 1000;
  const clipDurationS = frames.length > 1 ? frames[frames.length - 1].t - frames[0].t + (frames[1].t - frames[0].t) : 0;
  return {
    frameCount: frames.length,
    poseFrames: run.poseFrames,
    barFrames: run.barFrames,
    analysisWidth: run.analysisSize.width,
    analysisHeight: run.analysisSize.height,
    clipDurationS,
    wallS,
    realTimeFactor: wallS > 0 ? clipDurationS / wallS : 0,
    poseMsMean: run.poseFrames > 0 ? run.poseMs / run.poseFrames : 0,
    trackMsMean: run.tracker && frames.length > 0 ? run.trackMs / frames.length : 0,
    frameWaitS: run.frameWaitMs / 1000,
    readS: run.readMs / 1000,
    regionFrames: run.regionFrames,
    poseIntervalS: run.scheduler.intervalS,
  };
}

/** Validates the options and that they can give a scale, before any frame is decoded. */
export function checkPipelineOptions(input: PipelineOptions): ResolvedPipelineOptions {
  const options = parsePipelineOptions(input);
  if (!options.bar && options.athleteHeightM === undefined) throw new PipelineError("no-scale", NO_SCALE_MESSAGE);
  return options;
}

/**
 * Runs the bar tracker on every frame and pose on the scheduled ones, then builds the Track.
 * Throws PipelineError for input the user can fix, and the signal's reason when aborted.
 */
export async function runPipeline(
  frames: AsyncIterable<PipelineFrame>,
  input: PipelineOptions,
  runtime: PipelineRuntime,
): Promise<PipelineResult> {
  const options = checkPipelineOptions(input);
  runtime.signal?.throwIfAborted();
  runtime.detector.reset();
  const run = new PipelineRun(options, runtime);
  try {
    let waitFrom = performance.now();
    for await (const frame of frames) {
      run.frameWaitMs += performance.now() - waitFrom;
      await run.step(frame);
      waitFrom = performance.now();
    }
  } finally {
    run.dispose();
    runtime.detector.reset();
  }
  if (run.frames.length === 0) throw new PipelineError("no-frames", "The clip has no video frames to analyse");
  if (!options.bar && run.personFrames === 0) {
    throw new PipelineError(
      "no-person",
      "No person was found in the clip and no bar was marked: tap the plate or the sleeve end on the first frame",
    );
  }
  run.report(run.frames[run.frames.length - 1].t);
  return { track: buildTrack(run), barSource: options.bar ? "tracked" : "pose-estimate", plate: run.plate, stats: stats(run) };
}
