// The review status machine: waiting -> in review (the coach opens or writes) -> answered (sent) -> seen (the athlete
// opened it). Writing again after sending reopens the review; the athlete sees the summary only once it is sent.
import type { ReviewCue, ReviewStatus } from "@/lib/validation/review";

/** How a viewer reads a set on the review page (lib/access.ts requireSetReader decides it). */
export type SetReaderRole = "athlete" | "coach" | "admin" | "teammate";

/** Coaches and admins write the summary, change the status and share the set; athletes and teammates comment. */
export function canEditReviewRole(role: SetReaderRole): boolean {
  return role === "coach" || role === "admin";
}

export type ReviewEvent = "open" | "draft" | "send" | "athlete_open";

export class ReviewTransitionError extends Error {
  constructor(
    readonly from: ReviewStatus,
    readonly event: ReviewEvent,
    message: string,
  ) {
    super(message);
    this.name = "ReviewTransitionError";
  }
}

/** The status after an event; throws ReviewTransitionError for a move the machine does not allow. */
export function reviewStatusAfter(current: ReviewStatus, event: ReviewEvent): ReviewStatus {
  switch (event) {
    case "open":
      return current === "waiting" ? "in_review" : current;
    case "draft":
      return "in_review";
    case "send":
      if (current === "answered" || current === "seen") {
        throw new ReviewTransitionError(current, event, "This review was already sent. Change the summary to send it again.");
      }
      return "answered";
    case "athlete_open":
      return current === "answered" ? "seen" : current;
  }
}

/** A review can be sent once it says something: a summary or at least one cue. */
export function canSendReview(draft: { summary: string; cues: readonly ReviewCue[] }): boolean {
  return draft.summary.trim().length > 0 || draft.cues.length > 0;
}

/** Athletes and teammates read the summary only after it was sent; coaches and admins read drafts too. */
export function summaryVisible(status: ReviewStatus, canEdit: boolean): boolean {
  return canEdit || status === "answered" || status === "seen";
}

export const REVIEW_STATUS_LABELS: Record<ReviewStatus, string> = {
  waiting: "Waiting",
  in_review: "In review",
  answered: "Answered",
  seen: "Seen",
};
