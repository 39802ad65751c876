// What a reader of a set's review receives: the status for everyone, the summary and cues for coaches and admins
// always and for the athlete and teammates only once sent, and whether the set is shared with its team.
import type { ReviewState, ShareState } from "@/db/queries/reviews";
import { canEditReviewRole, summaryVisible, type SetReaderRole } from "./status";

export interface ReviewView {
  status: ReviewState["status"];
  summary: string | null;
  cues: ReviewState["cues"] | null;
  answeredAt: Date | null;
  seenAt: Date | null;
  updatedAt: Date | null;
}

export interface ReviewPayload {
  review: ReviewView;
  share: ShareState | null;
  role: SetReaderRole;
  canEdit: boolean;
}

export function reviewPayload(review: ReviewState, share: ShareState | null, role: SetReaderRole): ReviewPayload {
  const canEdit = canEditReviewRole(role);
  const visible = summaryVisible(review.status, canEdit);
  return {
    review: {
      status: review.status,
      summary: visible ? review.summary : null,
      cues: visible ? review.cues : null,
      answeredAt: review.answeredAt,
      seenAt: review.seenAt,
      updatedAt: review.updatedAt,
    },
    share,
    role,
    canEdit,
  };
}
