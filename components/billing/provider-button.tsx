"use client";
// Sends the athlete to the payment provider's hosted pages: checkout (pay the membership or a single review)
// or the customer portal (cancel, change card). The server makes the page and answers with its URL.
import { useState } from "react";
import { z } from "zod";
import { apiFetch, ApiError } from "@/lib/client/api";
import { Button, type ButtonVariant } from "@/components/ui/button";

const checkoutResponse = z.object({ checkout: z.object({ url: z.string() }) });
const portalResponse = z.object({ portal: z.object({ url: z.string() }) });

export function ProviderButton({
  teamId,
  action,
  label,
  variant = "primary",
}: {
  teamId: string;
  action: "membership" | "single_review" | "portal";
  label: string;
  variant?: ButtonVariant;
}) {
  const [pending, setPending] = useState(false);
  const [error, setError] = useState<string>();

  async function go() {
    setPending(true);
    setError(undefined);
    try {
      const url =
        action === "portal"
          ? (await apiFetch("/api/billing/portal", { method: "POST", body: { teamId }, schema: portalResponse })).portal.url
          : (await apiFetch("/api/billing/checkout", { method: "POST", body: { teamId, kind: action }, schema: checkoutResponse })).checkout.url;
      window.location.assign(url);
    } catch (failure) {
      setError(failure instanceof ApiError ? failure.message : "Could not reach the payment provider. Try again.");
      setPending(false);
    }
  }

  return (
    <div className="grid gap-2">
      <Button size="lg" variant={variant} block pending={pending} onClick={go}>
        {label}
      </Button>
      {error ? (
        <p role="alert" className="text-sm text-fault">
          {error}
        </p>
      ) : null}
    </div>
  );
}
