// Every set the viewer may read, newest first: an athlete's own, and for a coach their athletes' sets
// on the team (the review desk with its filters comes later).
import type { Metadata } from "next";
import { requireServerViewer } from "@/lib/access";
import { getProfile } from "@/db/queries/profiles";
import { listSets } from "@/db/queries/sets";
import { listMemberships } from "@/db/queries/teams";
import { SetList } from "@/components/sets/set-list";
import { ButtonLink } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";

export const metadata: Metadata = { title: "Sets" };

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
        <SetList sets={sets} unit={unit} viewerId={viewer.userId} testId="set-rows" />
      )}
    </div>
  );
}
