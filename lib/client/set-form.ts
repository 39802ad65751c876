// The new-set form's logic apart from React: values as typed (load in the chosen unit), checked with the
// API's own schema after conversion to SI, so the form and the server agree on every bound.
import { z } from "zod";
import { CAMERA_VIEWS, LIFTS, UNIT_PREFERENCES, type Lift, type UnitPreference } from "@/lib/validation/common";
import { createSetSchema, type CreateSetData } from "@/lib/validation/set";
import { massToKg, parseDecimal } from "./units";

export interface SetFormValues {
  /** "" for the viewer's own set, or `${teamId}/${athleteId}`: a coach recording for one of the team's athletes. */
  athlete: string;
  teamId: string;
  sessionDate: string;
  lift: Lift;
  variant: string;
  load: string;
  unit: UnitPreference;
  reps: string;
  rpe: string;
  cameraView: (typeof CAMERA_VIEWS)[number];
  note: string;
}

export const SET_FORM_FIELDS = ["athlete", "teamId", "sessionDate", "lift", "variant", "load", "reps", "rpe", "cameraView", "note"] as const;
type SetFormField = (typeof SET_FORM_FIELDS)[number];

export const LIFT_LABELS: Record<Lift, string> = { squat: "Squat", bench: "Bench press", deadlift: "Deadlift" };

export const CAMERA_VIEW_LABELS: Record<SetFormValues["cameraView"], string> = { side: "Side", front: "Front", oblique: "45°" };

/** Common variants offered as suggestions; any other text is fine. */
export const VARIANT_SUGGESTIONS: Record<Lift, string[]> = {
  squat: ["high bar", "low bar", "paused", "tempo", "front squat", "box"],
  bench: ["competition pause", "touch and go", "close grip", "tempo", "feet up"],
  deadlift: ["conventional", "sumo", "paused", "deficit", "tempo"],
};

/** The API's field names that differ from the form's. */
function fieldOfPath(path: readonly PropertyKey[]): SetFormField {
  const head = String(path[0] ?? "note");
  if (head === "loadKg") return "load";
  if (head === "athleteId") return "athlete";
  return (SET_FORM_FIELDS as readonly string[]).includes(head) ? (head as SetFormField) : "note";
}

export function todayLocal(now = new Date()): string {
  const offsetMs = now.getTimezoneOffset() * 60_000;
  return new Date(now.getTime() - offsetMs).toISOString().slice(0, 10);
}

export function defaultSetFormValues(unit: UnitPreference, teamId: string | null): SetFormValues {
  return {
    athlete: "",
    teamId: teamId ?? "",
    sessionDate: todayLocal(),
    lift: "squat",
    variant: "",
    load: "",
    unit,
    reps: "",
    rpe: "",
    cameraView: "side",
    note: "",
  };
}

const numberIssue = (ctx: z.RefinementCtx, path: SetFormField, message: string) => ctx.addIssue({ code: "custom", path: [path], message });

/** The form's zod schema: typed strings in, the API's CreateSetData (SI) out. */
export const setFormSchema = z
  .object({
    athlete: z.string(),
    teamId: z.string(),
    sessionDate: z.string(),
    lift: z.enum(LIFTS, { error: "Choose squat, bench or deadlift." }),
    variant: z.string(),
    load: z.string(),
    unit: z.enum(UNIT_PREFERENCES),
    reps: z.string(),
    rpe: z.string(),
    cameraView: z.enum(CAMERA_VIEWS, { error: "Choose side, front or 45°." }),
    note: z.string(),
  })
  .transform((values, ctx): CreateSetData => {
    const load = parseDecimal(values.load);
    const reps = parseDecimal(values.reps);
    const rpe = parseDecimal(values.rpe);
    if (load === null) numberIssue(ctx, "load", "Enter the load on the bar.");
    else if (Number.isNaN(load)) numberIssue(ctx, "load", "Enter a number, like 142.5.");
    if (reps === null) numberIssue(ctx, "reps", "Enter the number of reps.");
    else if (Number.isNaN(reps)) numberIssue(ctx, "reps", "Enter a whole number.");
    if (rpe !== null && Number.isNaN(rpe)) numberIssue(ctx, "rpe", "Enter a number, like 8.5.");
    if (ctx.issues.length > 0) return z.NEVER;
    // Recording for an athlete files the set under the team they were picked from.
    const [forTeamId, forAthleteId] = values.athlete ? values.athlete.split("/") : [null, null];
    const parsed = createSetSchema.safeParse({
      teamId: forTeamId ?? (values.teamId || null),
      athleteId: forAthleteId ?? null,
      sessionDate: values.sessionDate,
      lift: values.lift,
      variant: values.variant.trim() || null,
      loadKg: massToKg(load as number, values.unit),
      reps,
      rpe,
      cameraView: values.cameraView,
      note: values.note.trim() || null,
    });
    if (parsed.success) return parsed.data;
    for (const issue of parsed.error.issues) numberIssue(ctx, fieldOfPath(issue.path), issue.message);
    return z.NEVER;
  });

/** The picker's value for an athlete of a team. */
export function athleteChoice(teamId: string, athleteId: string): string {
  return `${teamId}/${athleteId}`;
}
