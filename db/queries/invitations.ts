// Invitations: a coach invites addresses to a team; the e-mailed link carries a random token of which only the
// SHA-256 is stored. Any signed-in account may accept (the link itself proves access to the mailbox).
import "server-only";
import { createHash, randomBytes } from "node:crypto";
import { and, eq, inArray, isNull } from "drizzle-orm";
import { db } from "@/db";
import { invitations, memberships, teams, user, type Invitation } from "@/db/schema";
import { ApiError } from "@/lib/errors";
import { INVITATION_TTL_DAYS } from "@/lib/validation/invitation";
import { invitationStatus } from "./invitation-status";
import type { Viewer } from "./viewer";

const DAY_MS = 24 * 60 * 60 * 1000;
/** A coach may resend one invitation at most once a minute (common practice against mail floods). */
export const RESEND_INTERVAL_S = 60;

export type SkipReason = "duplicate" | "already_member" | "already_invited" | "mail_failed";
export interface Skipped {
  email: string;
  reason: SkipReason;
  message: string;
}
export interface IssuedInvitation {
  invitation: Invitation;
  /** The raw token, only ever held in memory to build the e-mailed link. */
  token: string;
}

export const SKIP_MESSAGES: Record<SkipReason, string> = {
  duplicate: "This address appears more than once in the list.",
  already_member: "This person is already an athlete on the team.",
  already_invited: "An invitation to this address is still pending; use resend instead.",
  mail_failed: "The invitation was saved but the e-mail could not be sent; try resending it.",
};

export function hashToken(token: string): string {
  return createHash("sha256").update(token).digest("hex");
}

function newToken(now: Date): { token: string; tokenHash: string; expiresAt: Date; lastSentAt: Date } {
  const token = randomBytes(32).toString("base64url");
  return { token, tokenHash: hashToken(token), expiresAt: new Date(now.getTime() + INVITATION_TTL_DAYS * DAY_MS), lastSentAt: now };
}

function skip(email: string, reason: SkipReason): Skipped {
  return { email, reason, message: SKIP_MESSAGES[reason] };
}

/** Creates (or renews expired) invitations for the addresses; returns what to mail and what was skipped. */
export async function createInvitations(
  teamId: string,
  inviterId: string,
  emails: string[],
  now = new Date(),
): Promise<{ issued: IssuedInvitation[]; skipped: Skipped[] }> {
  const unique = [...new Set(emails)];
  const skipped: Skipped[] = emails.filter((email, i) => emails.indexOf(email) !== i).map((email) => skip(email, "duplicate"));
  const issued: IssuedInvitation[] = [];
  await db.transaction(async (tx) => {
    const members = await tx
      .select({ email: user.email })
      .from(memberships)
      .innerJoin(user, eq(user.id, memberships.userId))
      .where(and(eq(memberships.teamId, teamId), eq(memberships.role, "athlete"), inArray(user.email, unique)));
    const memberEmails = new Set(members.map((m) => m.email.toLowerCase()));
    const open = await tx
      .select()
      .from(invitations)
      .where(and(eq(invitations.teamId, teamId), inArray(invitations.email, unique), isNull(invitations.acceptedAt), isNull(invitations.revokedAt)));
    const openByEmail = new Map(open.map((row) => [row.email, row]));
    for (const email of unique) {
      const existing = openByEmail.get(email);
      if (memberEmails.has(email)) skipped.push(skip(email, "already_member"));
      else if (existing && invitationStatus(existing, now) === "pending") skipped.push(skip(email, "already_invited"));
      else {
        const fresh = newToken(now);
        const [row] = existing
          ? await tx.update(invitations).set({ ...fresh, invitedBy: inviterId }).where(eq(invitations.id, existing.id)).returning()
          : await tx.insert(invitations).values({ teamId, email, invitedBy: inviterId, ...fresh }).onConflictDoNothing().returning();
        if (row) issued.push({ invitation: row, token: fresh.token });
        else skipped.push(skip(email, "already_invited"));
      }
    }
  });
  return { issued, skipped };
}

