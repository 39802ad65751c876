// The coach's roster: athletes, open invitations and the invite form for one team (`?team=` picks which).
import type { Metadata } from "next";
import Link from "next/link";
import { notFound, redirect } from "next/navigation";
import { requireCoachOf, requireServerViewer } from "@/lib/access";
import { getRoster, listMemberships } from "@/db/queries/teams";
import { rosterSchema } from "@/lib/client/responses";
import { RosterView } from "@/components/team/roster-view";
import { PageHeader } from "@/components/ui/page-header";
import { ApiError } from "@/lib/errors";

export const metadata: Metadata = { title: "Roster" };

export default async function RosterPage({ searchParams }: { searchParams: Promise<{ team?: string | string[] }> }) {
  const viewer = await requireServerViewer();
  const coached = (await listMemberships(viewer.userId)).filter((m) => m.role === "coach");
  const { team: requested } = await searchParams;
  const teamId = typeof requested === "string" ? requested : coached[0]?.teamId;
  if (!teamId) redirect("/app");
  const team = await requireCoachOf(viewer, teamId).catch((error: unknown) => {
    if (error instanceof ApiError) notFound();
    throw error;
  });
  const roster = await getRoster(team);
  // The client receives JSON from the API, so hand it the same shape (ISO date strings).
  const initial = rosterSchema.parse(JSON.parse(JSON.stringify(roster)));

  return (
    <>
      <PageHeader
        title={team.name}
        description="Roster"
        actions={
          coached.length > 1 ? (
            <nav aria-label="Teams" className="flex flex-wrap gap-1">
              {coached.map((m) => (
                <Link
                  key={m.teamId}
                  href={`/app/roster?team=${m.teamId}`}
                  aria-current={m.teamId === team.id ? "page" : undefined}
                  className="rounded px-2.5 py-1.5 text-sm text-ink-muted hover:bg-sunken aria-[current=page]:bg-action-soft aria-[current=page]:text-action"
                >
                  {m.teamName}
                </Link>
              ))}
            </nav>
          ) : null
        }
      />
      <RosterView initial={initial} />
    </>
  );
}
