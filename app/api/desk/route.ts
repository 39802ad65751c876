// GET /api/desk?athlete=&lift=&status=&sort=: the review desk of a coach (their athletes' analysed sets) or an admin (all).
import { requireCoach, requireSession } from "@/lib/access";
import { withErrors } from "@/lib/errors";
import { deskQuerySchema } from "@/lib/validation/review";
import { getDesk } from "@/db/queries/desk";

export const GET = withErrors(async (request: Request) => {
  const viewer = await requireSession(request);
  await requireCoach(viewer);
  // Unknown filter values fall back to "no filter" (the schema's catch), as a hand-edited URL should.
  const query = deskQuerySchema.parse(Object.fromEntries(new URL(request.url).searchParams));
  return Response.json({ desk: await getDesk(viewer, query) });
});
