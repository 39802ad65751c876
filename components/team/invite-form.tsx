"use client";
// Invite form: one or many addresses pasted at once; says who was invited and who was skipped and why.
import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { applyApiError } from "@/lib/client/api";
import { inviteFormSchema, type InviteFormValues } from "@/lib/client/invite-form";
import type { InviteResult } from "@/lib/client/responses";
import { INVITATION_TTL_DAYS, MAX_INVITATIONS_PER_REQUEST, type InviteInput } from "@/lib/validation/invitation";
import { Banner } from "@/components/ui/banner";
import { SubmitButton } from "@/components/ui/submit-button";
import { Field, FormError, Textarea } from "@/components/ui/field";
import type { RosterActions } from "./use-roster";

export function InviteForm({ invite }: { invite: RosterActions["invite"] }) {
  const [formError, setFormError] = useState<string>();
  const [result, setResult] = useState<InviteResult>();
  const form = useForm<InviteFormValues, unknown, InviteInput>({
    resolver: zodResolver(inviteFormSchema),
    defaultValues: { emails: "" },
  });
  const { errors } = form.formState;

  const onSubmit = form.handleSubmit(async (input) => {
    setFormError(undefined);
    setResult(undefined);
    try {
      setResult(await invite.mutateAsync(input));
      form.reset();
    } catch (error) {
      applyApiError(error, form.setError, ["emails"], setFormError);
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="grid gap-4">
      <FormError message={formError} />
      <Field
        label="E-mail addresses"
        error={errors.emails?.message}
        hint={`One or many, separated by commas, spaces or new lines (up to ${MAX_INVITATIONS_PER_REQUEST}). Links expire after ${INVITATION_TTL_DAYS} days.`}
      >
        {(control) => (
          <Textarea rows={4} placeholder="athlete@example.com" spellCheck={false} {...control} {...form.register("emails")} />
        )}
      </Field>
      <SubmitButton pending={invite.isPending}>
        Send invitations
      </SubmitButton>
      {result ? <InviteOutcome result={result} /> : null}
    </form>
  );
}

function InviteOutcome({ result }: { result: InviteResult }) {
  const count = result.invited.length;
  return (
    <div className="grid gap-2">
      {count > 0 ? (
        <Banner live title={count === 1 ? `Invitation sent to ${result.invited[0].email}` : `${count} invitations sent`} />
      ) : null}
      {result.skipped.length > 0 ? (
        <Banner live tone="caution" title={`${result.skipped.length} skipped`}>
          <ul className="grid gap-0.5">
            {result.skipped.map((skip) => (
              <li key={skip.email}>
                <span className="font-medium text-ink">{skip.email}</span>: {skip.message ?? skip.reason}
              </li>
            ))}
          </ul>
        </Banner>
      ) : null}
    </div>
  );
}
