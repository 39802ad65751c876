// Receipts and failed-payment notices, to the athlete and to the team's coaches, through lib/mail.ts.
// A mail that cannot be sent is logged: the payment itself is already recorded.
import "server-only";
import { appUrl, compose, sendMail, type MailContent } from "@/lib/mail";
import { formatMoney } from "@/lib/billing/money";
import { noticeFacts, type BillingNotice, type NoticeFacts } from "@/db/queries/billing-events";

const day = (d: Date) => d.toLocaleDateString("en-GB", { day: "numeric", month: "long", year: "numeric", timeZone: "UTC" });

function what(facts: NoticeFacts): string {
  return facts.kind === "membership" ? `coaching membership of ${facts.teamName}` : `single set review from ${facts.teamName}`;
}

export function receiptMails(facts: NoticeFacts): { to: string; content: MailContent }[] {
  const amount = formatMoney(facts.amountMinor, facts.currency);
  const until = facts.kind === "membership" && facts.periodEnd ? ` It covers uploads until ${day(facts.periodEnd)}.` : "";
  const invoice = facts.hostedInvoiceUrl ? [`The invoice: ${facts.hostedInvoiceUrl}`] : [];
  const athlete = {
    to: facts.athlete.email,
    content: compose(
      `Receipt: ${amount} for your ${what(facts)}`,
      [`Hello ${facts.athlete.name},`, `We received ${amount} for your ${what(facts)}.${until}`, ...invoice],
      { label: "See your membership", url: appUrl(`/app/billing?team=${facts.teamId}`) },
      "Keep this mail as your receipt.",
    ),
  };
  const coaches = facts.coaches.map((coach) => ({
    to: coach.email,
    content: compose(
      `${facts.athlete.name} paid ${amount}`,
      [`Hello ${coach.name},`, `${facts.athlete.name} paid ${amount} for the ${what(facts)}.${until}`],
      { label: "See the invoices", url: appUrl(`/app/billing?team=${facts.teamId}`) },
      "You get this mail for every payment to your team.",
    ),
  }));
  return [athlete, ...coaches];
}

export function paymentFailedMails(facts: NoticeFacts): { to: string; content: MailContent }[] {
  const amount = formatMoney(facts.amountMinor, facts.currency);
  const athlete = {
    to: facts.athlete.email,
    content: compose(
      `Your payment of ${amount} did not go through`,
      [
        `Hello ${facts.athlete.name},`,
        `The renewal of your ${what(facts)} (${amount}) failed. Your sets and reviews stay readable and exportable, but new uploads pause when the paid period ends.`,
        "Update your card or pay again from your membership page.",
      ],
      { label: "Fix the payment", url: appUrl(`/app/billing?team=${facts.teamId}`) },
      "If you meant to stop, you can ignore this mail.",
    ),
  };
  const coaches = facts.coaches.map((coach) => ({
    to: coach.email,
    content: compose(
      `${facts.athlete.name}'s payment of ${amount} failed`,
      [`Hello ${coach.name},`, `The renewal of ${facts.athlete.name}'s ${what(facts)} (${amount}) failed. Their uploads pause when the paid period ends unless they pay or you comp them.`],
      { label: "See the memberships", url: appUrl(`/app/billing?team=${facts.teamId}`) },
      "You get this mail for every failed payment on your team.",
    ),
  }));
  return [athlete, ...coaches];
}

/** Sends the mails for the notices an event produced. */
export async function sendBillingNotices(notices: BillingNotice[]): Promise<void> {
  for (const notice of notices) {
    const facts = await noticeFacts(notice.paymentId);
    if (!facts) continue;
    const mails = notice.kind === "receipt" ? receiptMails(facts) : paymentFailedMails(facts);
    const results = await Promise.allSettled(mails.map((mail) => sendMail(mail.to, mail.content)));
    results.forEach((result, i) => {
      if (result.status === "rejected") console.error(`[plumbline] billing mail to ${mails[i].to} failed:`, result.reason);
    });
  }
}
