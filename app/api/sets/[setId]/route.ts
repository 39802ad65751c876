// GET /api/sets/[setId]: one set, if the viewer may read it.
import { requireSession, requireSetAccess } from "@/lib/access";
import { withErrors } from "@/lib/errors";
import { getSetSummary } from "@/db/queries/sets";

export const GET = withErrors(async (request: Request, { params }: { params: Promise<{ setId: string }> }) => {
  const viewer = await requireSession(request);
  const set = await requireSetAccess(viewer, (await params).setId);
  return Response.json({ set: await getSetSummary(set.id) });
});
