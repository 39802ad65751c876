// PUT { shared }: the coach (or an admin) shares the set with its team for peer critique, or withdraws the share.
// Teammates then read the review and comment; after withdrawal they are refused again.
import { requireReviewEditor, requireSession } from "@/lib/access";
import { parseOrThrow, readJson, withErrors } from "@/lib/errors";
import { shareSchema } from "@/lib/validation/review";
import { getShare } from "@/db/queries/reviews";
import { setShared } from "@/db/queries/shares";

type Context = { params: Promise<{ setId: string }> };

export const PUT = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireSession(request);
  const { set } = await requireReviewEditor(viewer, (await params).setId);
  const { shared } = parseOrThrow(shareSchema, await readJson(request, "share"), "share");
  await setShared(viewer, set, shared);
  return Response.json({ share: await getShare(set.id) });
});
