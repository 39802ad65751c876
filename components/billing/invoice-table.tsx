// Invoices (newest first) and, for a coach, the paid totals per month.
import type { InvoiceRow } from "@/db/queries/billing";
import type { MonthTotal } from "@/lib/billing/money";
import { formatMoney } from "@/lib/billing/money";
import { Badge } from "@/components/ui/badge";
import { DateText } from "@/components/ui/date-text";

const monthName = (month: string) =>
  new Date(`${month}-01T00:00:00Z`).toLocaleDateString("en-GB", { month: "long", year: "numeric", timeZone: "UTC" });

export function MonthlyTotals({ totals }: { totals: MonthTotal[] }) {
  if (totals.length === 0) return null;
  return (
    <table className="w-full text-sm" data-testid="monthly-totals">
      <caption className="sr-only">Paid per month</caption>
      <thead className="text-left text-xs text-ink-muted">
        <tr>
          <th className="py-1.5 font-medium">Month</th>
          <th className="py-1.5 text-right font-medium">Payments</th>
          <th className="py-1.5 text-right font-medium">Paid</th>
        </tr>
      </thead>
      <tbody>
        {totals.map((t) => (
          <tr key={`${t.month}-${t.currency}`} className="border-t border-line">
            <td className="py-1.5">{monthName(t.month)}</td>
            <td className="nums py-1.5 text-right">{t.count}</td>
            <td className="nums py-1.5 text-right font-medium">{formatMoney(t.amountMinor, t.currency)}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

export function InvoiceTable({ invoices, showAthlete }: { invoices: InvoiceRow[]; showAthlete: boolean }) {
  if (invoices.length === 0) return <p className="text-sm text-ink-muted">No invoices yet.</p>;
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm" data-testid="invoice-table">
        <thead className="text-left text-xs text-ink-muted">
          <tr>
            <th className="py-1.5 pr-3 font-medium">Date</th>
            {showAthlete ? <th className="py-1.5 pr-3 font-medium">Athlete</th> : null}
            <th className="py-1.5 pr-3 font-medium">For</th>
            <th className="py-1.5 pr-3 text-right font-medium">Amount</th>
            <th className="py-1.5 font-medium">Status</th>
          </tr>
        </thead>
        <tbody>
          {invoices.map((i) => (
            <tr key={i.id} className="border-t border-line">
              <td className="py-1.5 pr-3">
                <DateText value={i.paidAt ?? i.createdAt} />
              </td>
              {showAthlete ? <td className="py-1.5 pr-3">{i.athleteName}</td> : null}
              <td className="py-1.5 pr-3">
                {i.kind === "membership" ? "Membership" : "Single review"}
                {i.kind === "membership" && i.periodStart && i.periodEnd ? (
                  <span className="text-ink-muted">
                    {" "}
                    (<DateText value={i.periodStart} /> – <DateText value={i.periodEnd} />)
                  </span>
                ) : null}
              </td>
              <td className="nums py-1.5 pr-3 text-right">
                {i.hostedInvoiceUrl ? (
                  <a href={i.hostedInvoiceUrl} className="underline underline-offset-2" target="_blank" rel="noreferrer">
                    {formatMoney(i.amountMinor, i.currency)}
                  </a>
                ) : (
                  formatMoney(i.amountMinor, i.currency)
                )}
              </td>
              <td className="py-1.5">
                <Badge tone={i.status === "paid" ? "neutral" : i.status === "failed" ? "fault" : "caution"}>{i.status === "paid" ? "Paid" : i.status === "failed" ? "Failed" : "Open"}</Badge>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
