// Billing: for a coach, the team's prices, each athlete's membership (with comp) and the invoices with totals per
// month; for an athlete, the membership on each team (pay, renewal date, portal) and their own invoices.
// `?team=` narrows the page to one team; `?checkout=done|cancelled` is where the hosted checkout returns.
import type { Metadata } from "next";
import { requireServerViewer } from "@/lib/access";
import { listMemberships, type MembershipSummary } from "@/db/queries/teams";
import { findBillingMembership, getTeamPrices, listInvoices, membershipAccess, rosterBilling } from "@/db/queries/billing";
import { formatMoney, minorToDecimalString } from "@/lib/billing/money";
import type { Viewer } from "@/db/queries/viewer";
import { PageHeader } from "@/components/ui/page-header";
import { Card, CardBody, CardHeader } from "@/components/ui/card";
import { Banner } from "@/components/ui/banner";
import { EmptyState } from "@/components/ui/empty-state";
import { PriceForm } from "@/components/billing/price-form";
import { CompToggle } from "@/components/billing/comp-toggle";
import { ProviderButton } from "@/components/billing/provider-button";
import { MembershipBadge, MembershipDates } from "@/components/billing/membership-status";
import { InvoiceTable, MonthlyTotals } from "@/components/billing/invoice-table";

export const metadata: Metadata = { title: "Billing" };

