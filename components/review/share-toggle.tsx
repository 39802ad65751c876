"use client";
// Peer review: the coach shares the set with its team (teammates may then read the review and comment) or
// withdraws it. Everyone on the review page sees when a set is shared, and by whom.
import { useState } from "react";
import { apiFetch, ApiError } from "@/lib/client/api";
import { shareResponseSchema, type ShareView } from "@/lib/review/responses";
import { formatDay } from "@/components/ui/date-text";
import { Button } from "@/components/ui/button";
import { FormError } from "@/components/ui/field";
import { SharedBadge } from "./status-badge";

export function ShareToggle({
  setId,
  share,
  canEdit,
  onChange,
}: {
  setId: string;
  share: ShareView;
  canEdit: boolean;
  onChange: (share: ShareView) => void;
}) {
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string>();

  async function toggle() {
    setBusy(true);
    setError(undefined);
    try {
      const { share: next } = await apiFetch(`/api/sets/${setId}/share`, { method: "PUT", body: { shared: !share }, schema: shareResponseSchema });
      onChange(next);
    } catch (e) {
      setError(e instanceof ApiError ? e.message : "Something went wrong. Please try again.");
    } finally {
      setBusy(false);
    }
  }

  if (!canEdit && !share) return null;
  return (
    <div className="grid gap-2 rounded border border-line bg-surface p-3 text-sm" data-testid="share">
      {share ? (
        <div className="flex flex-wrap items-center gap-2">
          <SharedBadge />
          <span className="text-ink-muted">
            {share.sharedByName ? `by ${share.sharedByName}, ` : ""}since {formatDay(share.sharedAt)}. Teammates can read this review and comment.
          </span>
        </div>
      ) : (
        <p className="text-ink-muted">Only the athlete and their coaches see this review.</p>
      )}
      {canEdit ? (
        <Button type="button" size="sm" variant={share ? "secondary" : "quiet"} className="justify-self-start" disabled={busy} onClick={() => void toggle()}>
          {share ? "Stop sharing" : "Share with team"}
        </Button>
      ) : null}
      <FormError message={error} />
    </div>
  );
}
