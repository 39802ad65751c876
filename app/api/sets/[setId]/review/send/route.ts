// POST: the coach (or an admin) sends the review: it becomes "answered" and the athlete gets an e-mail with the link.
// The status is committed first; a mail that fails is reported (mailed: false) rather than undoing the answer.
import { requireReviewEditor, requireSession } from "@/lib/access";
import { withErrors } from "@/lib/errors";
import { appUrl, reviewAnsweredMail, sendMail } from "@/lib/mail";
import { reviewPayload } from "@/lib/review/view";
import { LIFT_LABELS } from "@/lib/client/set-form";
import { getShare, sendReview } from "@/db/queries/reviews";
import { findUserContact } from "@/db/queries/review-people";

type Context = { params: Promise<{ setId: string }> };

export const POST = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireSession(request);
  const { set, role } = await requireReviewEditor(viewer, (await params).setId);
  const review = await sendReview(viewer, set.id);
  let mailed = false;
  const athlete = await findUserContact(set.athleteId);
  if (athlete) {
    const setTitle = `${LIFT_LABELS[set.lift].toLowerCase()} set${set.variant ? ` (${set.variant})` : ""}`;
    const mail = reviewAnsweredMail({ athleteName: athlete.name, coachName: viewer.name, setTitle, url: appUrl(`/app/sets/${set.id}/review`) });
    try {
      await sendMail(athlete.email, mail);
      mailed = true;
    } catch (error) {
      console.error(`[plumbline] review mail for set ${set.id} failed:`, error);
    }
  }
  return Response.json({ ...reviewPayload(review, await getShare(set.id), role), mailed });
});
