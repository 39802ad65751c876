// POST /api/teams/[teamId]/invitations/[invitationId]/resend: new token, new expiry, the mail again.
import { requireCoachOf, requireSession } from "@/lib/access";
import { ApiError, withErrors } from "@/lib/errors";
import { sendInvitationMail } from "@/lib/mail";
import { uuidSchema } from "@/lib/validation/common";
import { renewInvitation } from "@/db/queries/invitations";
import { toInvitationJson } from "@/db/queries/invitation-status";

type Context = { params: Promise<{ teamId: string; invitationId: string }> };

export const POST = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireSession(request);
  const { teamId, invitationId } = await params;
  const team = await requireCoachOf(viewer, teamId);
  const id = uuidSchema.safeParse(invitationId);
  if (!id.success) throw new ApiError("not_found:invitation", "There is no such invitation on this team.");
  const { invitation, token } = await renewInvitation(team.id, id.data);
  try {
    await sendInvitationMail({ to: invitation.email, token, teamName: team.name, inviterName: viewer.name, expiresAt: invitation.expiresAt });
  } catch (error) {
    console.error(`[plumbline] invitation mail to ${invitation.email} failed:`, error);
    throw new ApiError("unavailable:mail", "The invitation was renewed but the e-mail could not be sent. Try again in a minute.");
  }
  return Response.json({ invitation: toInvitationJson(invitation) });
});
