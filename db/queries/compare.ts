// Rep compare: the chosen reps with their measures, phase times and 101-point series, each with its set,
// athlete and clip/track keys, in two queries whatever the number of reps; and the reps of recent sets of
// the same athlete and lift to pick from. Only reps of current analyses of sets the viewer may read.
import "server-only";
import { and, desc, eq, getTableColumns, inArray, ne } from "drizzle-orm";
import { db } from "@/db";
import { analyses, repSeries, reps, sets, trainingSessions, user, type LiftSet, type Rep } from "@/db/schema";
import { SERIES_POINTS } from "@/lib/analysis/result";
import { ApiError } from "@/lib/errors";
import type { Lift } from "@/lib/validation/common";
import { setVisibleTo } from "./access";
import { STORED_SERIES, type StoredSeriesName } from "./analyses";
import type { Viewer } from "./viewer";

export type CompareRepMeasures = Omit<Rep, "analysisId" | "createdAt">;

export interface CompareRep {
  rep: CompareRepMeasures;
  series: Partial<Record<StoredSeriesName, number[]>>;
  set: {
    id: string;
    athleteId: string;
    athleteName: string;
    lift: Lift;
    variant: string | null;
    loadKg: number;
    repsDone: number;
    cameraView: LiftSet["cameraView"];
    sessionDate: string;
    recordedAt: Date;
    clipStatus: LiftSet["clipStatus"];
    clipStorageKey: string | null;
    clipConvertedKey: string | null;
    clipWidthPx: number | null;
    clipHeightPx: number | null;
  };
  analysis: { id: string; trackStorageKey: string | null; metresPerPixel: number };
}

const { analysisId: _analysisId, createdAt: _createdAt, ...repColumns } = getTableColumns(reps);

const setColumns = {
  id: sets.id,
  athleteId: sets.athleteId,
  athleteName: user.name,
  lift: sets.lift,
  variant: sets.variant,
  loadKg: sets.loadKg,
  repsDone: sets.reps,
  cameraView: sets.cameraView,
  sessionDate: trainingSessions.sessionDate,
  recordedAt: sets.recordedAt,
  clipStatus: sets.clipStatus,
  clipStorageKey: sets.clipStorageKey,
  clipConvertedKey: sets.clipConvertedKey,
  clipWidthPx: sets.clipWidthPx,
  clipHeightPx: sets.clipHeightPx,
};

/**
 * The reps in the order asked for (the first is the reference). A rep that does not exist, belongs to a
 * replaced analysis or to a set the viewer may not read is refused with one message, so the answer never
 * tells which.
 */
export async function getCompareReps(viewer: Viewer, repIds: readonly string[]): Promise<CompareRep[]> {
  // The series are read alongside (they are keyed by the rep ids asked for) and only used once every rep passed.
  const [rows, seriesRows] = await Promise.all([
    db
      .select({ rep: repColumns, set: setColumns, analysis: { id: analyses.id, trackStorageKey: analyses.trackStorageKey, metresPerPixel: analyses.scaleMetresPerPixel } })
      .from(reps)
      .innerJoin(analyses, and(eq(analyses.id, reps.analysisId), eq(analyses.isCurrent, true)))
      .innerJoin(sets, eq(sets.id, analyses.setId))
      .innerJoin(trainingSessions, eq(trainingSessions.id, sets.sessionId))
      .innerJoin(user, eq(user.id, sets.athleteId))
      .where(and(inArray(reps.id, [...repIds]), setVisibleTo(viewer))),
    db.select().from(repSeries).where(inArray(repSeries.repId, [...repIds])),
  ]);
  if (rows.length !== repIds.length) {
    throw new ApiError("forbidden:rep", "One of these reps does not exist or you do not have access to it.");
  }
  const lifts = new Set(rows.map((r) => r.set.lift));
  if (lifts.size > 1) throw new ApiError("bad_request:compare", "Only reps of the same lift can be compared.");
  const seriesOf = new Map<string, Partial<Record<StoredSeriesName, number[]>>>();
  for (const row of seriesRows) {
    if (row.points.length !== SERIES_POINTS || !(STORED_SERIES as readonly string[]).includes(row.name)) continue;
    const bucket = seriesOf.get(row.repId) ?? {};
    bucket[row.name as StoredSeriesName] = row.points;
    seriesOf.set(row.repId, bucket);
  }
  const byId = new Map(rows.map((r) => [r.rep.id, r]));
  return repIds.map((id) => {
    const row = byId.get(id) as (typeof rows)[number];
    return { ...row, series: seriesOf.get(id) ?? {} };
  });
}

export interface PickableSet {
  setId: string;
  sessionDate: string;
  recordedAt: Date;
  loadKg: number;
  variant: string | null;
  reps: { id: string; repIndex: number; meanConcentricVelocityMps: number | null }[];
}

/** Recent analysed sets of one athlete and lift the viewer may read, newest first, with their reps. */
export async function listPickableSets(
  viewer: Viewer,
  filters: { athleteId: string; lift: Lift; limit: number; excludeSetId?: string },
): Promise<PickableSet[]> {
  const found = await db
    .select({
      setId: sets.id,
      sessionDate: trainingSessions.sessionDate,
      recordedAt: sets.recordedAt,
      loadKg: sets.loadKg,
      variant: sets.variant,
      analysisId: analyses.id,
    })
    .from(sets)
    .innerJoin(analyses, and(eq(analyses.setId, sets.id), eq(analyses.isCurrent, true)))
    .innerJoin(trainingSessions, eq(trainingSessions.id, sets.sessionId))
    .where(
      and(
        eq(sets.athleteId, filters.athleteId),
        eq(sets.lift, filters.lift),
        filters.excludeSetId ? ne(sets.id, filters.excludeSetId) : undefined,
        setVisibleTo(viewer),
      ),
    )
    .orderBy(desc(sets.recordedAt))
    .limit(filters.limit);
  if (found.length === 0) return [];
  const repRows = await db
    .select({ id: reps.id, analysisId: reps.analysisId, repIndex: reps.repIndex, meanConcentricVelocityMps: reps.meanConcentricVelocityMps })
    .from(reps)
    .where(inArray(reps.analysisId, found.map((s) => s.analysisId)))
    .orderBy(reps.repIndex);
  return found.map(({ analysisId, ...set }) => ({
    ...set,
    reps: repRows.filter((r) => r.analysisId === analysisId).map(({ analysisId: _a, ...r }) => r),
  }));
}
