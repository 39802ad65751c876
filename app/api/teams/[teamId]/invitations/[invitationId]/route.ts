// DELETE /api/teams/[teamId]/invitations/[invitationId]: revoke a pending invitation (its link stops working).
import { requireCoachOf, requireSession } from "@/lib/access";
import { ApiError, withErrors } from "@/lib/errors";
import { uuidSchema } from "@/lib/validation/common";
import { revokeInvitation } from "@/db/queries/invitations";
import { toInvitationJson } from "@/db/queries/invitation-status";

type Context = { params: Promise<{ teamId: string; invitationId: string }> };

export const DELETE = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireSession(request);
  const { teamId, invitationId } = await params;
  const team = await requireCoachOf(viewer, teamId);
  const id = uuidSchema.safeParse(invitationId);
  if (!id.success) throw new ApiError("not_found:invitation", "There is no such invitation on this team.");
  return Response.json({ invitation: toInvitationJson(await revokeInvitation(team.id, id.data)) });
});
