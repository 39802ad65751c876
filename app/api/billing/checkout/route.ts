// POST /api/billing/checkout { teamId, kind }: an athlete of the team gets a hosted checkout page URL to pay
// the monthly membership or a single set review.
import { requirePayingAthleteOf, requireSession } from "@/lib/access";
import { parseOrThrow, readJson, withErrors } from "@/lib/errors";
import { checkoutSchema } from "@/lib/validation/billing";
import { startCheckout } from "@/lib/billing/checkout";

export const POST = withErrors(async (request: Request) => {
  const viewer = await requireSession(request);
  const data = parseOrThrow(checkoutSchema, await readJson(request, "checkout"), "checkout");
  const team = await requirePayingAthleteOf(viewer, data.teamId);
  return Response.json({ checkout: await startCheckout(viewer, team, data.kind) }, { status: 201 });
});
