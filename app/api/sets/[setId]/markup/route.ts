// GET: the set's markup shapes, for anyone who may read the set's review, and whether the viewer may edit them.
import { requireSession, requireSetReader } from "@/lib/access";
import { withErrors } from "@/lib/errors";
import { canEditMarkup } from "@/lib/markup/access";
import { listMarkup } from "@/db/queries/markup";

type Context = { params: Promise<{ setId: string }> };

export const GET = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireSession(request);
  const { set, role } = await requireSetReader(viewer, (await params).setId);
  return Response.json({ shapes: await listMarkup(set.id), canEdit: canEditMarkup(role) });
});
