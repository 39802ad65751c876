// Invitations end to end: invite (mail with link), look up the link, accept with new and existing accounts,
// expiry, reuse, revoke, resend (with its rate limit), validation errors and who may do each.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import type { MailFake } from "@/dev/fakes/mail-fake";
import { closeDb, db } from "@/db";
import { invitations } from "@/db/schema";
import * as invite from "@/app/api/teams/[teamId]/invitations/route";
import * as revoke from "@/app/api/teams/[teamId]/invitations/[invitationId]/route";
import * as resend from "@/app/api/teams/[teamId]/invitations/[invitationId]/resend/route";
import * as lookup from "@/app/api/invitations/[token]/route";
import * as accept from "@/app/api/invitations/[token]/accept/route";
import * as me from "@/app/api/me/route";
import * as roster from "@/app/api/teams/[teamId]/roster/route";
import { buildWorld, call, json, linkIn, mailTo, signUp, startTestMail, uniqueEmail, type World } from "./helpers";

let mail: MailFake;
let world: World;

beforeAll(async () => {
  mail = await startTestMail();
  world = await buildWorld("inv");
});

afterAll(async () => {
  await mail.stop();
  await closeDb();
});

interface InviteBody {
  invited: { id: string; email: string; expiresAt: string }[];
  skipped: { email: string; reason: string; message: string }[];
}
interface ErrorBody {
  error: { code: string; message: string; fields?: Record<string, string> };
}

function inviteAs(cookie: string | undefined, emails: unknown, teamId = world.teamA.id) {
  return call(invite.POST, "", { method: "POST", cookie, params: { teamId }, body: { emails } });
}

/** The token from the newest invitation mail to `email`. */
function tokenMailedTo(email: string): string {
  const messages = mailTo(mail, email);
  const link = linkIn(messages[messages.length - 1]);
  const match = /\/invite\/([A-Za-z0-9_-]+)$/.exec(link);
  if (!match) throw new Error(`not an invitation link: ${link}`);
  return match[1];
}

const describeToken = (token: string) => call(lookup.GET, "", { params: { token } });
const acceptAs = (token: string, cookie?: string) => call(accept.POST, "", { method: "POST", cookie, params: { token } });
const resendAs = (invitationId: string, cookie?: string, teamId = world.teamA.id) =>
  call(resend.POST, "", { method: "POST", cookie, params: { teamId, invitationId } });
const revokeAs = (invitationId: string, cookie?: string, teamId = world.teamA.id) =>
  call(revoke.DELETE, "", { method: "DELETE", cookie, params: { teamId, invitationId } });

/** Moves an invitation's clock: expiry and last send into the past. */
async function age(invitationId: string, values: { expiresAt?: Date; lastSentAt?: Date }) {
  await db.update(invitations).set(values).where(eq(invitations.id, invitationId));
}

