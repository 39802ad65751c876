// Rep measures for CSV export: one row per rep of current analyses, for one set, one athlete (optionally
// between two session dates) or every readable set between two dates, in one query.
import "server-only";
import { and, asc, eq, gte, lte } from "drizzle-orm";
import { db } from "@/db";
import { analyses, reps, sets, teams, trainingSessions, user } from "@/db/schema";
import type { CsvRep } from "@/lib/exports/rep-csv";
import { ApiError } from "@/lib/errors";
import type { Lift } from "@/lib/validation/common";
import type { RepExportQuery } from "@/lib/validation/preferences";
import { canReadSet, setVisibleTo } from "./access";
import { findSet } from "./sets";
import { requireAthleteData } from "./trends";
import type { Viewer } from "./viewer";

/** Only the columns the CSV writes (lib/exports/rep-csv.ts). */
const CSV_REP_COLUMNS = {
  repIndex: reps.repIndex,
  romM: reps.romM,
  meanConcentricVelocityMps: reps.meanConcentricVelocityMps,
  peakConcentricVelocityMps: reps.peakConcentricVelocityMps,
  meanPropulsiveVelocityMps: reps.meanPropulsiveVelocityMps,
  concentricDurationS: reps.concentricDurationS,
  eccentricDurationS: reps.eccentricDurationS,
  pauseDurationS: reps.pauseDurationS,
  stickingPointHeightM: reps.stickingPointHeightM,
  maxHorizontalDeviationCm: reps.maxHorizontalDeviationCm,
  netHorizontalDriftCm: reps.netHorizontalDriftCm,
  pathLengthM: reps.pathLengthM,
  kneeAngleAtBottomDeg: reps.kneeAngleAtBottomDeg,
  hipAngleAtBottomDeg: reps.hipAngleAtBottomDeg,
  torsoAngleAtStartDeg: reps.torsoAngleAtStartDeg,
  torsoAngleAtBottomDeg: reps.torsoAngleAtBottomDeg,
  depthMarginCm: reps.depthMarginCm,
  depthReached: reps.depthReached,
  barOverMidFootOffsetCm: reps.barOverMidFootOffsetCm,
  kneeProjectionAngleDeg: reps.kneeProjectionAngleDeg,
} satisfies Record<keyof CsvRep["rep"], unknown>;

/** A generous cap so one request cannot pull the whole database. */
export const MAX_EXPORT_ROWS = 50_000;

export interface ExportRow {
  athleteName: string;
  teamName: string | null;
  sessionDate: string;
  recordedAt: Date;
  setId: string;
  lift: Lift;
  variant: string | null;
  loadKg: number;
  rpe: number | null;
  rep: CsvRep["rep"];
  flagCodes: string[];
}

async function checkScope(viewer: Viewer, query: RepExportQuery): Promise<void> {
  if (query.set) {
    const set = await findSet(query.set);
    if (!set) throw new ApiError("not_found:set", "There is no such set.");
    if (!(await canReadSet(viewer, set))) throw new ApiError("forbidden:set", "You do not have access to this set.");
  }
  if (query.athlete) await requireAthleteData(viewer, query.athlete);
}

export async function listRepsForExport(viewer: Viewer, query: RepExportQuery): Promise<ExportRow[]> {
  await checkScope(viewer, query);
  const rows = await db
    .select({
      athleteName: user.name,
      teamName: teams.name,
      sessionDate: trainingSessions.sessionDate,
      recordedAt: sets.recordedAt,
      setId: sets.id,
      lift: sets.lift,
      variant: sets.variant,
      loadKg: sets.loadKg,
      rpe: sets.rpe,
      rep: CSV_REP_COLUMNS,
      flags: reps.flags,
    })
    .from(reps)
    .innerJoin(analyses, and(eq(analyses.id, reps.analysisId), eq(analyses.isCurrent, true)))
    .innerJoin(sets, eq(sets.id, analyses.setId))
    .innerJoin(trainingSessions, eq(trainingSessions.id, sets.sessionId))
    .innerJoin(user, eq(user.id, sets.athleteId))
    .leftJoin(teams, eq(teams.id, sets.teamId))
    .where(
      and(
        query.set ? eq(sets.id, query.set) : undefined,
        query.athlete ? eq(sets.athleteId, query.athlete) : undefined,
        query.lift ? eq(sets.lift, query.lift) : undefined,
        query.from ? gte(trainingSessions.sessionDate, query.from) : undefined,
        query.to ? lte(trainingSessions.sessionDate, query.to) : undefined,
        setVisibleTo(viewer),
      ),
    )
    .orderBy(asc(sets.recordedAt), asc(sets.id), asc(reps.repIndex))
    .limit(MAX_EXPORT_ROWS);
  return rows.map(({ flags: repFlags, ...row }) => ({ ...row, flagCodes: repFlags.map((f) => f.code) }));
}
