// POST /api/billing/portal { teamId }: an athlete who has paid the team gets the provider's customer portal URL
// (cancel, change card).
import { requirePayingAthleteOf, requireSession } from "@/lib/access";
import { parseOrThrow, readJson, withErrors } from "@/lib/errors";
import { portalSchema } from "@/lib/validation/billing";
import { startPortal } from "@/lib/billing/checkout";

export const POST = withErrors(async (request: Request) => {
  const viewer = await requireSession(request);
  const data = parseOrThrow(portalSchema, await readJson(request, "portal"), "portal");
  const team = await requirePayingAthleteOf(viewer, data.teamId);
  return Response.json({ portal: await startPortal(viewer, team) }, { status: 201 });
});
