// Athlete profile: body mass, height, preferred unit and one-rep maxes, all stored in SI units.
import { z } from "zod";
import { LIFTS, UNIT_PREFERENCES } from "./common";

// Plausibility bounds, not physiology: they only catch typing mistakes (common practice).
const bodyMassKg = z
  .number({ error: "Enter the body mass in kilograms." })
  .min(25, { error: "Body mass must be at least 25 kg." })
  .max(300, { error: "Body mass must be at most 300 kg." });
const heightM = z
  .number({ error: "Enter the height in metres." })
  .min(1.0, { error: "Height must be at least 1.00 m." })
  .max(2.5, { error: "Height must be at most 2.50 m." });
const oneRepMaxKg = z
  .number({ error: "Enter the one-rep max in kilograms." })
  .positive({ error: "A one-rep max must be above 0 kg." })
  .max(600, { error: "A one-rep max must be at most 600 kg." });

export const oneRepMaxesSchema = z.strictObject(
  { squat: oneRepMaxKg.optional(), bench: oneRepMaxKg.optional(), deadlift: oneRepMaxKg.optional() },
  {
    error: (issue) =>
      issue.code === "unrecognized_keys"
        ? `One-rep maxes are kept for squat, bench and deadlift only (not ${issue.keys.join(", ")}).`
        : "Enter the one-rep maxes in kilograms.",
  },
);
export type OneRepMaxes = z.infer<typeof oneRepMaxesSchema>;

export const profileInputSchema = z.object({
  bodyMassKg: bodyMassKg.nullable(),
  heightM: heightM.nullable(),
  unitPreference: z.enum(UNIT_PREFERENCES, { error: 'Choose "kg" or "lb".' }),
  oneRepMaxes: oneRepMaxesSchema.default({}),
});
export type ProfileInput = z.input<typeof profileInputSchema>;
export type ProfileData = z.output<typeof profileInputSchema>;

/** What GET /api/profile and GET /api/me return as `profile`. */
export interface Profile {
  bodyMassKg: number | null;
  heightM: number | null;
  unitPreference: (typeof UNIT_PREFERENCES)[number];
  oneRepMaxes: Partial<Record<(typeof LIFTS)[number], number>>;
  updatedAt: string;
}
