"use client";
// Names a new team; the person who creates it becomes its coach.
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { apiFetch, applyApiError } from "@/lib/client/api";
import { teamCreatedSchema } from "@/lib/client/responses";
import { createTeamSchema, type CreateTeamInput } from "@/lib/validation/team";
import { SubmitButton } from "@/components/ui/submit-button";
import { FormError, TextField } from "@/components/ui/field";

export function NewTeamForm() {
  const router = useRouter();
  const [formError, setFormError] = useState<string>();
  const form = useForm<CreateTeamInput>({ resolver: zodResolver(createTeamSchema), defaultValues: { name: "" } });
  const { errors, isSubmitting } = form.formState;

  const onSubmit = form.handleSubmit(async (values) => {
    setFormError(undefined);
    try {
      const { team } = await apiFetch("/api/teams", { method: "POST", body: values, schema: teamCreatedSchema });
      router.push(`/app/roster?team=${team.id}`);
      router.refresh();
    } catch (error) {
      applyApiError(error, form.setError, ["name"], setFormError);
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="grid gap-4">
      <FormError message={formError} />
      <TextField
        label="Team name"
        autoComplete="organization"
        hint="Your gym, club or coaching business, as your athletes know it."
        error={errors.name?.message}
        {...form.register("name")}
      />
      <SubmitButton size="lg" block className="sm:w-auto" pending={isSubmitting}>
        Create the team
      </SubmitButton>
    </form>
  );
}
