"use client";
// Profile form: body mass, height, unit and known one-rep maxes. Shows values in the chosen unit, sends SI.
import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useMemo, useState } from "react";
import { useForm } from "react-hook-form";
import { apiFetch, applyApiError } from "@/lib/client/api";
import {
  PROFILE_NUMBER_FIELDS,
  convertFormValues,
  formValuesFromStored,
  profileFormSchema,
  storedValues,
  type ProfileFormValues,
} from "@/lib/client/profile-form";
import { profileResponseSchema } from "@/lib/client/responses";
import { heightUnit } from "@/lib/client/units";
import type { UnitPreference } from "@/lib/validation/common";
import type { Profile, ProfileData } from "@/lib/validation/profile";
import { Banner } from "@/components/ui/banner";
import { SubmitButton } from "@/components/ui/submit-button";
import { FormError, TextField } from "@/components/ui/field";
import { Segmented } from "@/components/ui/segmented";
import { BottomAction } from "@/components/shell/bottom-action";

const LIFT_LABELS = { squat: "Squat", bench: "Bench press", deadlift: "Deadlift" } as const;

export function ProfileForm({ profile, afterSave }: { profile: Profile | null; afterSave?: string }) {
  const router = useRouter();
  const queryClient = useQueryClient();
  const [formError, setFormError] = useState<string>();
  const stored = useMemo(() => storedValues(profile), [profile]);
  const schema = useMemo(() => profileFormSchema(stored), [stored]);
  const defaults = useMemo(() => formValuesFromStored(stored, profile?.unitPreference ?? "kg"), [stored, profile]);
  const form = useForm<ProfileFormValues, unknown, ProfileData>({ resolver: zodResolver(schema), defaultValues: defaults });
  const { errors } = form.formState;
  const unit = form.watch("unitPreference");

  const save = useMutation({
    mutationFn: (data: ProfileData) => apiFetch("/api/profile", { method: "PUT", body: data, schema: profileResponseSchema }),
    onSuccess: (result) => {
      queryClient.setQueryData(["profile"], result);
      if (afterSave) router.push(afterSave);
      router.refresh();
    },
    onError: (error) =>
      applyApiError(error, form.setError, PROFILE_NUMBER_FIELDS, (message) => setFormError(message)),
  });

  const unitField = form.register("unitPreference", {
    onChange: (event: { target: { value: UnitPreference } }) => {
      const converted = convertFormValues({ ...form.getValues(), unitPreference: unit }, event.target.value);
      for (const field of PROFILE_NUMBER_FIELDS) form.setValue(field, converted[field]);
      form.clearErrors();
    },
  });

  const onSubmit = form.handleSubmit((data) => {
    setFormError(undefined);
    save.mutate(data);
  });

  return (
    <form onSubmit={onSubmit} noValidate className="grid gap-6">
      <FormError message={formError} />
      {save.isSuccess && !afterSave ? <Banner live title="Profile saved" /> : null}
      <Segmented
        legend="Units"
        options={[
          { value: "kg", label: "kg" },
          { value: "lb", label: "lb" },
        ]}
        initialValue={defaults.unitPreference}
        {...unitField}
      />
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField
          label="Body mass"
          inputMode="decimal"
          suffix={unit}
          optional
          error={errors.bodyMass?.message}
          defaultValue={defaults.bodyMass}
          {...form.register("bodyMass")}
        />
        <TextField
          label="Height"
          inputMode="decimal"
          suffix={heightUnit(unit)}
          optional
          error={errors.height?.message}
          defaultValue={defaults.height}
          {...form.register("height")}
        />
      </div>
      <fieldset className="grid gap-4" aria-describedby="one-rep-max-hint">
        <legend className="text-sm font-semibold">Known one-rep maxes</legend>
        <p id="one-rep-max-hint" className="mt-1 text-sm text-ink-muted">
          Used to warn when a filmed set is far from a working load. Leave blank if you do not know.
        </p>
        <div className="grid gap-4 sm:grid-cols-3">
          {(Object.keys(LIFT_LABELS) as (keyof typeof LIFT_LABELS)[]).map((lift) => (
            <TextField
              key={lift}
              label={LIFT_LABELS[lift]}
              inputMode="decimal"
              suffix={unit}
              optional
              error={errors[lift]?.message}
              defaultValue={defaults[lift]}
              {...form.register(lift)}
            />
          ))}
        </div>
      </fieldset>
      <BottomAction>
        <SubmitButton size="lg" block className="sm:w-auto" pending={save.isPending}>
          Save profile
        </SubmitButton>
      </BottomAction>
    </form>
  );
}
