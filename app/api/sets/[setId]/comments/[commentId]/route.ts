// PUT: the author edits their comment. DELETE: the author removes it, or the coach (or an admin) moderates.
// Both first require read access to the set, so a teammate loses their own comments' controls when the share ends.
import { canEditReview, requireSession, requireSetReader } from "@/lib/access";
import { ApiError, parseOrThrow, readJson, withErrors } from "@/lib/errors";
import { uuidSchema } from "@/lib/validation/common";
import { updateCommentSchema } from "@/lib/validation/review";
import { deleteComment, editComment } from "@/db/queries/comments";

type Context = { params: Promise<{ setId: string; commentId: string }> };

function commentIdOf(raw: string): string {
  const parsed = uuidSchema.safeParse(raw);
  if (!parsed.success) throw new ApiError("not_found:comment", "There is no such comment.");
  return parsed.data;
}

export const PUT = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireSession(request);
  const { setId, commentId } = await params;
  const { set } = await requireSetReader(viewer, setId);
  const { body } = parseOrThrow(updateCommentSchema, await readJson(request, "comment"), "comment");
  return Response.json({ comment: await editComment(viewer, set.id, commentIdOf(commentId), body) });
});

export const DELETE = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireSession(request);
  const { setId, commentId } = await params;
  const { set, role } = await requireSetReader(viewer, setId);
  await deleteComment(viewer, set.id, commentIdOf(commentId), canEditReview(role));
  return new Response(null, { status: 204 });
});
