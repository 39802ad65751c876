"use client";
// The coach waives an athlete's fee (comp) or stops waiving it.
import { useRouter } from "next/navigation";
import { useState } from "react";
import { apiFetch, ApiError } from "@/lib/client/api";
import { Button } from "@/components/ui/button";

export function CompToggle({ teamId, athleteId, athleteName, comped }: { teamId: string; athleteId: string; athleteName: string; comped: boolean }) {
  const router = useRouter();
  const [pending, setPending] = useState(false);
  const [error, setError] = useState<string>();

  async function toggle() {
    setPending(true);
    setError(undefined);
    try {
      await apiFetch(`/api/teams/${teamId}/members/${encodeURIComponent(athleteId)}/comp`, { method: "PUT", body: { comped: !comped } });
      router.refresh();
    } catch (failure) {
      setError(failure instanceof ApiError ? failure.message : "Could not change it. Try again.");
    } finally {
      setPending(false);
    }
  }

  return (
    <div className="flex items-center gap-2">
      <Button size="sm" variant={comped ? "secondary" : "quiet"} pending={pending} onClick={toggle} aria-label={`${comped ? "Stop comping" : "Comp"} ${athleteName}`}>
        {comped ? "Stop comp" : "Comp"}
      </Button>
      {error ? (
        <span role="alert" className="text-xs text-fault">
          {error}
        </span>
      ) : null}
    </div>
  );
}
