// POST: asks for an H.264 copy of the clip (the browser found it cannot decode the original). The
// conversion runs as a background job; the browser polls GET /api/sets/[setId]/clip for its status.
import { requireSession, requireSetAccess } from "@/lib/access";
import { withErrors } from "@/lib/errors";
import { requestClipConversion } from "@/db/queries/clips";
import { enqueueClipConversion } from "@/lib/jobs/enqueue";
import { clipView } from "@/lib/clips/view";

type Context = { params: Promise<{ setId: string }> };

export const POST = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireSession(request);
  const set = await requireSetAccess(viewer, (await params).setId);
  const clip = await requestClipConversion(set.id, (executor) => enqueueClipConversion(executor, { setId: set.id }));
  return Response.json({ clip: await clipView(clip) }, { status: 202 });
});
