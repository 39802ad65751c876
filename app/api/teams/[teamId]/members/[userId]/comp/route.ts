// PUT /api/teams/[teamId]/members/[userId]/comp { comped }: the team's coach waives (or stops waiving) an
// athlete's membership fee. 404 when the person is not an athlete of the team.
import { requireCoachOf, requireSession } from "@/lib/access";
import { ApiError, parseOrThrow, readJson, withErrors } from "@/lib/errors";
import { compSchema } from "@/lib/validation/billing";
import { userIdSchema } from "@/lib/validation/common";
import { setComped } from "@/db/queries/billing";
import { teamRolesOf } from "@/db/queries/access";

type Context = { params: Promise<{ teamId: string; userId: string }> };

export const PUT = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireSession(request);
  const { teamId, userId } = await params;
  const team = await requireCoachOf(viewer, teamId);
  const athleteId = parseOrThrow(userIdSchema, userId, "member");
  const { comped } = parseOrThrow(compSchema, await readJson(request, "member"), "member");
  if (!(await teamRolesOf(athleteId, team.id)).includes("athlete")) throw new ApiError("not_found:member", "This person is not an athlete of the team.");
  return Response.json({ membership: await setComped(team.id, athleteId, viewer.userId, comped) });
});