describe("POST /api/teams/[teamId]/invitations", () => {
  it("invites several addresses, mails each one a link to /invite/<token>, and stores only a hash", async () => {
    const first = uniqueEmail("inv-first");
    const second = uniqueEmail("inv-second");
    const response = await inviteAs(world.coachA.cookie, [first, ` ${second.toUpperCase()} `]);
    expect(response.status).toBe(201);
    const body = await json<InviteBody>(response);
    expect(body.invited.map((i) => i.email)).toEqual([first, second]);
    expect(body.skipped).toEqual([]);
    const expiresInDays = (Date.parse(body.invited[0].expiresAt) - Date.now()) / 86_400_000;
    expect(expiresInDays).toBeGreaterThan(6.99);
    expect(expiresInDays).toBeLessThanOrEqual(7);

    const [message] = mailTo(mail, first);
    expect(message.subject).toBe(`${world.coachA.name} invited you to ${world.teamA.name} on Plumbline`);
    expect(message.text).toContain("http://127.0.0.1:3000/invite/");
    expect(message.html).toContain("/invite/");
    const token = tokenMailedTo(first);
    expect(token).toHaveLength(43);
    const [row] = await db.select().from(invitations).where(eq(invitations.id, body.invited[0].id));
    expect(row.tokenHash).not.toContain(token);
    expect(row.tokenHash).toMatch(/^[0-9a-f]{64}$/);
  });

  it("skips duplicates in the list, addresses with a pending invitation and athletes already on the team", async () => {
    const fresh = uniqueEmail("inv-dup");
    await inviteAs(world.coachA.cookie, [fresh]);
    const response = await inviteAs(world.coachA.cookie, [fresh, world.athleteA1.email, "again@test.example", "again@test.example"]);
    const body = await json<InviteBody>(response);
    expect(body.invited.map((i) => i.email)).toEqual(["again@test.example"]);
    expect(body.skipped.map(({ email, reason }) => ({ email, reason }))).toEqual([
      { email: "again@test.example", reason: "duplicate" },
      { email: fresh, reason: "already_invited" },
      { email: world.athleteA1.email, reason: "already_member" },
    ]);
    expect(body.skipped.every((s) => s.message.length > 0)).toBe(true);
  });

  it("renews an expired invitation to the same address instead of refusing it", async () => {
    const email = uniqueEmail("inv-renew");
    const first = await json<InviteBody>(await inviteAs(world.coachA.cookie, [email]));
    const oldToken = tokenMailedTo(email);
    await age(first.invited[0].id, { expiresAt: new Date(Date.now() - 1000) });
    const second = await json<InviteBody>(await inviteAs(world.coachA.cookie, [email]));
    expect(second.invited.map((i) => i.id)).toEqual([first.invited[0].id]);
    expect((await describeToken(oldToken)).status).toBe(404);
    expect((await json<{ status: string }>(await describeToken(tokenMailedTo(email)))).status).toBe("valid");
  });

  it("gives 400 with field messages for bad addresses, an empty list and more than 50", async () => {
    const bad = await inviteAs(world.coachA.cookie, ["fine@test.example", "not-an-address"]);
    expect(bad.status).toBe(400);
    const body = await json<ErrorBody>(bad);
    expect(body.error.code).toBe("bad_request:invitation");
    expect(body.error.fields).toEqual({ "emails.1": "Enter a valid e-mail address." });

    const empty = await json<ErrorBody>(await inviteAs(world.coachA.cookie, []));
    expect(empty.error.fields).toEqual({ emails: "Enter at least one e-mail address." });

    const many = Array.from({ length: 51 }, (_, i) => `bulk${i}@test.example`);
    const tooMany = await inviteAs(world.coachA.cookie, many);
    expect(tooMany.status).toBe(400);
    expect((await json<ErrorBody>(tooMany)).error.fields).toEqual({ emails: "Invite at most 50 addresses at once." });

    const notAList = await inviteAs(world.coachA.cookie, "one@test.example");
    expect(notAList.status).toBe(400);
  });

  it("accepts exactly 50 addresses", async () => {
    const fifty = Array.from({ length: 50 }, (_, i) => uniqueEmail(`inv-bulk${i}`));
    const body = await json<InviteBody>(await inviteAs(world.coachA.cookie, fifty));
    expect(body.invited).toHaveLength(50);
  });

  it("refuses athletes, another team's coach and outsiders (403), and signed-out callers (401)", async () => {
    for (const person of [world.athleteA1, world.coachB, world.outsider]) {
      const response = await inviteAs(person.cookie, ["someone@test.example"]);
      expect(response.status).toBe(403);
    }
    expect((await inviteAs(undefined, ["someone@test.example"])).status).toBe(401);
  });

  it("lets an admin invite to any team", async () => {
    const response = await inviteAs(world.admin.cookie, [uniqueEmail("inv-admin")], world.teamB.id);
    expect(response.status).toBe(201);
  });
});

