// GET /api/teams/[teamId]/prices: the team's prices (its members). PUT { currency, membership, singleReview }:
// the coach sets or removes the monthly and single-review prices (amounts as typed, e.g. "49.00"; empty = none).
import { requireCoachOf, requireSession, requireTeamMember } from "@/lib/access";
import { parseOrThrow, readJson, withErrors } from "@/lib/errors";
import { teamPricesSchema } from "@/lib/validation/billing";
import { getTeamPrices, setTeamPrices, type TeamPrices } from "@/db/queries/billing";

type Context = { params: Promise<{ teamId: string }> };

function pricesBody(prices: TeamPrices) {
  const view = (p: TeamPrices["membership"]) => (p ? { amountMinor: p.amountMinor, currency: p.currency } : null);
  return { prices: { membership: view(prices.membership), singleReview: view(prices.singleReview) } };
}

export const GET = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireSession(request);
  const team = await requireTeamMember(viewer, (await params).teamId);
  return Response.json(pricesBody(await getTeamPrices(team.id)));
});

export const PUT = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireSession(request);
  const team = await requireCoachOf(viewer, (await params).teamId);
  const data = parseOrThrow(teamPricesSchema, await readJson(request, "price"), "price");
  return Response.json(pricesBody(await setTeamPrices(team, viewer.userId, data)));
});
