// What each reader of a review receives: drafts only for coaches and admins, the sent answer for everyone.
import { describe, expect, it } from "vitest";
import { reviewPayload } from "@/lib/review/view";
import type { ReviewState } from "@/db/queries/reviews";

const draft: ReviewState = {
  setId: "00000000-0000-4000-8000-000000000001",
  status: "in_review",
  summary: "Brace earlier",
  cues: [{ change: "Breathe and brace before unracking", drill: "Tempo squats", priority: "medium" }],
  startedAt: new Date("2026-03-01T10:00:00Z"),
  answeredAt: null,
  seenAt: null,
  updatedAt: new Date("2026-03-01T10:05:00Z"),
};

describe("reviewPayload", () => {
  it("hides a draft from the athlete and teammates but not from the coach or an admin", () => {
    for (const role of ["athlete", "teammate"] as const) {
      expect(reviewPayload(draft, null, role)).toMatchObject({ canEdit: false, review: { status: "in_review", summary: null, cues: null } });
    }
    for (const role of ["coach", "admin"] as const) {
      expect(reviewPayload(draft, null, role)).toMatchObject({ canEdit: true, review: { summary: "Brace earlier", cues: draft.cues } });
    }
  });

  it("shows the sent answer to every reader", () => {
    const answered = { ...draft, status: "answered" as const, answeredAt: new Date("2026-03-01T11:00:00Z") };
    expect(reviewPayload(answered, null, "teammate").review).toMatchObject({ summary: "Brace earlier", cues: draft.cues });
    expect(reviewPayload({ ...answered, status: "seen" }, null, "athlete").review.summary).toBe("Brace earlier");
  });
});
