// Track input, version 1: per-frame keypoints and bar position as the worker,
// the command line (`npm run analyse -- <track.json>`) and the server hand them
// to the analysis engine. parseTrack validates it and explains what is wrong.
import { z } from "zod";
import { FULL_SIZE_PLATE_DIAMETER_M } from "./calibration";
import {
  FRAME_MESSAGES,
  MAX_KEYPOINTS_PER_FRAME,
  formatPath,
  nothingSeenIssue,
  numberMessage,
  parseFrames,
  timeOrderIssue,
  type FramesIssue,
  type TrackIssue,
} from "./track-frames";

export { MAX_KEYPOINTS_PER_FRAME, formatPath, type TrackIssue };
export const MAX_FRAMES = 200_000;
export const MAX_IMAGE_SIDE_PX = 16_384;

export const LIFTS = ["squat", "bench", "deadlift"] as const;
export const CAMERA_VIEWS = ["side", "front"] as const;

const finite = (what: string = FRAME_MESSAGES.coordinate) => z.number({ error: (issue) => numberMessage(issue.input, what) });

const positive = (what: string) => finite(what).gt(0, { error: `expected ${what}` });

const score = finite(FRAME_MESSAGES.score)
  .min(0, { error: `expected ${FRAME_MESSAGES.score}` })
  .max(1, { error: `expected ${FRAME_MESSAGES.score}` });

const keypointSchema = z.object({ name: z.string({ error: FRAME_MESSAGES.name }), x: finite(), y: finite(), score }, { error: FRAME_MESSAGES.keypoint });

const barSchema = z.object({ x: finite(), y: finite(), score }, { error: FRAME_MESSAGES.bar });

/** One frame, stated as a schema; parseTrack runs the same checks by hand (track-frames.ts) for speed. */
const frameSchema = z.object(
  {
    t: finite(FRAME_MESSAGES.time).min(0, { error: FRAME_MESSAGES.negativeTime }),
    keypoints: z
      .array(keypointSchema, { error: FRAME_MESSAGES.keypoints })
      .max(MAX_KEYPOINTS_PER_FRAME, { error: FRAME_MESSAGES.tooManyKeypoints }),
    bar: barSchema.nullable().optional().transform((bar) => bar ?? null),
  },
  { error: FRAME_MESSAGES.frame },
);

const plateSchema = z.object(
  {
    cx: finite(),
    cy: finite(),
    radiusPx: positive("a radius in pixels greater than 0"),
    diameterM: positive("a plate diameter in metres greater than 0")
      .max(1, { error: "expected a plate diameter in metres (at most 1 m)" })
      // Read lazily: calibration.ts imports this module too, so the constant may not be initialised yet at load time.
      .default(() => FULL_SIZE_PLATE_DIAMETER_M),
  },
  { error: "expected a plate object { cx, cy, radiusPx, diameterM }" },
);

/** Exactly one of the three ways to turn pixels into metres (see calibration.ts). */
const calibrationSchema = z
  .object(
    {
      plate: plateSchema.optional(),
      metresPerPixel: positive("metres per pixel greater than 0").optional(),
      /** Caller's own estimate of the given scale's uncertainty, if known. */
      uncertaintyPct: finite().min(0, { error: "expected a percentage of 0 or more" }).optional(),
      athleteHeightM: positive("a height in metres greater than 0")
        .min(1, { error: "expected an athlete height in metres (1 to 2.5)" })
        .max(2.5, { error: "expected an athlete height in metres (1 to 2.5)" })
        .optional(),
    },
    { error: "expected a calibration object: { plate }, { metresPerPixel } or { athleteHeightM }" },
  )
  .superRefine((c, ctx) => {
    const given = [c.plate, c.metresPerPixel, c.athleteHeightM].filter((v) => v !== undefined).length;
    if (given !== 1) {
      ctx.addIssue({
        code: "custom",
        message: `expected exactly one of plate, metresPerPixel, athleteHeightM (got ${given})`,
      });
    }
  })
  .transform(
    (c): PlateCalibration | ScaleCalibration | AthleteHeightCalibration =>
      c.plate
        ? { plate: c.plate }
        : c.metresPerPixel !== undefined
          ? { metresPerPixel: c.metresPerPixel, ...(c.uncertaintyPct === undefined ? {} : { uncertaintyPct: c.uncertaintyPct }) }
          : { athleteHeightM: c.athleteHeightM as number },
  );

