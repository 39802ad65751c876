// The review desk: the coach's queue of analysed sets from their athletes, oldest first, with the filters and
// sort read from the URL. Only coaches (and admins, who see every team's sets) have one.
import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { requireCoach, requireServerViewer } from "@/lib/access";
import { ApiError } from "@/lib/errors";
import { deskQuerySchema } from "@/lib/validation/review";
import { getDesk } from "@/db/queries/desk";
import { getProfile } from "@/db/queries/profiles";
import { DeskView } from "@/components/desk/desk-view";
import { PageHeader } from "@/components/ui/page-header";

export const metadata: Metadata = { title: "Review desk" };

export default async function DeskPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const viewer = await requireServerViewer();
  try {
    await requireCoach(viewer);
  } catch (error) {
    if (error instanceof ApiError) notFound();
    throw error;
  }
  const raw = Object.fromEntries(Object.entries(await searchParams).map(([key, value]) => [key, Array.isArray(value) ? value[0] : value]));
  const query = deskQuerySchema.parse(raw);
  const [desk, profile] = await Promise.all([getDesk(viewer, query), getProfile(viewer.userId)]);
  return (
    <div className="grid gap-2">
      <PageHeader title="Review desk" description="Your athletes' analysed sets waiting for an answer, oldest first; answered and seen ones are a filter away." />
      <DeskView desk={desk} query={query} unit={profile?.unitPreference ?? "kg"} />
    </div>
  );
}
