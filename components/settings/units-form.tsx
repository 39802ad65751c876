"use client";
// Display units for everyone (coaches too): mass in kg or lb, lengths metric or imperial. Compare,
// trends and the CSV export read them; what is stored stays in SI units.
import { useMutation } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useState, type FormEvent } from "react";
import { z } from "zod";
import { apiFetch } from "@/lib/client/api";
import { LENGTH_UNITS, MASS_UNITS, type PreferencesData } from "@/lib/validation/preferences";
import { Banner } from "@/components/ui/banner";
import { FormError } from "@/components/ui/field";
import { Segmented } from "@/components/ui/segmented";
import { SubmitButton } from "@/components/ui/submit-button";
import { BottomAction } from "@/components/shell/bottom-action";

const responseSchema = z.object({
  preferences: z.object({ mass: z.enum(MASS_UNITS), length: z.enum(LENGTH_UNITS), saved: z.boolean() }),
});

export function UnitsForm({ initial }: { initial: PreferencesData }) {
  const router = useRouter();
  const [error, setError] = useState<string>();
  const save = useMutation({
    mutationFn: (data: PreferencesData) => apiFetch("/api/preferences", { method: "PUT", body: data, schema: responseSchema }),
    onSuccess: () => router.refresh(),
    onError: (e) => setError(e.message),
  });
  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    setError(undefined);
    const form = new FormData(event.currentTarget);
    save.mutate({ massUnit: form.get("massUnit") as PreferencesData["massUnit"], lengthUnit: form.get("lengthUnit") as PreferencesData["lengthUnit"] });
  };
  return (
    <form onSubmit={onSubmit} className="grid gap-6">
      <FormError message={error} />
      {save.isSuccess ? <Banner live title="Units saved" /> : null}
      <Segmented legend="Loads" name="massUnit" options={MASS_UNITS.map((u) => ({ value: u, label: u }))} initialValue={initial.massUnit} />
      <Segmented
        legend="Lengths (bar drift, depth, range of motion)"
        name="lengthUnit"
        options={[
          { value: "metric", label: "cm" },
          { value: "imperial", label: "in" },
        ]}
        initialValue={initial.lengthUnit}
      />
      <BottomAction>
        <SubmitButton size="lg" block className="sm:w-auto" pending={save.isPending}>
          Save units
        </SubmitButton>
      </BottomAction>
    </form>
  );
}
