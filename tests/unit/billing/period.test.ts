// Billing periods and what a membership allows: month arithmetic, the provider's statuses, and the rule that
// uploads run to the end of what was paid, never past it.
import { describe, expect, it } from "vitest";
import { addMonthsUtc, membershipView, statusFromSubscription, type MembershipFacts } from "@/lib/billing/period";

const d = (iso: string) => new Date(iso);

describe("addMonthsUtc", () => {
  it("keeps the day of the month, or takes the month's last day (Stripe docs, billing cycle anchors)", () => {
    expect(addMonthsUtc(d("2026-01-15T10:00:00Z"), 1)).toEqual(d("2026-02-15T10:00:00Z"));
    expect(addMonthsUtc(d("2026-01-31T10:00:00Z"), 1)).toEqual(d("2026-02-28T10:00:00Z"));
    // 2028 is a leap year (Gregorian calendar rule).
    expect(addMonthsUtc(d("2028-01-31T00:00:00Z"), 1)).toEqual(d("2028-02-29T00:00:00Z"));
    expect(addMonthsUtc(d("2026-12-31T23:59:59Z"), 1)).toEqual(d("2027-01-31T23:59:59Z"));
    expect(addMonthsUtc(d("2026-03-31T00:00:00Z"), 12)).toEqual(d("2027-03-31T00:00:00Z"));
  });
});

describe("statusFromSubscription", () => {
  it("maps the provider's statuses to ours", () => {
    expect(statusFromSubscription("active", false)).toBe("active");
    expect(statusFromSubscription("active", true)).toBe("lapsing");
    expect(statusFromSubscription("trialing", false)).toBe("active");
    expect(statusFromSubscription("past_due", false)).toBe("past_due");
    expect(statusFromSubscription("unpaid", false)).toBe("past_due");
    expect(statusFromSubscription("incomplete", false)).toBe("none");
    expect(statusFromSubscription("canceled", false)).toBe("lapsed");
    expect(statusFromSubscription("incomplete_expired", false)).toBe("lapsed");
  });
});

describe("membershipView", () => {
  const now = d("2026-03-10T12:00:00Z");
  const facts = (over: Partial<MembershipFacts>): MembershipFacts => ({
    status: "active",
    paidThrough: d("2026-04-01T00:00:00Z"),
    currentPeriodEnd: d("2026-04-01T00:00:00Z"),
    cancelAtPeriodEnd: false,
    ...over,
  });

  it("no membership means no uploads on a priced team", () => {
    expect(membershipView(null, now)).toMatchObject({ status: "none", uploadsAllowed: false });
    expect(membershipView(facts({ status: "none", paidThrough: null }), now)).toMatchObject({ status: "none", uploadsAllowed: false });
  });

  it("an active membership renews on its period end", () => {
    expect(membershipView(facts({}), now)).toMatchObject({ status: "active", uploadsAllowed: true, renewsOn: d("2026-04-01T00:00:00Z"), endsOn: null });
  });

  it("a cancelled or failed renewal runs to the end of the paid period, then lapses", () => {
    const cancelled = facts({ status: "lapsing", cancelAtPeriodEnd: true });
    expect(membershipView(cancelled, now)).toMatchObject({ status: "lapsing", uploadsAllowed: true, renewsOn: null, endsOn: d("2026-04-01T00:00:00Z") });
    const failed = facts({ status: "past_due", currentPeriodEnd: d("2026-05-01T00:00:00Z") });
    expect(membershipView(failed, now)).toMatchObject({ status: "past_due", uploadsAllowed: true, endsOn: d("2026-04-01T00:00:00Z") });
    const atEnd = d("2026-04-01T00:00:00Z");
    expect(membershipView(failed, atEnd)).toMatchObject({ status: "lapsed", uploadsAllowed: false });
    expect(membershipView(cancelled, new Date(atEnd.getTime() + 1))).toMatchObject({ status: "lapsed", uploadsAllowed: false });
  });

  it("a membership whose paid period is over is lapsed whatever the last status said", () => {
    expect(membershipView(facts({ paidThrough: d("2026-03-01T00:00:00Z") }), now)).toMatchObject({ status: "lapsed", uploadsAllowed: false });
  });

  it("a cancelled subscription still inside its paid period keeps uploads until then", () => {
    expect(membershipView(facts({ status: "lapsed" }), now)).toMatchObject({ status: "lapsing", uploadsAllowed: true, endsOn: d("2026-04-01T00:00:00Z") });
  });

  it("comped allows uploads with nothing paid", () => {
    expect(membershipView(facts({ status: "comped", paidThrough: null }), now)).toMatchObject({ status: "comped", uploadsAllowed: true });
  });
});