describe("GET /api/invitations/[token] and accepting", () => {
  it("a person who signs up from the link joins the team; the link is then used up", async () => {
    const email = uniqueEmail("inv-newcomer");
    await inviteAs(world.coachA.cookie, [email]);
    const token = tokenMailedTo(email);
    const looked = await describeToken(token);
    expect(looked.status).toBe(200);
    expect(await json(looked)).toEqual({ teamName: world.teamA.name, email, status: "valid" });

    expect((await acceptAs(token)).status).toBe(401);

    const newcomer = await signUp("inv-newcomer-account");
    const accepted = await acceptAs(token, newcomer.cookie);
    expect(accepted.status).toBe(200);
    expect(await json(accepted)).toEqual({ membership: { teamId: world.teamA.id, teamName: world.teamA.name, role: "athlete" } });
    const body = await json<{ memberships: unknown[] }>(await call(me.GET, "/api/me", { cookie: newcomer.cookie }));
    expect(body.memberships).toEqual([{ teamId: world.teamA.id, teamName: world.teamA.name, role: "athlete" }]);

    expect((await json<{ status: string }>(await describeToken(token))).status).toBe("used");
    const again = await acceptAs(token, world.outsider.cookie);
    expect(again.status).toBe(410);
    expect(await json(again)).toEqual({ error: { code: "gone:invitation", message: "This invitation has already been used." } });

    const rosterBody = await json<{ invitations: { email: string; status: string }[] }>(
      await call(roster.GET, "", { cookie: world.coachA.cookie, params: { teamId: world.teamA.id } }),
    );
    expect(rosterBody.invitations.find((i) => i.email === email)?.status).toBe("accepted");
  });

  it("an existing account on another team can accept and then belongs to both", async () => {
    const email = uniqueEmail("inv-existing");
    await inviteAs(world.coachA.cookie, [email]);
    const accepted = await acceptAs(tokenMailedTo(email), world.athleteB1.cookie);
    expect(accepted.status).toBe(200);
    const body = await json<{ memberships: { teamId: string }[] }>(await call(me.GET, "/api/me", { cookie: world.athleteB1.cookie }));
    expect(body.memberships.map((m) => m.teamId).sort()).toEqual([world.teamA.id, world.teamB.id].sort());
  });

  it("an expired link is reported as expired and refused with 410", async () => {
    const email = uniqueEmail("inv-expired");
    const { invited } = await json<InviteBody>(await inviteAs(world.coachA.cookie, [email]));
    await age(invited[0].id, { expiresAt: new Date(Date.now() - 1000) });
    const token = tokenMailedTo(email);
    expect((await json<{ status: string }>(await describeToken(token))).status).toBe("expired");
    const refused = await acceptAs(token, world.outsider.cookie);
    expect(refused.status).toBe(410);
    expect((await json<ErrorBody>(refused)).error.message).toBe("This invitation has expired. Ask your coach to send a new one.");
  });

  it("unknown and malformed tokens are 404", async () => {
    const unknown = "A".repeat(43);
    expect((await describeToken(unknown)).status).toBe(404);
    expect((await acceptAs(unknown, world.outsider.cookie)).status).toBe(404);
    expect((await describeToken("short")).status).toBe(404);
    expect((await acceptAs("../../etc", world.outsider.cookie)).status).toBe(404);
  });
});

describe("revoke", () => {
  it("the coach revokes a pending invitation: its link reports revoked and gives 410; revoking again is harmless", async () => {
    const email = uniqueEmail("inv-revoke");
    const { invited } = await json<InviteBody>(await inviteAs(world.coachA.cookie, [email]));
    const token = tokenMailedTo(email);
    const response = await revokeAs(invited[0].id, world.coachA.cookie);
    expect(response.status).toBe(200);
    expect((await json<{ invitation: { status: string; email: string } }>(response)).invitation).toMatchObject({ email, status: "revoked" });
    expect((await json<{ status: string }>(await describeToken(token))).status).toBe("revoked");
    const refused = await acceptAs(token, world.outsider.cookie);
    expect(refused.status).toBe(410);
    expect((await json<ErrorBody>(refused)).error.message).toBe("This invitation was withdrawn by the coach.");
    expect((await revokeAs(invited[0].id, world.coachA.cookie)).status).toBe(200);
  });

  it("after a revoke the same address can be invited again", async () => {
    const email = uniqueEmail("inv-reinvite");
    const { invited } = await json<InviteBody>(await inviteAs(world.coachA.cookie, [email]));
    await revokeAs(invited[0].id, world.coachA.cookie);
    const again = await json<InviteBody>(await inviteAs(world.coachA.cookie, [email]));
    expect(again.invited).toHaveLength(1);
    expect(again.invited[0].id).not.toBe(invited[0].id);
  });

  it("an accepted invitation cannot be revoked (409)", async () => {
    const email = uniqueEmail("inv-accepted");
    const { invited } = await json<InviteBody>(await inviteAs(world.coachA.cookie, [email]));
    await acceptAs(tokenMailedTo(email), (await signUp("inv-accepter")).cookie);
    const response = await revokeAs(invited[0].id, world.coachA.cookie);
    expect(response.status).toBe(409);
  });

  it("refuses others (403), hides other teams' invitations (404) and is 401 signed out", async () => {
    const { invited } = await json<InviteBody>(await inviteAs(world.coachA.cookie, [uniqueEmail("inv-guarded")]));
    for (const person of [world.athleteA1, world.coachB, world.outsider]) {
      expect((await revokeAs(invited[0].id, person.cookie)).status).toBe(403);
    }
    expect((await revokeAs(invited[0].id, world.coachB.cookie, world.teamB.id)).status).toBe(404);
    expect((await revokeAs("not-a-uuid", world.coachA.cookie)).status).toBe(404);
    expect((await revokeAs(invited[0].id)).status).toBe(401);
    expect((await revokeAs(invited[0].id, world.admin.cookie)).status).toBe(200);
  });
});