async function CoachTeam({ team }: { team: MembershipSummary }) {
  const [prices, roster, invoices] = await Promise.all([
    getTeamPrices(team.teamId),
    rosterBilling(team.teamId),
    listInvoices({ teamIds: [team.teamId] }),
  ]);
  const currency = prices.membership?.currency ?? prices.singleReview?.currency ?? "EUR";
  const priced = prices.membership !== null;
  return (
    <div className="grid gap-4">
      <Card>
        <CardHeader title={`${team.teamName}: prices`} description={priced ? `${formatMoney(prices.membership!.amountMinor, currency)} per athlete per month` : "Free: athletes upload without paying."} />
        <CardBody>
          <PriceForm
            teamId={team.teamId}
            currency={currency}
            membership={prices.membership ? minorToDecimalString(prices.membership.amountMinor, currency) : ""}
            singleReview={prices.singleReview ? minorToDecimalString(prices.singleReview.amountMinor, currency) : ""}
          />
        </CardBody>
      </Card>
      <Card>
        <CardHeader title="Memberships" description="A comped athlete uploads without paying. A lapsed athlete keeps reading and exporting, but cannot upload." />
        <CardBody>
          {roster.length === 0 ? (
            <p className="text-sm text-ink-muted">No athletes yet.</p>
          ) : (
            <table className="w-full text-sm" data-testid="membership-table">
              <tbody>
                {roster.map((row) => (
                  <tr key={row.athleteId} className="border-t border-line first:border-t-0">
                    <td className="py-2 pr-3">
                      <div className="font-medium text-ink">{row.name}</div>
                      <div className="text-xs text-ink-muted">{row.email}</div>
                    </td>
                    <td className="py-2 pr-3">{priced || row.comped ? <MembershipBadge view={row.view} /> : <span className="text-ink-muted">Free team</span>}</td>
                    <td className="py-2 pr-3 text-ink-muted">{priced ? <MembershipDates view={row.view} /> : null}</td>
                    <td className="py-2 text-right">
                      {priced || row.comped ? <CompToggle teamId={team.teamId} athleteId={row.athleteId} athleteName={row.name} comped={row.comped} /> : null}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          )}
        </CardBody>
      </Card>
      <Card>
        <CardHeader title="Invoices" description="Every athlete's payments to the team, and the totals per month." />
        <CardBody className="grid gap-5">
          <MonthlyTotals totals={invoices.monthlyTotals} />
          <InvoiceTable invoices={invoices.invoices} showAthlete />
        </CardBody>
      </Card>
    </div>
  );
}

async function AthleteTeam({ viewer, team }: { viewer: Viewer; team: MembershipSummary }) {
  const [prices, access, row, invoices] = await Promise.all([
    getTeamPrices(team.teamId),
    membershipAccess(viewer.userId, team.teamId),
    findBillingMembership(viewer.userId, team.teamId),
    listInvoices({ teamIds: [team.teamId], athleteId: viewer.userId }),
  ]);
  const { view } = access;
  const membership = prices.membership;
  const canPay = membership !== null && !view.uploadsAllowed;
  return (
    <Card>
      <CardHeader title={team.teamName} description={membership ? `${formatMoney(membership.amountMinor, membership.currency)} per month` : "Free team"} actions={membership ? <MembershipBadge view={view} /> : null} />
      <CardBody className="grid gap-4">
        {!membership ? (
          <p className="text-sm text-ink-muted">Your coach does not charge for this team: upload as much as you like.</p>
        ) : (
          <>
            <p className="text-sm text-ink" data-testid="membership-state">
              {view.status === "comped" ? "Your coach has comped your membership: nothing to pay." : null}
              {view.status === "active" ? <MembershipDates view={view} /> : null}
              {view.status === "lapsing" ? (
                <>
                  Cancelled. <MembershipDates view={view} />.
                </>
              ) : null}
              {view.status === "past_due" ? (
                <>
                  The last renewal failed. <MembershipDates view={view} />; update your card to keep uploading.
                </>
              ) : null}
              {view.status === "lapsed" ? "Your membership has lapsed. Your sets stay readable and exportable; new uploads are paused until you pay again." : null}
              {view.status === "none" ? "Pay your coach to start uploading sets for review." : null}
            </p>
            {canPay ? <ProviderButton teamId={team.teamId} action="membership" label={`Pay your coach ${formatMoney(membership.amountMinor, membership.currency)} a month`} /> : null}
            {row?.providerCustomerId && view.status !== "comped" ? <ProviderButton teamId={team.teamId} action="portal" label="Manage or cancel the membership" variant="secondary" /> : null}
          </>
        )}
        {prices.singleReview && !view.uploadsAllowed ? (
          <ProviderButton
            teamId={team.teamId}
            action="single_review"
            label={`Pay for one set review (${formatMoney(prices.singleReview.amountMinor, prices.singleReview.currency)})`}
            variant="secondary"
          />
        ) : null}
        <div>
          <h3 className="mb-2 text-sm font-semibold text-ink">Your invoices</h3>
          <InvoiceTable invoices={invoices.invoices} showAthlete={false} />
        </div>
      </CardBody>
    </Card>
  );
}

export default async function BillingPage({ searchParams }: { searchParams: Promise<{ team?: string | string[]; checkout?: string | string[] }> }) {
  const viewer = await requireServerViewer();
  const { team, checkout } = await searchParams;
  const all = await listMemberships(viewer.userId);
  const shown = typeof team === "string" && all.some((m) => m.teamId === team) ? all.filter((m) => m.teamId === team) : all;
  const coached = shown.filter((m) => m.role === "coach");
  const lifting = shown.filter((m) => m.role === "athlete");

  return (
    <>
      <PageHeader title="Billing" description="Memberships, prices and invoices. Payments go through the payment provider's own pages." />
      <div className="grid gap-6">
        {checkout === "done" ? (
          <Banner live tone="info" title="Thank you: your payment went through">
            A receipt is on its way to {viewer.email}.
          </Banner>
        ) : null}
        {checkout === "cancelled" ? (
          <Banner live tone="caution" title="Payment cancelled">
            Nothing was charged.
          </Banner>
        ) : null}
        {lifting.map((m) => (
          <AthleteTeam key={`a-${m.teamId}`} viewer={viewer} team={m} />
        ))}
        {coached.map((m) => (
          <CoachTeam key={`c-${m.teamId}`} team={m} />
        ))}
        {shown.length === 0 ? <EmptyState title="No teams yet">Join or create a team first.</EmptyState> : null}
      </div>
    </>
  );
}
