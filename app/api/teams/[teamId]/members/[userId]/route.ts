// DELETE /api/teams/[teamId]/members/[userId]: a coach removes an athlete; the athlete keeps their data.
import { requireCoachOf, requireSession } from "@/lib/access";
import { ApiError, withErrors } from "@/lib/errors";
import { removeAthlete } from "@/db/queries/teams";

type Context = { params: Promise<{ teamId: string; userId: string }> };

export const DELETE = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireSession(request);
  const { teamId, userId } = await params;
  const team = await requireCoachOf(viewer, teamId);
  if (!(await removeAthlete(team.id, userId))) throw new ApiError("not_found:member", "This person is not an athlete on the team.");
  return new Response(null, { status: 204 });
});
