// GET /api/me: the signed-in person, their team memberships and athlete profile.
import { requireSession } from "@/lib/access";
import { withErrors } from "@/lib/errors";
import { getMe } from "@/db/queries/users";

export const GET = withErrors(async (request: Request) => {
  const viewer = await requireSession(request);
  return Response.json(await getMe(viewer));
});
