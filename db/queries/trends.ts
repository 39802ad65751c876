// Trends per athlete and lift: one row per analysed set (load, best and last rep speed, velocity loss,
// start back angle spread, bar drift, depth margin), read in one query with the reps aggregated beside
// each set; and the athletes a viewer may pick.
import "server-only";
import { and, asc, eq, sql } from "drizzle-orm";
import { db } from "@/db";
import { analyses, reps, setMeasures, sets, trainingSessions, user } from "@/db/schema";
import { ApiError } from "@/lib/errors";
import type { Lift } from "@/lib/validation/common";
import { coachesAthlete, setVisibleTo } from "./access";
import { isAdmin, type Viewer } from "./viewer";

export interface TrendSet {
  setId: string;
  sessionDate: string;
  recordedAt: Date;
  loadKg: number;
  repsDone: number;
  variant: string | null;
  repCount: number;
  bestMeanVelocityMps: number | null;
  lastMeanVelocityMps: number | null;
  velocityLossPct: number | null;
  /** Standard deviation of the torso angle at the start of each rep (set measure). */
  startTorsoAngleSpreadDeg: number | null;
  barPathConsistencyCm: number | null;
  /** Mean over the reps of the bar's largest horizontal distance from the plumb line through its start. */
  meanMaxHorizontalDeviationCm: number | null;
  /** Mean over the reps of the absolute drift at lockout. */
  meanAbsNetDriftCm: number | null;
  /** The set's shallowest rep (lowest depth margin); null where depth is not measured. */
  minDepthMarginCm: number | null;
}

/**
 * The athlete, a coach of theirs, or an admin (the rule of requireAthleteAccess in lib/access.ts, built on the
 * same helper so these queries also run outside a request); a refused viewer gets 403 whether or not the
 * athlete exists.
 */
export async function requireAthleteData(viewer: Viewer, athleteId: string): Promise<void> {
  if (athleteId === viewer.userId || isAdmin(viewer)) return;
  if (!(await coachesAthlete(viewer, athleteId))) throw new ApiError("forbidden:athlete", "You do not coach this athlete.");
}

/** Oldest first. Only sets with a current analysis that the viewer may read (a coach sees their team's). */
export async function getTrendSets(viewer: Viewer, athleteId: string, lift: Lift): Promise<TrendSet[]> {
  await requireAthleteData(viewer, athleteId);
  const perRep = db
    .select({
      meanMaxDeviationCm: sql<number | null>`avg(${reps.maxHorizontalDeviationCm})`.as("mean_max_deviation_cm"),
      meanAbsNetDriftCm: sql<number | null>`avg(abs(${reps.netHorizontalDriftCm}))`.as("mean_abs_net_drift_cm"),
      minDepthMarginCm: sql<number | null>`min(${reps.depthMarginCm})`.as("min_depth_margin_cm"),
    })
    .from(reps)
    .where(eq(reps.analysisId, analyses.id))
    .as("per_rep");
  return db
    .select({
      setId: sets.id,
      sessionDate: trainingSessions.sessionDate,
      recordedAt: sets.recordedAt,
      loadKg: sets.loadKg,
      repsDone: sets.reps,
      variant: sets.variant,
      repCount: setMeasures.repCount,
      bestMeanVelocityMps: setMeasures.bestMeanVelocityMps,
      lastMeanVelocityMps: setMeasures.lastMeanVelocityMps,
      velocityLossPct: setMeasures.velocityLossPct,
      startTorsoAngleSpreadDeg: setMeasures.startTorsoAngleSpreadDeg,
      barPathConsistencyCm: setMeasures.barPathConsistencyCm,
      meanMaxHorizontalDeviationCm: perRep.meanMaxDeviationCm,
      meanAbsNetDriftCm: perRep.meanAbsNetDriftCm,
      minDepthMarginCm: perRep.minDepthMarginCm,
    })
    .from(sets)
    .innerJoin(analyses, and(eq(analyses.setId, sets.id), eq(analyses.isCurrent, true)))
    .innerJoin(setMeasures, eq(setMeasures.analysisId, analyses.id))
    .innerJoin(trainingSessions, eq(trainingSessions.id, sets.sessionId))
    .leftJoinLateral(perRep, sql`true`)
    .where(and(eq(sets.athleteId, athleteId), eq(sets.lift, lift), setVisibleTo(viewer)))
    .orderBy(asc(sets.recordedAt));
}

export interface TrendAthlete {
  id: string;
  name: string;
  /** When their latest analysed set was recorded, if any: pages open on the most recently analysed athlete. */
  lastAnalysedAt: Date | null;
}

/** Athletes with at least one set the viewer may read, by name (the viewer first when they lift). */
export async function listTrendAthletes(viewer: Viewer): Promise<TrendAthlete[]> {
  const rows = await db
    .select({
      id: sets.athleteId,
      name: user.name,
      lastAnalysedAt: sql<Date | null>`max(${sets.recordedAt}) filter (where ${sets.status} = 'analysed')`.mapWith((v: string | null) =>
        v === null ? null : new Date(v),
      ),
    })
    .from(sets)
    .innerJoin(user, eq(user.id, sets.athleteId))
    .where(setVisibleTo(viewer))
    .groupBy(sets.athleteId, user.name)
    .orderBy(asc(user.name));
  return [...rows.filter((r) => r.id === viewer.userId), ...rows.filter((r) => r.id !== viewer.userId)];
}

/** The athlete a page opens on: the one analysed most recently, else the first listed. */
export function defaultTrendAthlete(athletes: readonly TrendAthlete[]): string | undefined {
  const analysed = athletes.filter((a) => a.lastAnalysedAt !== null);
  if (analysed.length === 0) return athletes[0]?.id;
  return analysed.reduce((best, a) => ((a.lastAnalysedAt as Date) > (best.lastAnalysedAt as Date) ? a : best)).id;
}
