// The invite form's schema: a pasted list becomes the API's `{ emails }`, with bad addresses named.
import { describe, expect, it } from "vitest";
import { inviteFormSchema } from "@/lib/client/invite-form";
import { safeNextPath } from "@/lib/next-path";

describe("inviteFormSchema", () => {
  it("splits on commas, spaces and new lines, lower-cases and drops repeats", () => {
    const result = inviteFormSchema.safeParse({ emails: "A@Example.com, b@example.com\n a@example.com;c@example.com" });
    expect(result.data).toEqual({ emails: ["a@example.com", "b@example.com", "c@example.com"] });
  });

  it("names the addresses that are not valid", () => {
    const result = inviteFormSchema.safeParse({ emails: "ok@example.com, nope, also@bad" });
    expect(result.error?.issues[0]?.message).toBe("Not a valid address: nope, also@bad.");
  });

  it("asks for at least one address and at most fifty", () => {
    expect(inviteFormSchema.safeParse({ emails: "  " }).error?.issues[0]?.message).toBe("Enter at least one e-mail address.");
    const many = Array.from({ length: 51 }, (_, i) => `a${i}@example.com`).join(" ");
    expect(inviteFormSchema.safeParse({ emails: many }).error?.issues[0]?.message).toBe("Invite at most 50 addresses at once.");
  });
});

describe("safeNextPath", () => {
  it("keeps paths on this site and refuses other origins", () => {
    expect(safeNextPath("/invite/abc?x=1")).toBe("/invite/abc?x=1");
    expect(safeNextPath("//evil.example/")).toBe("/app");
    expect(safeNextPath("/\\evil.example")).toBe("/app");
    expect(safeNextPath("https://evil.example/")).toBe("/app");
    expect(safeNextPath(["/a", "/b"])).toBe("/app");
  });
});
