// Track input, version 1: per-frame keypoints and bar position as the worker,
// the command line (`npm run analyse -- <track.json>`) and the server hand them
// to the analysis engine. parseTrack validates it and explains what is wrong.
import { z } from "zod";
import { FULL_SIZE_PLATE_DIAMETER_M } from "./calibration";
import { normaliseJointName } from "./joints";

export const MAX_FRAMES = 200_000;
export const MAX_KEYPOINTS_PER_FRAME = 200;
export const MAX_IMAGE_SIDE_PX = 16_384;

export const LIFTS = ["squat", "bench", "deadlift"] as const;
export const CAMERA_VIEWS = ["side", "front"] as const;

const finite = (what = "a finite number") =>
  z.number({ error: (issue) => (issue.input === undefined ? `required: ${what}` : `expected ${what}`) });

const positive = (what: string) => finite(what).gt(0, { error: `expected ${what}` });

const score = finite("a score from 0 to 1")
  .min(0, { error: "expected a score from 0 to 1" })
  .max(1, { error: "expected a score from 0 to 1" });

const keypointSchema = z.object(
  {
    name: z.string({ error: "expected a keypoint name (string)" }),
    x: finite(),
    y: finite(),
    score,
  },
  { error: "expected a keypoint object { name, x, y, score }" },
);

const barSchema = z.object(
  { x: finite(), y: finite(), score },
  { error: "expected null or a bar object { x, y, score }" },
);

const frameSchema = z.object(
  {
    t: finite("a time in seconds (finite number)").min(0, { error: "expected a time of 0 s or later" }),
    keypoints: z
      .array(keypointSchema, { error: "expected an array of keypoints" })
      .max(MAX_KEYPOINTS_PER_FRAME, { error: `too many keypoints (more than ${MAX_KEYPOINTS_PER_FRAME})` }),
    bar: barSchema.nullable().optional().transform((bar) => bar ?? null),
  },
  { error: "expected a frame object { t, keypoints, bar }" },
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

export const trackSchema = z
  .object(
    {
      version: z.literal(1, { error: "expected 1 (the only track format version this engine reads)" }),
      lift: z.enum(LIFTS, { error: `expected one of ${LIFTS.join(", ")}` }),
      view: z.enum(CAMERA_VIEWS, { error: `expected one of ${CAMERA_VIEWS.join(", ")}` }),
      fps: positive("frames per second greater than 0").max(1000, { error: "expected at most 1000 frames per second" }),
      width: positive("an image width in pixels").max(MAX_IMAGE_SIDE_PX, { error: `expected at most ${MAX_IMAGE_SIDE_PX} pixels` }),
      height: positive("an image height in pixels").max(MAX_IMAGE_SIDE_PX, { error: `expected at most ${MAX_IMAGE_SIDE_PX} pixels` }),
      calibration: calibrationSchema,
      frames: z
        .array(frameSchema, { error: "expected an array of frames" })
        .min(1, { error: "expected at least one frame (the track is empty)" })
        .max(MAX_FRAMES, { error: `too many frames (more than ${MAX_FRAMES})` }),
    },
    { error: "expected a track object" },
  )
  .superRefine((track, ctx) => {
    if (track.frames.length === 0) return;
    checkTimesIncrease(track.frames, ctx);
    checkSomethingSeen(track.frames, ctx);
  });

export type Track = z.output<typeof trackSchema>;
export type TrackFrame = Track["frames"][number];
export type Lift = Track["lift"];
export type CameraView = Track["view"];

/**
 * Times must strictly increase. Unsorted frames are rejected rather than
 * sorted: out-of-order frames mean the decoder handed over frames in decode
 * order, and re-sorting would hide that bug upstream.
 */
function checkTimesIncrease(frames: TrackFrame[], ctx: z.RefinementCtx): void {
  for (let i = 1; i < frames.length; i++) {
    if (!(frames[i].t > frames[i - 1].t)) {
      const kind = frames[i].t === frames[i - 1].t ? "duplicate time" : "time goes backwards";
      ctx.addIssue({
        code: "custom",
        path: ["frames", i, "t"],
        message: `${kind}: ${frames[i].t} s is not after frames[${i - 1}].t = ${frames[i - 1].t} s (frames must be in increasing time order)`,
      });
      return;
    }
  }
}

function checkSomethingSeen(frames: TrackFrame[], ctx: z.RefinementCtx): void {
  const seen = frames.some((f) => f.bar !== null || f.keypoints.some((k) => normaliseJointName(k.name) !== null));
  if (!seen) {
    ctx.addIssue({
      code: "custom",
      path: ["frames"],
      message: "no frame has a bar position or a recognised keypoint: there is nothing to analyse",
    });
  }
}

export interface TrackIssue {
  path: string;
  message: string;
}

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

/** Formats a zod path as `frames[12].bar.x`; the root is `track`. */
export function formatPath(path: readonly PropertyKey[]): string {
  let out = "";
  for (const key of path) {
    out += typeof key === "number" ? `[${key}]` : `${out ? "." : ""}${String(key)}`;
  }
  return out || "track";
}

/** Validates a track (an object, or its JSON text); throws TrackInputError. */
export function parseTrack(input: unknown): Track {
  const value = typeof input === "string" ? parseJson(input) : input;
  const result = trackSchema.safeParse(value);
  if (!result.success) {
    throw new TrackInputError(result.error.issues.map((i) => ({ path: formatPath(i.path), message: i.message })));
  }
  return result.data;
}

function parseJson(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch (error) {
    throw new TrackInputError([{ path: "track", message: `not valid JSON (${(error as Error).message})` }]);
  }
}
