// Record a set: its details and the clip, uploaded straight to storage; then on to the analysis.
import type { Metadata } from "next";
import { requireServerViewer } from "@/lib/access";
import { getProfile } from "@/db/queries/profiles";
import { getRoster, listMemberships } from "@/db/queries/teams";
import { NewSetForm } from "@/components/sets/new-set-form";
import { Card, CardBody } from "@/components/ui/card";
import { PageHeader } from "@/components/ui/page-header";

export const metadata: Metadata = { title: "Add a set" };

export default async function NewSetPage() {
  const viewer = await requireServerViewer();
  const [memberships, profile] = await Promise.all([listMemberships(viewer.userId), getProfile(viewer.userId)]);
  const teams = memberships.filter((m) => m.role === "athlete").map((m) => ({ id: m.teamId, name: m.teamName }));
  // A coach may record a set for any athlete of a team they coach (POST /api/sets checks it again).
  const rosters = await Promise.all(memberships.filter((m) => m.role === "coach").map((m) => getRoster({ id: m.teamId, name: m.teamName })));
  const athletes = await Promise.all(
    rosters.flatMap((roster) =>
      roster.athletes
        .filter((a) => a.userId !== viewer.userId)
        .map(async (a) => ({
          teamId: roster.team.id,
          teamName: roster.team.name,
          userId: a.userId,
          name: a.name,
          oneRepMaxesKg: (await getProfile(a.userId))?.oneRepMaxes ?? {},
        })),
    ),
  );
  return (
    <div className="max-w-2xl">
      <PageHeader title="Add a set" description="The set's details and a clip of it. The analysis runs on this device next." />
      <Card>
        <CardBody>
          <NewSetForm teams={teams} athletes={athletes} unit={profile?.unitPreference ?? "kg"} oneRepMaxesKg={profile?.oneRepMaxes ?? {}} />
        </CardBody>
      </Card>
    </div>
  );
}
