// GET /api/teams/[teamId]/roster: the team's athletes and invitations (its coaches and admins only).
import { requireCoachOf, requireSession } from "@/lib/access";
import { withErrors } from "@/lib/errors";
import { getRoster } from "@/db/queries/teams";

export const GET = withErrors(async (request: Request, { params }: { params: Promise<{ teamId: string }> }) => {
  const viewer = await requireSession(request);
  const team = await requireCoachOf(viewer, (await params).teamId);
  return Response.json(await getRoster(team));
});
