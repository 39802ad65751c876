// The life of an invitation as the roster shows it, derived from its timestamps.
import type { Invitation } from "@/db/schema";

export type InvitationStatus = "pending" | "expired" | "revoked" | "accepted";

export function invitationStatus(
  invitation: Pick<Invitation, "acceptedAt" | "revokedAt" | "expiresAt">,
  now = new Date(),
): InvitationStatus {
  if (invitation.acceptedAt) return "accepted";
  if (invitation.revokedAt) return "revoked";
  if (invitation.expiresAt.getTime() <= now.getTime()) return "expired";
  return "pending";
}

/** The invitation as the API returns it (never the token hash). */
export function toInvitationJson(invitation: Invitation, now = new Date()) {
  return {
    id: invitation.id,
    teamId: invitation.teamId,
    email: invitation.email,
    status: invitationStatus(invitation, now),
    expiresAt: invitation.expiresAt,
    createdAt: invitation.createdAt,
    lastSentAt: invitation.lastSentAt,
  };
}
