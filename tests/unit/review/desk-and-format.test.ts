// The desk's URL and keyboard moves, clip times as written in comments, and comment threads.
import { describe, expect, it } from "vitest";
import { deskHref, moveRow } from "@/lib/review/desk-params";
import { formatClipTime, repAt, threadsOf } from "@/lib/review/format";
import { deskQuerySchema } from "@/lib/validation/review";

describe("deskHref", () => {
  const none = deskQuerySchema.parse({});

  it("keeps defaults out of the URL and round-trips every filter through the query schema", () => {
    expect(deskHref(none)).toBe("/app/desk");
    const href = deskHref(none, { athlete: "user-1", lift: "bench", status: "in_review", sort: "flags" });
    expect(href).toBe("/app/desk?athlete=user-1&lift=bench&status=in_review&sort=flags");
    const parsed = deskQuerySchema.parse(Object.fromEntries(new URL(href, "http://x").searchParams));
    expect(parsed).toEqual({ athlete: "user-1", lift: "bench", status: "in_review", sort: "flags" });
    expect(deskHref(none, { status: "all" })).toBe("/app/desk?status=all");
  });

  it("clears one filter without touching the others", () => {
    const query = deskQuerySchema.parse({ lift: "squat", status: "waiting" });
    expect(deskHref(query, { status: "open" })).toBe("/app/desk?lift=squat");
  });

  it("falls back to no filter for values a hand-edited URL may carry", () => {
    expect(deskQuerySchema.parse({ lift: "curl", status: "done", sort: "random", athlete: "" })).toEqual({ status: "open", sort: "oldest" });
  });
});

describe("moveRow", () => {
  it("moves down with j or ArrowDown and up with k or ArrowUp, clamped at both ends", () => {
    expect(moveRow(-1, "j", 3)).toBe(0);
    expect(moveRow(0, "j", 3)).toBe(1);
    expect(moveRow(2, "ArrowDown", 3)).toBe(2);
    expect(moveRow(1, "k", 3)).toBe(0);
    expect(moveRow(0, "ArrowUp", 3)).toBe(0);
    expect(moveRow(1, "End", 3)).toBe(2);
    expect(moveRow(2, "Home", 3)).toBe(0);
  });

  it("ignores other keys and empty tables", () => {
    expect(moveRow(0, "x", 3)).toBeNull();
    expect(moveRow(-1, "j", 0)).toBeNull();
  });
});

describe("formatClipTime", () => {
  it("writes minutes, seconds and hundredths", () => {
    expect(formatClipTime(0)).toBe("0:00.00");
    expect(formatClipTime(2.25)).toBe("0:02.25");
    expect(formatClipTime(65.005)).toBe("1:05.01");
    expect(formatClipTime(59.999)).toBe("1:00.00");
  });
});

describe("threadsOf and repAt", () => {
  it("orders threads by their moment and keeps replies under their thread in order", () => {
    const c = (id: string, parentId: string | null, timeS: number, createdAt: string) => ({ id, parentId, timeS, createdAt });
    const threads = threadsOf([
      c("a", null, 5, "2026-01-01T00:00:00Z"),
      c("b", null, 1, "2026-01-01T00:01:00Z"),
      c("r1", "a", 5, "2026-01-01T00:02:00Z"),
      c("r2", "a", 5, "2026-01-01T00:03:00Z"),
    ]);
    expect(threads.map((t) => [t.root.id, t.replies.map((r) => r.id)])).toEqual([
      ["b", []],
      ["a", ["r1", "r2"]],
    ]);
  });

  it("finds the rep whose span holds a time", () => {
    const reps = [
      { repIndex: 1, startS: 0.5, endS: 2 },
      { repIndex: 2, startS: 2.4, endS: 4 },
    ];
    expect(repAt(reps, 1)).toBe(1);
    expect(repAt(reps, 2.2)).toBeNull();
    expect(repAt(reps, 4)).toBe(2);
  });
});
