// GET /api/sets: the sets the viewer may read (filters athleteId, teamId); POST /api/sets: record a set's metadata
// (an athlete's own, or a coach's for one of the team's athletes).
import { requireAthleteAccess, requireSession, requireSetOwner, requireTeamMember, requireUploadAllowed } from "@/lib/access";
import { parseOrThrow, readJson, withErrors } from "@/lib/errors";
import { createSetSchema, setListQuerySchema } from "@/lib/validation/set";
import { createSet, listSets } from "@/db/queries/sets";

export const GET = withErrors(async (request: Request) => {
  const viewer = await requireSession(request);
  const query = Object.fromEntries(new URL(request.url).searchParams);
  const filters = parseOrThrow(setListQuerySchema, query, "set");
  if (filters.teamId) await requireTeamMember(viewer, filters.teamId);
  if (filters.athleteId) await requireAthleteAccess(viewer, filters.athleteId);
  return Response.json({ sets: await listSets(viewer, filters) });
});

export const POST = withErrors(async (request: Request) => {
  const viewer = await requireSession(request);
  const data = parseOrThrow(createSetSchema, await readJson(request, "set"), "set");
  const athleteId = await requireSetOwner(viewer, data);
  await requireUploadAllowed(viewer, { athleteId, teamId: data.teamId ?? null });
  return Response.json({ set: await createSet(athleteId, data, { createdBy: viewer.userId }) }, { status: 201 });
});
