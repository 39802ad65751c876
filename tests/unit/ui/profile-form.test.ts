// The profile form's conversions: typed pounds and inches reach the API as kilograms and metres, bounds come
// from the API's own schema, and untouched fields keep their stored SI value exactly.
import { describe, expect, it } from "vitest";
import {
  convertFormValues,
  formValuesFromStored,
  profileFormSchema,
  storedValues,
  type ProfileFormValues,
} from "@/lib/client/profile-form";
import { parseDecimal } from "@/lib/client/units";

// Exact by definition (International Yard and Pound Agreement, 1959).
const KG_PER_LB = 0.45359237;
const M_PER_IN = 0.0254;

const blank: ProfileFormValues = { unitPreference: "kg", bodyMass: "", height: "", squat: "", bench: "", deadlift: "" };
const noneStored = storedValues(null);

describe("parseDecimal", () => {
  it("reads blanks as null, accepts a decimal comma and rejects junk", () => {
    expect(parseDecimal("  ")).toBeNull();
    expect(parseDecimal("82,5")).toBe(82.5);
    expect(parseDecimal(".5")).toBe(0.5);
    expect(parseDecimal("82.5 kg")).toBeNaN();
    expect(parseDecimal("1e3")).toBeNaN();
  });
});

describe("profileFormSchema", () => {
  it("converts pounds and inches to SI", () => {
    const result = profileFormSchema(noneStored).safeParse({
      ...blank,
      unitPreference: "lb",
      bodyMass: "180",
      height: "70",
      squat: "315",
    });
    expect(result.success).toBe(true);
    expect(result.data?.bodyMassKg).toBeCloseTo(180 * KG_PER_LB, 12);
    expect(result.data?.heightM).toBeCloseTo(70 * M_PER_IN, 12);
    expect(result.data?.oneRepMaxes).toEqual({ squat: 315 * KG_PER_LB });
  });

  it("reads centimetres for kg users and leaves blank fields out", () => {
    const result = profileFormSchema(noneStored).safeParse({ ...blank, bodyMass: "82,5", height: "178" });
    expect(result.data).toEqual({ bodyMassKg: 82.5, heightM: 1.78, unitPreference: "kg", oneRepMaxes: {} });
  });

  it("puts the API schema's bound messages on the typed field", () => {
    const result = profileFormSchema(noneStored).safeParse({ ...blank, bodyMass: "20", deadlift: "700" });
    expect(result.success).toBe(false);
    const byField = Object.fromEntries(result.error!.issues.map((issue) => [issue.path[0], issue.message]));
    expect(byField.bodyMass).toBe("Body mass must be at least 25 kg.");
    expect(byField.deadlift).toBe("A one-rep max must be at most 600 kg.");
  });

  it("flags text that is not a number", () => {
    const result = profileFormSchema(noneStored).safeParse({ ...blank, height: "tall" });
    expect(result.error?.issues.map((issue) => issue.path[0])).toEqual(["height"]);
  });

  it("sends an untouched stored value back exactly, not a rounded round trip", () => {
    const stored = storedValues({
      bodyMassKg: 100,
      heightM: 1.8,
      unitPreference: "lb",
      oneRepMaxes: { bench: 142.5 },
      updatedAt: "2026-03-01T10:00:00.000Z",
    });
    const shown = formValuesFromStored(stored, "lb");
    expect(shown.bodyMass).toBe("220.5");
    const result = profileFormSchema(stored).safeParse(shown);
    expect(result.data?.bodyMassKg).toBe(100);
    expect(result.data?.heightM).toBe(1.8);
    expect(result.data?.oneRepMaxes.bench).toBe(142.5);
  });
});

describe("convertFormValues", () => {
  it("re-expresses typed values when the unit switches, and leaves junk alone", () => {
    const lb = convertFormValues({ ...blank, bodyMass: "100", height: "180", squat: "oops" }, "lb");
    expect(lb).toEqual({ ...blank, unitPreference: "lb", bodyMass: "220.5", height: "70.9", squat: "oops" });
    const back = convertFormValues(lb, "kg");
    expect(back.bodyMass).toBe("100");
    expect(back.height).toBe("180");
  });
});
