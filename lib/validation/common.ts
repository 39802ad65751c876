// Shared building blocks for the request schemas: lifts, camera views, ids and units.
import { z } from "zod";

export const LIFTS = ["squat", "bench", "deadlift"] as const;
export type Lift = (typeof LIFTS)[number];

/** "oblique" is the 45° view between side and front; the analysis treats it as a side view with a caution. */
export const CAMERA_VIEWS = ["side", "front", "oblique"] as const;
export type CameraView = (typeof CAMERA_VIEWS)[number];

export const UNIT_PREFERENCES = ["kg", "lb"] as const;
export type UnitPreference = (typeof UNIT_PREFERENCES)[number];

export const MEMBERSHIP_ROLES = ["coach", "athlete"] as const;
export type MembershipRole = (typeof MEMBERSHIP_ROLES)[number];

/** Kilograms per pound, exact by definition (International Yard and Pound Agreement, 1959). */
export const KG_PER_LB = 0.45359237;

export const uuidSchema = z.uuid({ error: "Not a valid id." });

/** better-auth generates its own user ids (random strings, not UUIDs). */
export const userIdSchema = z
  .string({ error: "A user id is required." })
  .trim()
  .min(1, { error: "A user id is required." })
  .max(64, { error: "Not a valid user id." });

export const emailSchema = z
  .string({ error: "An e-mail address is required." })
  .trim()
  .toLowerCase()
  .pipe(z.email({ error: "Enter a valid e-mail address." }).max(254, { error: "That e-mail address is too long." }));
