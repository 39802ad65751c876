// Rep compare: `?reps=<id>,<id>[,…]` lays two or more reps of one lift side by side and over each other
// (same set, other sets, other sessions). Without reps it offers a picker by athlete and lift.
import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { requireServerViewer } from "@/lib/access";
import { ApiError } from "@/lib/errors";
import { LIFT_LABELS } from "@/lib/client/set-form";
import { compareViews } from "@/lib/compare/page-data";
import { displayMass, type DisplayUnits } from "@/lib/compare/units";
import { compareQuerySchema, trendsQuerySchema } from "@/lib/validation/preferences";
import { getCompareReps, listPickableSets, type PickableSet } from "@/db/queries/compare";
import { getPreferences } from "@/db/queries/preferences";
import { defaultTrendAthlete, listTrendAthletes } from "@/db/queries/trends";
import type { Viewer } from "@/db/queries/viewer";
import { AthleteLiftForm } from "@/components/compare/athlete-lift-form";
import { RepCompare } from "@/components/compare/rep-compare";
import { RepPicker, type PickerSet } from "@/components/compare/rep-picker";
import { Card, CardBody, CardHeader } from "@/components/ui/card";
import { formatNumber } from "@/components/ui/measure";
import { PageHeader } from "@/components/ui/page-header";

export const metadata: Metadata = { title: "Rep compare" };

type Search = Record<string, string | string[] | undefined>;
const first = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v);

function pickerSets(sets: PickableSet[], units: DisplayUnits): PickerSet[] {
  return sets.map((s) => ({
    setId: s.setId,
    sessionDate: s.sessionDate,
    load: `${formatNumber(displayMass(s.loadKg, units), 1)} ${units.mass}`,
    variant: s.variant,
    reps: s.reps,
  }));
}

async function readableReps(viewer: Viewer, ids: string[]) {
  try {
    return await getCompareReps(viewer, ids);
  } catch (error) {
    // Someone else's rep looks exactly like a missing one.
    if (error instanceof ApiError) notFound();
    throw error;
  }
}

async function Landing({ viewer, search, units }: { viewer: Viewer; search: Search; units: DisplayUnits }) {
  const athletes = await listTrendAthletes(viewer);
  const chosen = trendsQuerySchema.safeParse({ athlete: first(search.athlete) ?? defaultTrendAthlete(athletes), lift: first(search.lift) ?? "squat" });
  const sets = chosen.success
    ? await listPickableSets(viewer, { athleteId: chosen.data.athlete, lift: chosen.data.lift, limit: 12 })
    : [];
  return (
    <div className="grid max-w-4xl grid-cols-1 gap-6">
      <PageHeader title="Rep compare" description="Pick two or more reps of one lift: from one set, or across sets and sessions." />
      {athletes.length === 0 ? (
        <p className="text-sm text-ink-muted">There are no sets to compare yet. Record and analyse a set first.</p>
      ) : (
        <Card>
          <CardBody className="grid gap-5">
            <AthleteLiftForm action="/app/compare" athletes={athletes} athleteId={chosen.data?.athlete} lift={chosen.data?.lift} />
            <RepPicker sets={pickerSets(sets, units)} initial={[]} />
          </CardBody>
        </Card>
      )}
    </div>
  );
}

export default async function ComparePage({ searchParams }: { searchParams: Promise<Search> }) {
  const viewer = await requireServerViewer();
  const search = await searchParams;
  const units = await getPreferences(viewer.userId);
  const query = compareQuerySchema.safeParse({ reps: first(search.reps) });
  if (!query.success) return <Landing viewer={viewer} search={search} units={units} />;

  const rows = await readableReps(viewer, query.data.reps);
  const [views, pickable] = await Promise.all([
    compareViews(rows, units),
    listPickableSets(viewer, { athleteId: rows[0].set.athleteId, lift: rows[0].set.lift, limit: 12 }),
  ]);
  const athletes = [...new Set(rows.map((r) => r.set.athleteName))];
  return (
    <div className="grid max-w-page grid-cols-1 gap-6">
      <PageHeader
        title={`Rep compare · ${LIFT_LABELS[rows[0].set.lift]}`}
        description={`${athletes.join(", ")} · ${views.map((v) => v.label).join(" vs ")}`}
      />
      <RepCompare reps={views} units={units} />
      <Card>
        <CardHeader title="Compare other reps" description="Recent analysed sets of this athlete and lift, from any session." />
        <CardBody>
          <RepPicker sets={pickerSets(pickable, units)} initial={query.data.reps} />
        </CardBody>
      </Card>
    </div>
  );
}
