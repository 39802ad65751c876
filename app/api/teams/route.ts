// POST /api/teams: create a team; its creator becomes the coach.
import { requireSession } from "@/lib/access";
import { parseOrThrow, readJson, withErrors } from "@/lib/errors";
import { createTeamSchema } from "@/lib/validation/team";
import { createTeam } from "@/db/queries/teams";

export const POST = withErrors(async (request: Request) => {
  const viewer = await requireSession(request);
  const { name } = parseOrThrow(createTeamSchema, await readJson(request, "team"), "team");
  const team = await createTeam(viewer.userId, name);
  return Response.json({ team: { id: team.id, name: team.name } }, { status: 201 });
});