export interface PlateCalibration {
  plate: { cx: number; cy: number; radiusPx: number; diameterM: number };
}
export interface ScaleCalibration {
  metresPerPixel: number;
  uncertaintyPct?: number;
}
export interface AthleteHeightCalibration {
  athleteHeightM: number;
}

/** The list of frames: its length is checked here, each frame by `item`. */
const framesOf = <T extends z.ZodType>(item: T) =>
  z
    .array(item, { error: "expected an array of frames" })
    .min(1, { error: "expected at least one frame (the track is empty)" })
    .max(MAX_FRAMES, { error: `too many frames (more than ${MAX_FRAMES})` });

const envelopeShape = {
  version: z.literal(1, { error: "expected 1 (the only track format version this engine reads)" }),
  lift: z.enum(LIFTS, { error: `expected one of ${LIFTS.join(", ")}` }),
  view: z.enum(CAMERA_VIEWS, { error: `expected one of ${CAMERA_VIEWS.join(", ")}` }),
  fps: positive("frames per second greater than 0").max(1000, { error: "expected at most 1000 frames per second" }),
  width: positive("an image width in pixels").max(MAX_IMAGE_SIDE_PX, { error: `expected at most ${MAX_IMAGE_SIDE_PX} pixels` }),
  height: positive("an image height in pixels").max(MAX_IMAGE_SIDE_PX, { error: `expected at most ${MAX_IMAGE_SIDE_PX} pixels` }),
  calibration: calibrationSchema,
};
const TRACK_OBJECT = { error: "expected a track object" };

const addIssue = (ctx: z.RefinementCtx, issue: FramesIssue | null) => {
  if (issue) ctx.addIssue({ code: "custom", path: issue.path, message: issue.message });
};

/** The whole track format as one schema (what parseTrack accepts). */
export const trackSchema = z.object({ ...envelopeShape, frames: framesOf(frameSchema) }, TRACK_OBJECT).superRefine((track, ctx) => {
  if (track.frames.length === 0) return;
  addIssue(ctx, timeOrderIssue(track.frames));
  addIssue(ctx, nothingSeenIssue(track.frames));
});

/** Everything but the frames' contents, which parseTrack checks by hand. */
const envelopeSchema = z.object({ ...envelopeShape, frames: framesOf(z.unknown()) }, TRACK_OBJECT);

export type Track = z.output<typeof trackSchema>;
export type TrackFrame = Track["frames"][number];
export type Lift = Track["lift"];
export type CameraView = Track["view"];

/** Bad track input; the message names the field path and what is wrong. */
export class TrackInputError extends Error {
  readonly issues: TrackIssue[];
  constructor(issues: TrackIssue[]) {
    const [first] = issues;
    const more = issues.length > 1 ? ` (and ${issues.length - 1} more problem${issues.length > 2 ? "s" : ""})` : "";
    super(`${first.path}: ${first.message}${more}`);
    this.name = "TrackInputError";
    this.issues = issues;
  }
}

/**
 * Validates a track (an object, or its JSON text); throws TrackInputError. The same checks as
 * trackSchema; the frames are checked by hand for speed (track-frames.ts). The checks on the
 * frames as a whole (time order, something seen) run once every field is valid.
 */
export function parseTrack(input: unknown): Track {
  const value = typeof input === "string" ? parseJson(input) : input;
  const envelope = envelopeSchema.safeParse(value);
  const issues: TrackIssue[] = envelope.success ? [] : envelope.error.issues.map((i) => ({ path: formatPath(i.path), message: i.message }));
  const rawFrames = (value as { frames?: unknown } | null)?.frames;
  const framesUsable = Array.isArray(rawFrames) && rawFrames.length <= MAX_FRAMES;
  const frames = framesUsable ? parseFrames(rawFrames, issues) : [];
  if (issues.length === 0 && envelope.success) {
    for (const issue of [timeOrderIssue(frames), nothingSeenIssue(frames)]) {
      if (issue) issues.push({ path: formatPath(issue.path), message: issue.message });
    }
  }
  if (issues.length > 0 || !envelope.success) throw new TrackInputError(issues);
  return { ...envelope.data, frames };
}

function parseJson(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch (error) {
    throw new TrackInputError([{ path: "track", message: `not valid JSON (${(error as Error).message})` }]);
  }
}