describe("resend", () => {
  it("is rate limited right after sending, then issues a new token and expiry and mails again; the old link dies", async () => {
    const email = uniqueEmail("inv-resend");
    const { invited } = await json<InviteBody>(await inviteAs(world.coachA.cookie, [email]));
    const oldToken = tokenMailedTo(email);

    const tooSoon = await resendAs(invited[0].id, world.coachA.cookie);
    expect(tooSoon.status).toBe(429);
    expect((await json<ErrorBody>(tooSoon)).error.code).toBe("rate_limited:invitation");

    await age(invited[0].id, { lastSentAt: new Date(Date.now() - 61_000), expiresAt: new Date(Date.now() - 1000) });
    const response = await resendAs(invited[0].id, world.coachA.cookie);
    expect(response.status).toBe(200);
    const { invitation } = await json<{ invitation: { id: string; status: string; expiresAt: string } }>(response);
    expect(invitation).toMatchObject({ id: invited[0].id, status: "pending" });
    expect(Date.parse(invitation.expiresAt)).toBeGreaterThan(Date.now() + 6.9 * 86_400_000);

    expect(mailTo(mail, email)).toHaveLength(2);
    const newToken = tokenMailedTo(email);
    expect(newToken).not.toBe(oldToken);
    expect((await describeToken(oldToken)).status).toBe(404);
    expect((await acceptAs(newToken, world.outsider.cookie)).status).toBe(200);
  });

  it("refuses revoked (409) and accepted (409) invitations, non-coaches (403) and signed-out callers (401)", async () => {
    const email = uniqueEmail("inv-resend-refused");
    const { invited } = await json<InviteBody>(await inviteAs(world.coachA.cookie, [email]));
    await age(invited[0].id, { lastSentAt: new Date(Date.now() - 61_000) });
    for (const person of [world.athleteA1, world.coachB, world.outsider]) {
      expect((await resendAs(invited[0].id, person.cookie)).status).toBe(403);
    }
    expect((await resendAs(invited[0].id)).status).toBe(401);
    await revokeAs(invited[0].id, world.coachA.cookie);
    expect((await resendAs(invited[0].id, world.coachA.cookie)).status).toBe(409);
    expect((await resendAs("00000000-0000-4000-8000-000000000000", world.coachA.cookie)).status).toBe(404);
  });
});

describe("when the mail server is down", () => {
  it("keeps the invitation, reports mail_failed, answers resend with 503, and works again once mail is back", async () => {
    const working = process.env.SMTP_URL;
    process.env.SMTP_URL = "smtp://127.0.0.1:9"; // the discard port: nothing listens there
    try {
      const email = uniqueEmail("inv-nomail");
      const body = await json<InviteBody>(await inviteAs(world.coachA.cookie, [email]));
      expect(body.invited).toEqual([]);
      expect(body.skipped).toEqual([expect.objectContaining({ email, reason: "mail_failed" })]);
      const rosterBody = await json<{ invitations: { id: string; email: string; status: string }[] }>(
        await call(roster.GET, "", { cookie: world.coachA.cookie, params: { teamId: world.teamA.id } }),
      );
      const pending = rosterBody.invitations.find((i) => i.email === email);
      expect(pending?.status).toBe("pending");

      await age(pending!.id, { lastSentAt: new Date(Date.now() - 61_000) });
      const failedResend = await resendAs(pending!.id, world.coachA.cookie);
      expect(failedResend.status).toBe(503);
      expect((await json<ErrorBody>(failedResend)).error.code).toBe("unavailable:mail");

      process.env.SMTP_URL = working;
      await age(pending!.id, { lastSentAt: new Date(Date.now() - 61_000) });
      expect((await resendAs(pending!.id, world.coachA.cookie)).status).toBe(200);
      expect(mailTo(mail, email)).toHaveLength(1);
    } finally {
      process.env.SMTP_URL = working;
    }
  });
});
