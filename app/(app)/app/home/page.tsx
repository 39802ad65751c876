// The athlete's home: an invitation to film a first set, or the list of their sets; the main action sits at
// the bottom of the screen on a phone.
import type { Metadata } from "next";
import Link from "next/link";
import { requireServerViewer } from "@/lib/access";
import { getProfile } from "@/db/queries/profiles";
import { listSets } from "@/db/queries/sets";
import { listMemberships } from "@/db/queries/teams";
import { SetList } from "@/components/sets/set-list";
import { BottomAction } from "@/components/shell/bottom-action";
import { Banner, Caution } from "@/components/ui/banner";
import { ButtonLink } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";

export const metadata: Metadata = { title: "Home" };

const NEW_SET_PATH = "/app/sets/new";

export default async function AthleteHomePage() {
  const viewer = await requireServerViewer();
  const [sets, profile, memberships] = await Promise.all([
    listSets(viewer, { athleteId: viewer.userId, limit: 50 }),
    getProfile(viewer.userId),
    listMemberships(viewer.userId),
  ]);
  const teams = memberships.filter((m) => m.role === "athlete").map((m) => m.teamName);

  return (
    <>
      <PageHeader
        title={`Hello, ${viewer.name.split(" ")[0]}`}
        description={teams.length > 0 ? `You lift for ${teams.join(" and ")}.` : undefined}
        actions={
          <div className="hidden sm:block">
            <ButtonLink href={NEW_SET_PATH}>Add a set</ButtonLink>
          </div>
        }
      />
      <div className="grid gap-5">
        {profile ? null : (
          <Banner tone="caution" title="Your profile is empty">
            Body mass, height and known maxes help check a filmed load.{" "}
            <Link href="/app/settings/profile" className="font-medium text-ink underline underline-offset-2">
              Fill it in
            </Link>
          </Banner>
        )}
        {sets.length === 0 ? (
          <EmptyState title="Film your first set">
            <p>Side view, phone still, the whole body and the bar in frame, a few reps at a working load.</p>
            <p className="mt-1">Your coach sees it as soon as it is uploaded.</p>
          </EmptyState>
        ) : (
          <section aria-labelledby="sets-heading" className="grid gap-3">
            <h2 id="sets-heading" className="text-base font-semibold">
              Your sets
            </h2>
            <SetList sets={sets} unit={profile?.unitPreference ?? "kg"} />
          </section>
        )}
        <Caution />
        <div className="sm:hidden">
          <BottomAction>
            <ButtonLink href={NEW_SET_PATH} size="lg" block>
              Add a set
            </ButtonLink>
          </BottomAction>
        </div>
      </div>
    </>
  );
}
