// GET /api/billing/invoices[?teamId=]: with a team, its coach sees every athlete's invoices and the totals per
// month, an athlete of the team their own; without, the viewer's own invoices on every team.
import { requireSession, requireTeamMember } from "@/lib/access";
import { parseOrThrow, withErrors } from "@/lib/errors";
import { invoiceQuerySchema } from "@/lib/validation/billing";
import { listInvoices } from "@/db/queries/billing";
import { isCoachOf } from "@/db/queries/access";
import { listMemberships } from "@/db/queries/teams";
import { isAdmin } from "@/db/queries/viewer";

export const GET = withErrors(async (request: Request) => {
  const viewer = await requireSession(request);
  const { teamId } = parseOrThrow(invoiceQuerySchema, Object.fromEntries(new URL(request.url).searchParams), "invoice");
  if (teamId) {
    await requireTeamMember(viewer, teamId);
    const all = isAdmin(viewer) || (await isCoachOf(viewer.userId, teamId));
    return Response.json(await listInvoices({ teamIds: [teamId], athleteId: all ? undefined : viewer.userId }));
  }
  const teamIds = (await listMemberships(viewer.userId)).filter((m) => m.role === "athlete").map((m) => m.teamId);
  return Response.json(await listInvoices({ teamIds, athleteId: viewer.userId }));
});
