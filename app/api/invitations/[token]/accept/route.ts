// POST /api/invitations/[token]/accept: the signed-in person joins the team as an athlete (410 when the link is used up).
import { requireSession } from "@/lib/access";
import { ApiError, withErrors } from "@/lib/errors";
import { invitationTokenSchema } from "@/lib/validation/invitation";
import { acceptInvitation } from "@/db/queries/invitations";

export const POST = withErrors(async (request: Request, { params }: { params: Promise<{ token: string }> }) => {
  const viewer = await requireSession(request);
  const token = invitationTokenSchema.safeParse((await params).token);
  if (!token.success) throw new ApiError("not_found:invitation", "This invitation link is not valid. Check that you copied all of it.");
  return Response.json({ membership: await acceptInvitation(token.data, viewer) });
});
