// A membership's state in words, with the date that matters (renewal or end); colour is only a second cue.
import type { MembershipView } from "@/lib/billing/period";
import { Badge, type BadgeTone } from "@/components/ui/badge";
import { DateText } from "@/components/ui/date-text";

const LABELS: Record<MembershipView["status"], { label: string; tone: BadgeTone }> = {
  active: { label: "Active", tone: "action" },
  comped: { label: "Comped", tone: "neutral" },
  lapsing: { label: "Cancelled", tone: "caution" },
  past_due: { label: "Payment failed", tone: "caution" },
  lapsed: { label: "Lapsed", tone: "fault" },
  none: { label: "Not paid", tone: "neutral" },
};

export function MembershipBadge({ view }: { view: MembershipView }) {
  const { label, tone } = LABELS[view.status];
  return <Badge tone={tone}>{label}</Badge>;
}

export function MembershipDates({ view }: { view: MembershipView }) {
  if (view.renewsOn) {
    return (
      <span>
        Renews on <DateText value={view.renewsOn} />
      </span>
    );
  }
  if (view.endsOn) {
    return (
      <span>
        Uploads until <DateText value={view.endsOn} />
      </span>
    );
  }
  if (view.status === "lapsed" && view.paidThrough) {
    return (
      <span>
        Ended on <DateText value={view.paidThrough} />
      </span>
    );
  }
  return null;
}
