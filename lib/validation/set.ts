// Request schemas for recorded sets (metadata only in the foundation issue; clips and analyses come later).
import { z } from "zod";
import { CAMERA_VIEWS, LIFTS, userIdSchema, uuidSchema } from "./common";

export const SET_STATUSES = ["draft", "uploaded", "analysed", "failed"] as const;
export type SetStatus = (typeof SET_STATUSES)[number];

/**
 * none -> uploading -> uploaded (checked: a video within the limits) -> converting -> ready (an H.264 copy exists)
 * or failed (the copy could not be made); deleted when the athlete removes it.
 */
export const CLIP_STATUSES = ["none", "uploading", "uploaded", "converting", "ready", "failed", "deleted"] as const;
export type ClipStatus = (typeof CLIP_STATUSES)[number];

export const createSetSchema = z.object({
  teamId: uuidSchema.nullable().default(null),
  /** A coach (or admin) recording for one of the team's athletes; absent: the set is the viewer's own. */
  athleteId: userIdSchema.nullable().default(null),
  sessionDate: z.iso.date({ error: "Enter the session date as YYYY-MM-DD." }),
  lift: z.enum(LIFTS, { error: "Choose squat, bench or deadlift." }),
  variant: z.string().trim().max(60, { error: "Use at most 60 characters." }).nullable().default(null),
  loadKg: z
    .number({ error: "Enter the load in kilograms." })
    .min(0, { error: "The load cannot be negative." })
    .max(600, { error: "The load must be at most 600 kg." }),
  reps: z
    .number({ error: "Enter the number of reps." })
    .int({ error: "Reps must be a whole number." })
    .min(1, { error: "At least 1 rep." })
    .max(100, { error: "At most 100 reps." }),
  // RPE 1..10 in half steps, as on the RPE-based RIR scale (Zourdos et al. 2016, J Strength Cond Res 30(1)).
  rpe: z
    .number({ error: "Enter an RPE between 1 and 10." })
    .min(1, { error: "RPE is at least 1." })
    .max(10, { error: "RPE is at most 10." })
    .multipleOf(0.5, { error: "RPE goes in steps of 0.5." })
    .nullable()
    .default(null),
  cameraView: z.enum(CAMERA_VIEWS, { error: "Choose side, front or 45°." }),
  note: z.string().trim().max(2000, { error: "Use at most 2000 characters." }).nullable().default(null),
  recordedAt: z.iso.datetime({ offset: true, error: "Enter a date-time with a time zone." }).nullable().default(null),
});
export type CreateSetInput = z.input<typeof createSetSchema>;
export type CreateSetData = z.output<typeof createSetSchema>;

/** Query string of GET /api/sets: both filters optional; empty strings count as absent. */
export const setListQuerySchema = z.object({
  athleteId: z.preprocess((v) => (v === "" ? undefined : v), userIdSchema.optional()),
  teamId: z.preprocess((v) => (v === "" ? undefined : v), uuidSchema.optional()),
  limit: z.coerce.number().int().min(1).max(200).default(50),
});
export type SetListQuery = z.infer<typeof setListQuerySchema>;
