// The new-set form's schema: typed strings in the chosen unit become the API's SI body, checked by the API's own schema.
import { describe, expect, it } from "vitest";
import { athleteChoice, setFormSchema, type SetFormValues } from "@/lib/client/set-form";

const values: SetFormValues = {
  athlete: "",
  teamId: "",
  sessionDate: "2026-03-02",
  lift: "deadlift",
  variant: " sumo ",
  load: "405",
  unit: "lb",
  reps: "3",
  rpe: "8,5",
  cameraView: "oblique",
  note: "",
};

describe("setFormSchema", () => {
  it("converts pounds to kilograms and blanks to null", () => {
    const parsed = setFormSchema.parse(values);
    // 1 lb = 0.45359237 kg exactly (International Yard and Pound Agreement, 1959): 405 lb = 183.7049 kg.
    expect(parsed.loadKg).toBeCloseTo(183.7049, 4);
    expect(parsed).toMatchObject({ teamId: null, variant: "sumo", reps: 3, rpe: 8.5, cameraView: "oblique", note: null });
  });

  it("files a set recorded for an athlete under the team they were picked from, whatever the team field says", () => {
    const teamId = "5e1d0c0a-7c3b-4a51-9a8e-000000000001";
    const parsed = setFormSchema.parse({ ...values, teamId: "", athlete: athleteChoice(teamId, "athlete-7") });
    expect(parsed).toMatchObject({ teamId, athleteId: "athlete-7" });
    expect(setFormSchema.parse(values)).toMatchObject({ athleteId: null });
  });

  it("puts each problem on its field, with the API's own messages", () => {
    const result = setFormSchema.safeParse({ ...values, load: "", reps: "2.5", rpe: "11" });
    expect(result.success).toBe(false);
    const fields = Object.fromEntries(result.error!.issues.map((i) => [i.path[0], i.message]));
    expect(fields).toEqual({ load: "Enter the load on the bar." });
    const second = setFormSchema.safeParse({ ...values, reps: "2.5", rpe: "11" });
    expect(Object.fromEntries(second.error!.issues.map((i) => [i.path[0], i.message]))).toEqual({
      reps: "Reps must be a whole number.",
      rpe: "RPE is at most 10.",
    });
  });
});
