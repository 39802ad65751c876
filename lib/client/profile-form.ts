// The profile form's logic apart from React: values as typed in the chosen unit, checked with the API's
// own schema after conversion to SI, so the form and the server agree on every bound.
import { z } from "zod";
import { LIFTS, type Lift, type UnitPreference } from "@/lib/validation/common";
import { profileInputSchema, type Profile, type ProfileData } from "@/lib/validation/profile";
import { formatForInput, heightFromM, heightToM, massFromKg, massToKg, parseDecimal } from "./units";

export const PROFILE_NUMBER_FIELDS = ["bodyMass", "height", ...LIFTS] as const;
export type ProfileNumberField = (typeof PROFILE_NUMBER_FIELDS)[number];

export interface ProfileFormValues extends Record<ProfileNumberField, string> {
  unitPreference: UnitPreference;
}

// Decimals shown per field: mass to 0.1, height to whole centimetres or 0.1 inch.
const MASS_DIGITS = 1;
const heightDigits = (unit: UnitPreference) => (unit === "kg" ? 0 : 1);

/** Maps a path of the API schema (`bodyMassKg`, `oneRepMaxes.squat`) to the form field that holds it. */
function fieldOfPath(path: readonly PropertyKey[]): ProfileNumberField | "unitPreference" {
  const [head, lift] = path;
  if (head === "bodyMassKg") return "bodyMass";
  if (head === "heightM") return "height";
  if (head === "oneRepMaxes" && LIFTS.includes(lift as Lift)) return lift as Lift;
  return "unitPreference";
}

/** SI values the form was opened with; a field left untouched sends its stored value back unchanged. */
export type StoredValues = Record<ProfileNumberField, number | null>;

export function storedValues(profile: Profile | null): StoredValues {
  return {
    bodyMass: profile?.bodyMassKg ?? null,
    height: profile?.heightM ?? null,
    squat: profile?.oneRepMaxes.squat ?? null,
    bench: profile?.oneRepMaxes.bench ?? null,
    deadlift: profile?.oneRepMaxes.deadlift ?? null,
  };
}

function displayValue(field: ProfileNumberField, si: number | null, unit: UnitPreference): string {
  if (si === null) return "";
  if (field === "height") return formatForInput(heightFromM(si, unit), heightDigits(unit));
  return formatForInput(massFromKg(si, unit), MASS_DIGITS);
}

function siValue(field: ProfileNumberField, typed: number, unit: UnitPreference): number {
  return field === "height" ? heightToM(typed, unit) : massToKg(typed, unit);
}

export function formValuesFromStored(stored: StoredValues, unit: UnitPreference): ProfileFormValues {
  const values = { unitPreference: unit } as ProfileFormValues;
  for (const field of PROFILE_NUMBER_FIELDS) values[field] = displayValue(field, stored[field], unit);
  return values;
}

/** Re-expresses the typed values when the person switches between kg and lb. */
export function convertFormValues(values: ProfileFormValues, to: UnitPreference): ProfileFormValues {
  const next = { ...values, unitPreference: to };
  for (const field of PROFILE_NUMBER_FIELDS) {
    const typed = parseDecimal(values[field]);
    if (typed === null || Number.isNaN(typed)) continue;
    next[field] = displayValue(field, siValue(field, typed, values.unitPreference), to);
  }
  return next;
}

/** Turns typed values into SI, keeping the stored value exactly when a field shows it unchanged. */
function siValues(values: ProfileFormValues, stored: StoredValues): Record<ProfileNumberField, number | null> {
  const unit = values.unitPreference;
  const result = {} as Record<ProfileNumberField, number | null>;
  for (const field of PROFILE_NUMBER_FIELDS) {
    const typed = parseDecimal(values[field]);
    const untouched = stored[field] !== null && values[field] === displayValue(field, stored[field], unit);
    result[field] = untouched ? stored[field] : typed === null ? null : siValue(field, typed, unit);
  }
  return result;
}

/** The form's zod schema: typed strings in, the API's ProfileData (SI) out. */
export function profileFormSchema(stored: StoredValues) {
  const text = z.string();
  return z
    .object({
      unitPreference: z.enum(["kg", "lb"], { error: 'Choose "kg" or "lb".' }),
      bodyMass: text,
      height: text,
      squat: text,
      bench: text,
      deadlift: text,
    })
    .transform((values, ctx): ProfileData => {
      for (const field of PROFILE_NUMBER_FIELDS) {
        if (Number.isNaN(parseDecimal(values[field]))) {
          ctx.addIssue({ code: "custom", path: [field], message: "Enter a number, like 82.5." });
        }
      }
      if (ctx.issues.length > 0) return z.NEVER;
      const si = siValues(values, stored);
      const parsed = profileInputSchema.safeParse({
        bodyMassKg: si.bodyMass,
        heightM: si.height,
        unitPreference: values.unitPreference,
        oneRepMaxes: Object.fromEntries(LIFTS.filter((lift) => si[lift] !== null).map((lift) => [lift, si[lift]])),
      });
      if (parsed.success) return parsed.data;
      for (const issue of parsed.error.issues) {
        ctx.addIssue({ code: "custom", path: [fieldOfPath(issue.path)], message: issue.message });
      }
      return z.NEVER;
    });
}
