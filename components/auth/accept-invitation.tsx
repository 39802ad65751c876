"use client";
// Accepts an invitation for the signed-in person, then continues to the profile (first time) or home.
import { useRouter } from "next/navigation";
import { useState } from "react";
import { apiFetch, ApiError } from "@/lib/client/api";
import { acceptedSchema } from "@/lib/client/responses";
import { Banner } from "@/components/ui/banner";
import { Button } from "@/components/ui/button";

export function AcceptInvitation({ token, teamName, next }: { token: string; teamName: string; next: string }) {
  const router = useRouter();
  const [pending, setPending] = useState(false);
  const [error, setError] = useState<string>();

  async function accept() {
    setPending(true);
    setError(undefined);
    try {
      await apiFetch(`/api/invitations/${encodeURIComponent(token)}/accept`, { method: "POST", schema: acceptedSchema });
      router.push(next);
      router.refresh();
    } catch (failure) {
      setError(failure instanceof ApiError ? failure.message : "Could not accept the invitation. Try again.");
      setPending(false);
    }
  }

  return (
    <div className="grid gap-3">
      {error ? (
        <Banner live tone="fault">
          {error}
        </Banner>
      ) : null}
      <Button size="lg" block pending={pending} onClick={accept}>
        Join {teamName}
      </Button>
    </div>
  );
}