async function findInTeam(teamId: string, invitationId: string): Promise<Invitation> {
  const [row] = await db
    .select()
    .from(invitations)
    .where(and(eq(invitations.id, invitationId), eq(invitations.teamId, teamId)));
  if (!row) throw new ApiError("not_found:invitation", "There is no such invitation on this team.");
  return row;
}

/** A new token and a new expiry for an open invitation (the old link stops working). */
export async function renewInvitation(teamId: string, invitationId: string, now = new Date()): Promise<IssuedInvitation> {
  const row = await findInTeam(teamId, invitationId);
  const status = invitationStatus(row, now);
  if (status === "accepted") throw new ApiError("conflict:invitation", "This invitation has already been accepted.");
  if (status === "revoked") throw new ApiError("conflict:invitation", "This invitation was revoked; send a new one instead.");
  const waitS = RESEND_INTERVAL_S - (now.getTime() - row.lastSentAt.getTime()) / 1000;
  if (waitS > 0) throw new ApiError("rate_limited:invitation", `This invitation was just sent. Try again in ${Math.ceil(waitS)} s.`);
  const fresh = newToken(now);
  const [updated] = await db.update(invitations).set(fresh).where(eq(invitations.id, row.id)).returning();
  return { invitation: updated, token: fresh.token };
}

/** Revoking is idempotent; an accepted invitation cannot be revoked (remove the athlete instead). */
export async function revokeInvitation(teamId: string, invitationId: string, now = new Date()): Promise<Invitation> {
  const row = await findInTeam(teamId, invitationId);
  if (row.acceptedAt) throw new ApiError("conflict:invitation", "This invitation has already been accepted; remove the athlete instead.");
  if (row.revokedAt) return row;
  const [updated] = await db.update(invitations).set({ revokedAt: now }).where(eq(invitations.id, row.id)).returning();
  return updated;
}

export type PublicInvitationStatus = "valid" | "expired" | "revoked" | "used";

const PUBLIC_STATUS = { pending: "valid", expired: "expired", revoked: "revoked", accepted: "used" } as const;

const GONE_MESSAGES: Record<Exclude<PublicInvitationStatus, "valid">, string> = {
  expired: "This invitation has expired. Ask your coach to send a new one.",
  revoked: "This invitation was withdrawn by the coach.",
  used: "This invitation has already been used.",
};

export async function findInvitationByToken(token: string): Promise<{ invitation: Invitation; teamName: string } | null> {
  const [row] = await db
    .select({ invitation: invitations, teamName: teams.name })
    .from(invitations)
    .innerJoin(teams, eq(teams.id, invitations.teamId))
    .where(eq(invitations.tokenHash, hashToken(token)));
  return row ?? null;
}

export async function describeInvitation(
  token: string,
  now = new Date(),
): Promise<{ teamName: string; email: string; status: PublicInvitationStatus } | null> {
  const found = await findInvitationByToken(token);
  if (!found) return null;
  return { teamName: found.teamName, email: found.invitation.email, status: PUBLIC_STATUS[invitationStatus(found.invitation, now)] };
}

/** Joins the viewer to the team as an athlete and uses up the token, in one transaction with the row locked. */
export async function acceptInvitation(
  token: string,
  viewer: Viewer,
  now = new Date(),
): Promise<{ teamId: string; teamName: string; role: "athlete" }> {
  return db.transaction(async (tx) => {
    const [found] = await tx
      .select({ invitation: invitations, teamName: teams.name })
      .from(invitations)
      .innerJoin(teams, eq(teams.id, invitations.teamId))
      .where(eq(invitations.tokenHash, hashToken(token)))
      .for("update", { of: invitations });
    if (!found) throw new ApiError("not_found:invitation", "This invitation link is not valid. Check that you copied all of it.");
    const status = PUBLIC_STATUS[invitationStatus(found.invitation, now)];
    if (status !== "valid") throw new ApiError("gone:invitation", GONE_MESSAGES[status]);
    const { teamId } = found.invitation;
    await tx.insert(memberships).values({ teamId, userId: viewer.userId, role: "athlete" }).onConflictDoNothing();
    await tx
      .update(invitations)
      .set({ acceptedAt: now, acceptedBy: viewer.userId })
      .where(eq(invitations.id, found.invitation.id));
    return { teamId, teamName: found.teamName, role: "athlete" as const };
  });
}
