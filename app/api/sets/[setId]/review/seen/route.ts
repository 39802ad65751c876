// POST: the set's athlete opened the answered review: it becomes "seen" (first time kept). Only the athlete marks it.
import { requireSession, requireSetReader } from "@/lib/access";
import { ApiError, withErrors } from "@/lib/errors";
import { reviewPayload } from "@/lib/review/view";
import { getShare, markReviewSeen } from "@/db/queries/reviews";

type Context = { params: Promise<{ setId: string }> };

export const POST = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireSession(request);
  const { set, role } = await requireSetReader(viewer, (await params).setId);
  if (role !== "athlete") throw new ApiError("forbidden:review", "Only the athlete marks their review as seen.");
  const [review, share] = await Promise.all([markReviewSeen(set.id), getShare(set.id)]);
  return Response.json(reviewPayload(review, share, role));
});
