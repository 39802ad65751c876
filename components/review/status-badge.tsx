// The review status as a badge (text first, colour as a second cue), and the badge that says a set is shared.
import { Badge, type BadgeTone } from "@/components/ui/badge";
import { REVIEW_STATUS_LABELS } from "@/lib/review/status";
import type { ReviewStatus } from "@/lib/validation/review";

const TONES: Record<ReviewStatus, BadgeTone> = { waiting: "caution", in_review: "action", answered: "neutral", seen: "neutral" };

export function ReviewStatusBadge({ status }: { status: ReviewStatus }) {
  return (
    <span data-testid="review-status" data-status={status}>
      <Badge tone={TONES[status]}>{REVIEW_STATUS_LABELS[status]}</Badge>
    </span>
  );
}

export function SharedBadge() {
  return (
    <span data-testid="shared-badge">
      <Badge tone="action">Shared with team</Badge>
    </span>
  );
}
