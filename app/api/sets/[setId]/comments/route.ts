// GET: the set's comments, oldest first, for anyone who may read the review (athlete, coach, admin, teammates while shared).
// POST: the same people add a comment pinned to a moment (time, frame, optional rep), or reply in a thread.
import { requireSession, requireSetReader } from "@/lib/access";
import { parseOrThrow, readJson, withErrors } from "@/lib/errors";
import { createCommentSchema } from "@/lib/validation/review";
import { addComment, listComments } from "@/db/queries/comments";

type Context = { params: Promise<{ setId: string }> };

export const GET = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireSession(request);
  const { set } = await requireSetReader(viewer, (await params).setId);
  return Response.json({ comments: await listComments(set.id) });
});

export const POST = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireSession(request);
  const { set } = await requireSetReader(viewer, (await params).setId);
  const input = parseOrThrow(createCommentSchema, await readJson(request, "comment"), "comment");
  return Response.json({ comment: await addComment(viewer, set.id, input) }, { status: 201 });
});
