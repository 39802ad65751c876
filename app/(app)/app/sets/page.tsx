// Every set the viewer may read, newest first: an athlete's own, and for a coach their athletes' sets
// on the team (the review desk with its filters comes later).
import type { Metadata } from "next";
import Link from "next/link";
import { requireServerViewer } from "@/lib/access";
import { getProfile } from "@/db/queries/profiles";
import { listSets } from "@/db/queries/sets";
import { listMemberships } from "@/db/queries/teams";
import { LIFT_NAMES } from "@/components/sets/set-list";
import { Badge } from "@/components/ui/badge";
import { ButtonLink } from "@/components/ui/button";
import { DateText } from "@/components/ui/date-text";
import { EmptyState } from "@/components/ui/empty-state";
import { Measure } from "@/components/ui/measure";
import { PageHeader } from "@/components/ui/page-header";
import { massFromKg } from "@/lib/client/units";

export const metadata: Metadata = { title: "Sets" };

const STATUS: Record<string, { label: string; tone: "neutral" | "action" | "fault" }> = {
  draft: { label: "No clip yet", tone: "neutral" },
  uploaded: { label: "Waiting for analysis", tone: "neutral" },
  analysed: { label: "Measured", tone: "action" },
  failed: { label: "Analysis failed", tone: "fault" },
};

export default async function SetsPage() {
  const viewer = await requireServerViewer();
  const [sets, profile, memberships] = await Promise.all([
    listSets(viewer, { limit: 200 }),
    getProfile(viewer.userId),
    listMemberships(viewer.userId),
  ]);
  const unit = profile?.unitPreference ?? "kg";
  // Sets are filed by the athlete who lifted them; a coach only records their own lifting.
  const lifts = memberships.some((m) => m.role === "athlete") || memberships.length === 0;
  return (
    <div className="grid gap-6">
      <PageHeader
        title="Sets"
        description="Newest first."
        actions={lifts ? <ButtonLink href="/app/sets/new">Add a set</ButtonLink> : null}
      />
      {sets.length === 0 ? (
        <EmptyState title="No sets yet">Sets recorded by you, or by the athletes you coach, appear here.</EmptyState>
      ) : (
        <ul className="divide-y divide-line rounded-lg border border-line bg-surface" data-testid="set-rows">
          {sets.map((set) => (
            <li key={set.id} className="flex flex-wrap items-center justify-between gap-x-4 gap-y-1 px-4 py-3">
              <div className="min-w-0">
                <Link href={`/app/sets/${set.id}`} className="font-medium hover:underline">
                  {LIFT_NAMES[set.lift]}
                  {set.variant ? <span className="font-normal text-ink-muted"> · {set.variant}</span> : null}
                </Link>
                <div className="mt-0.5 flex flex-wrap items-center gap-2 text-xs text-ink-muted">
                  {set.athleteId === viewer.userId ? null : <span className="font-medium text-ink">{set.athleteName}</span>}
                  <DateText value={set.sessionDate} />
                  {set.teamName ? <span>· {set.teamName}</span> : null}
                  <Badge tone={STATUS[set.status].tone}>{STATUS[set.status].label}</Badge>
                </div>
              </div>
              <div className="flex items-baseline gap-3">
                <Measure value={massFromKg(set.loadKg, unit)} unit={unit} digits={1} />
                <span className="nums text-sm text-ink-muted">
                  × <span className="font-medium text-ink">{set.reps}</span>
                </span>
              </div>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
