// POST: the coach (or an admin) opened the review: a waiting set becomes "in review"; any other status stays.
import { requireReviewEditor, requireSession } from "@/lib/access";
import { withErrors } from "@/lib/errors";
import { reviewPayload } from "@/lib/review/view";
import { getShare, startReview } from "@/db/queries/reviews";

type Context = { params: Promise<{ setId: string }> };

export const POST = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireSession(request);
  const { set, role } = await requireReviewEditor(viewer, (await params).setId);
  const [review, share] = await Promise.all([startReview(viewer, set.id), getShare(set.id)]);
  return Response.json(reviewPayload(review, share, role));
});
