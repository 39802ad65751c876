// The review status machine, the send rule and who reads the summary.
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { canEditReviewRole, canSendReview, reviewStatusAfter, ReviewTransitionError, summaryVisible, type ReviewEvent } from "@/lib/review/status";
import { REVIEW_STATUSES, type ReviewStatus } from "@/lib/validation/review";

const EVENTS: ReviewEvent[] = ["open", "draft", "send", "athlete_open"];

describe("reviewStatusAfter", () => {
  it("walks the happy path waiting -> in review -> answered -> seen", () => {
    let status: ReviewStatus = "waiting";
    status = reviewStatusAfter(status, "open");
    expect(status).toBe("in_review");
    status = reviewStatusAfter(status, "draft");
    expect(status).toBe("in_review");
    status = reviewStatusAfter(status, "send");
    expect(status).toBe("answered");
    status = reviewStatusAfter(status, "athlete_open");
    expect(status).toBe("seen");
  });

  it("leaves an answered or seen review alone when the coach only opens it", () => {
    expect(reviewStatusAfter("answered", "open")).toBe("answered");
    expect(reviewStatusAfter("seen", "open")).toBe("seen");
    expect(reviewStatusAfter("in_review", "open")).toBe("in_review");
  });

  it("marks seen only an answered review", () => {
    expect(reviewStatusAfter("waiting", "athlete_open")).toBe("waiting");
    expect(reviewStatusAfter("in_review", "athlete_open")).toBe("in_review");
    expect(reviewStatusAfter("seen", "athlete_open")).toBe("seen");
  });

  it("refuses to send twice, and reopens a sent review when the coach writes again", () => {
    expect(() => reviewStatusAfter("answered", "send")).toThrow(ReviewTransitionError);
    expect(() => reviewStatusAfter("seen", "send")).toThrow(ReviewTransitionError);
    expect(reviewStatusAfter("seen", "draft")).toBe("in_review");
    expect(reviewStatusAfter("waiting", "send")).toBe("answered");
  });

  it("never goes back to waiting and reaches seen only from answered", () => {
    fc.assert(
      fc.property(fc.constantFrom(...REVIEW_STATUSES), fc.constantFrom(...EVENTS), (from, event) => {
        let to: ReviewStatus;
        try {
          to = reviewStatusAfter(from, event);
        } catch (error) {
          expect(error).toBeInstanceOf(ReviewTransitionError);
          expect(event).toBe("send");
          return;
        }
        if (from !== "waiting") expect(to).not.toBe("waiting");
        if (to === "seen" && from !== "seen") expect(from).toBe("answered");
      }),
    );
  });
});

describe("canSendReview", () => {
  it("needs a summary with text or at least one cue", () => {
    expect(canSendReview({ summary: "  \n", cues: [] })).toBe(false);
    expect(canSendReview({ summary: "Good depth", cues: [] })).toBe(true);
    expect(canSendReview({ summary: "", cues: [{ change: "Brace", drill: "", priority: "high" }] })).toBe(true);
  });
});

describe("summaryVisible and canEditReviewRole", () => {
  it("shows drafts to editors only and the sent answer to everyone who reads the set", () => {
    expect(summaryVisible("in_review", false)).toBe(false);
    expect(summaryVisible("waiting", false)).toBe(false);
    expect(summaryVisible("answered", false)).toBe(true);
    expect(summaryVisible("seen", false)).toBe(true);
    expect(summaryVisible("in_review", true)).toBe(true);
  });

  it("lets coaches and admins edit, never athletes or teammates", () => {
    expect(["athlete", "coach", "admin", "teammate"].map((r) => canEditReviewRole(r as never))).toEqual([false, true, true, false]);
  });
});
