// Trends per athlete and lift (`?athlete=<id>&lift=squat`): bar speed at given loads over time, the
// load–velocity profile and estimated 1RM, velocity loss per set, consistency over time. An athlete sees
// their own; a coach their athletes' sets under their teams; an admin everyone's.
import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { requireServerViewer } from "@/lib/access";
import { MINIMUM_VELOCITY_THRESHOLD_MPS } from "@/lib/analysis/references";
import { LIFT_LABELS } from "@/lib/client/set-form";
import { ApiError } from "@/lib/errors";
import { trendsQuerySchema } from "@/lib/validation/preferences";
import { getPreferences } from "@/db/queries/preferences";
import { defaultTrendAthlete, getTrendSets, listTrendAthletes } from "@/db/queries/trends";
import { AthleteLiftForm } from "@/components/compare/athlete-lift-form";
import { TrendCharts } from "@/components/trends/trend-charts";
import type { TrendPoint } from "@/components/trends/types";
import { Caution } from "@/components/ui/banner";
import { Card, CardBody } from "@/components/ui/card";
import { PageHeader } from "@/components/ui/page-header";

export const metadata: Metadata = { title: "Trends" };

type Search = Record<string, string | string[] | undefined>;
const first = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v);

export default async function TrendsPage({ searchParams }: { searchParams: Promise<Search> }) {
  const viewer = await requireServerViewer();
  const search = await searchParams;
  const [athletes, units] = await Promise.all([listTrendAthletes(viewer), getPreferences(viewer.userId)]);
  const query = trendsQuerySchema.safeParse({ athlete: first(search.athlete) ?? defaultTrendAthlete(athletes) ?? viewer.userId, lift: first(search.lift) ?? "squat" });
  if (!query.success) notFound();
  const { athlete, lift } = query.data;
  let sets;
  try {
    sets = await getTrendSets(viewer, athlete, lift);
  } catch (error) {
    if (error instanceof ApiError) notFound();
    throw error;
  }
  const points: TrendPoint[] = sets.map((s) => ({
    setId: s.setId,
    timeMs: s.recordedAt.getTime(),
    loadKg: s.loadKg,
    bestMeanVelocityMps: s.bestMeanVelocityMps,
    velocityLossPct: s.velocityLossPct,
    startTorsoAngleSpreadDeg: s.startTorsoAngleSpreadDeg,
    meanMaxHorizontalDeviationCm: s.meanMaxHorizontalDeviationCm,
    minDepthMarginCm: s.minDepthMarginCm,
  }));
  const name = athletes.find((a) => a.id === athlete)?.name ?? "";
  return (
    <div className="grid max-w-page grid-cols-1 gap-6">
      <PageHeader
        title={`Trends · ${LIFT_LABELS[lift]}`}
        description={`${name ? `${name} · ` : ""}${sets.length} analysed set${sets.length === 1 ? "" : "s"}`}
        actions={
          sets.length > 0 ? (
            <a href={`/api/exports/reps?athlete=${encodeURIComponent(athlete)}&lift=${lift}`} className="text-sm font-medium text-action underline-offset-2 hover:underline">
              Rep measures (CSV)
            </a>
          ) : null
        }
      />
      {athletes.length > 0 ? (
        <Card>
          <CardBody>
            <AthleteLiftForm action="/app/trends" athletes={athletes} athleteId={athlete} lift={lift} />
          </CardBody>
        </Card>
      ) : null}
      <TrendCharts points={points} units={units} showDepth={lift === "squat"} minimumVelocity={MINIMUM_VELOCITY_THRESHOLD_MPS[lift]} />
      <Caution />
    </div>
  );
}
