// GET: the set's review as the viewer may read it (status; summary and cues once sent, drafts for the coach) and its share.
// PUT: the coach (or an admin) saves the summary and cues as a draft; a waiting or answered review becomes "in review".
import { requireReviewEditor, requireSession, requireSetReader } from "@/lib/access";
import { parseOrThrow, readJson, withErrors } from "@/lib/errors";
import { reviewDraftSchema } from "@/lib/validation/review";
import { reviewPayload } from "@/lib/review/view";
import { getReview, getShare, saveReviewDraft } from "@/db/queries/reviews";

type Context = { params: Promise<{ setId: string }> };

export const GET = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireSession(request);
  const { set, role } = await requireSetReader(viewer, (await params).setId);
  const [review, share] = await Promise.all([getReview(set.id), getShare(set.id)]);
  return Response.json(reviewPayload(review, share, role));
});

export const PUT = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireSession(request);
  const { set, role } = await requireReviewEditor(viewer, (await params).setId);
  const draft = parseOrThrow(reviewDraftSchema, await readJson(request, "review"), "review");
  const [review, share] = await Promise.all([saveReviewDraft(viewer, set.id, draft), getShare(set.id)]);
  return Response.json(reviewPayload(review, share, role));
});
