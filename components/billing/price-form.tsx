"use client";
// The coach's prices for a team: a monthly membership and an optional single set review, typed as amounts
// ("49.00"); the server turns them into minor units and answers per field.
import { useRouter } from "next/navigation";
import { useState, type FormEvent } from "react";
import { z } from "zod";
import { apiFetch, ApiError } from "@/lib/client/api";
import { CURRENCIES } from "@/lib/billing/constants";
import { Field, FormError, Input, Select } from "@/components/ui/field";
import { Button } from "@/components/ui/button";

const pricesResponse = z.object({
  prices: z.object({
    membership: z.object({ amountMinor: z.number(), currency: z.string() }).nullable(),
    singleReview: z.object({ amountMinor: z.number(), currency: z.string() }).nullable(),
  }),
});

export interface PriceFormProps {
  teamId: string;
  currency: string;
  membership: string;
  singleReview: string;
}

export function PriceForm({ teamId, ...initial }: PriceFormProps) {
  const router = useRouter();
  const [values, setValues] = useState(initial);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [formError, setFormError] = useState<string>();
  const [saved, setSaved] = useState(false);
  const [pending, setPending] = useState(false);

  async function submit(event: FormEvent) {
    event.preventDefault();
    setPending(true);
    setErrors({});
    setFormError(undefined);
    setSaved(false);
    try {
      await apiFetch(`/api/teams/${teamId}/prices`, { method: "PUT", body: values, schema: pricesResponse });
      setSaved(true);
      router.refresh();
    } catch (error) {
      if (error instanceof ApiError && Object.keys(error.fields).length > 0) setErrors(error.fields);
      else setFormError(error instanceof Error ? error.message : "Could not save the prices.");
    } finally {
      setPending(false);
    }
  }

  const set = (name: keyof typeof values) => (event: { target: { value: string } }) => setValues({ ...values, [name]: event.target.value });

  return (
    <form onSubmit={submit} noValidate className="grid gap-4 sm:max-w-md">
      <FormError message={formError} />
      <Field label="Currency" error={errors.currency}>
        {(control) => <Select {...control} value={values.currency} onChange={set("currency")} options={CURRENCIES.map((c) => ({ value: c, label: c }))} />}
      </Field>
      <Field label="Monthly membership" error={errors.membership} hint="Per athlete, renewed each month. Empty: the team is free.">
        {(control) => <Input {...control} inputMode="decimal" value={values.membership} onChange={set("membership")} suffix={values.currency} placeholder="49.00" />}
      </Field>
      <Field label="Single set review" optional error={errors.singleReview} hint="A one-off payment for one review, for athletes without a membership.">
        {(control) => <Input {...control} inputMode="decimal" value={values.singleReview} onChange={set("singleReview")} suffix={values.currency} placeholder="15.00" />}
      </Field>
      <div className="flex items-center gap-3">
        <Button type="submit" pending={pending}>
          Save prices
        </Button>
        {saved ? (
          <p role="status" className="text-sm text-ink-muted">
            Prices saved.
          </p>
        ) : null}
      </div>
    </form>
  );
}
