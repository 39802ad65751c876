// GET /api/invitations/[token] (public): which team the link is for and whether it still works.
import { ApiError, withErrors } from "@/lib/errors";
import { invitationTokenSchema } from "@/lib/validation/invitation";
import { describeInvitation } from "@/db/queries/invitations";

const UNKNOWN = "This invitation link is not valid. Check that you copied all of it.";

export const GET = withErrors(async (_request: Request, { params }: { params: Promise<{ token: string }> }) => {
  const token = invitationTokenSchema.safeParse((await params).token);
  const found = token.success ? await describeInvitation(token.data) : null;
  if (!found) throw new ApiError("not_found:invitation", UNKNOWN);
  return Response.json(found);
});
