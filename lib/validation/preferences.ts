// Display preferences and the query strings of compare, trends and exports.
import { z } from "zod";
import { LIFTS } from "./common";

export const MASS_UNITS = ["kg", "lb"] as const;
export const LENGTH_UNITS = ["metric", "imperial"] as const;

export const preferencesSchema = z.object({
  massUnit: z.enum(MASS_UNITS),
  lengthUnit: z.enum(LENGTH_UNITS),
});
export type PreferencesData = z.infer<typeof preferencesSchema>;

const uuid = z.uuid({ error: "expected a rep id" });

/** `reps=<id>,<id>[,…]`: two to six reps, no repeats. */
export const compareQuerySchema = z.object({
  reps: z
    .string({ error: "list two or more rep ids" })
    .transform((s) => s.split(",").map((id) => id.trim()).filter(Boolean))
    .pipe(z.array(uuid).min(2, { error: "pick at least two reps" }).max(6, { error: "compare at most six reps" }))
    .refine((ids) => new Set(ids).size === ids.length, { error: "each rep only once" }),
});

export const trendsQuerySchema = z.object({
  athlete: z.string().min(1, { error: "pick an athlete" }).max(200),
  lift: z.enum(LIFTS, { error: "pick squat, bench or deadlift" }),
});

const isoDate = z.iso.date({ error: "expected a date as YYYY-MM-DD" });

/** One of: a set; an athlete (optionally between two dates); or a date range over everything the viewer may read. */
export const repExportQuerySchema = z
  .object({
    set: z.uuid({ error: "expected a set id" }).optional(),
    athlete: z.string().min(1).max(200).optional(),
    lift: z.enum(LIFTS).optional(),
    from: isoDate.optional(),
    to: isoDate.optional(),
  })
  .refine((q) => q.set !== undefined || q.athlete !== undefined || (q.from !== undefined && q.to !== undefined), {
    error: "give a set, an athlete, or a from and to date",
  })
  .refine((q) => q.from === undefined || q.to === undefined || q.from <= q.to, { error: "from must not be after to", path: ["to"] });
export type RepExportQuery = z.infer<typeof repExportQuerySchema>;
