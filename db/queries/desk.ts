// The review desk: analysed sets of the coach's athletes with their review status, oldest first, filtered and
// sorted in SQL, plus counts per status and the athletes to filter by. Admins see every analysed set.
import "server-only";
import { and, asc, desc, eq, ne, sql, type SQL } from "drizzle-orm";
import type { PgSelect } from "drizzle-orm/pg-core";
import { db } from "@/db";
import { analyses, reps, setMeasures, sets, trainingSessions, user, type LiftSet } from "@/db/schema";
import { setReviews, setShares } from "@/db/schema-review";
import { REVIEW_STATUSES, type DeskQuery, type DeskStatusFilter, type ReviewStatus } from "@/lib/validation/review";
import { setVisibleTo } from "./access";
import { isAdmin, type Viewer } from "./viewer";

export interface DeskRow {
  setId: string;
  athleteId: string;
  athleteName: string;
  lift: LiftSet["lift"];
  variant: string | null;
  loadKg: number;
  sessionDate: string;
  recordedAt: Date;
  repCount: number | null;
  velocityLossPct: number | null;
  flagCount: number;
  status: ReviewStatus;
  shared: boolean;
}

export interface Desk {
  rows: DeskRow[];
  counts: Record<ReviewStatus, number>;
  athletes: { id: string; name: string }[];
}

const statusSql = sql<ReviewStatus>`coalesce(${setReviews.status}::text, 'waiting')`;
const flagCountSql = sql<number>`(coalesce(jsonb_array_length(${setMeasures.flags}), 0) + coalesce((
  select sum(jsonb_array_length(${reps.flags})) from ${reps} where ${reps.analysisId} = ${analyses.id}), 0))::int`;
const sharedSql = sql<boolean>`exists (select 1 from ${setShares} where ${setShares.setId} = ${sets.id} and ${setShares.withdrawnAt} is null)`;

/** The desk's sets: a coach sees their athletes' sets (never their own), an admin every set. */
function deskScope(viewer: Viewer): SQL | undefined {
  return isAdmin(viewer) ? undefined : and(setVisibleTo(viewer), ne(sets.athleteId, viewer.userId));
}

/** The desk's joins: only sets with a current analysis (nothing to review before), with their measures and review. */
function withDeskJoins<T extends PgSelect>(query: T) {
  return query
    .innerJoin(analyses, and(eq(analyses.setId, sets.id), eq(analyses.isCurrent, true)))
    .innerJoin(trainingSessions, eq(trainingSessions.id, sets.sessionId))
    .innerJoin(user, eq(user.id, sets.athleteId))
    .leftJoin(setMeasures, eq(setMeasures.analysisId, analyses.id))
    .leftJoin(setReviews, eq(setReviews.setId, sets.id));
}

const ORDER: Record<DeskQuery["sort"], SQL[]> = {
  oldest: [asc(sets.recordedAt), asc(sets.createdAt)],
  newest: [desc(sets.recordedAt), desc(sets.createdAt)],
  athlete: [asc(user.name), asc(sets.recordedAt), asc(sets.createdAt)],
  velocityLoss: [sql`${setMeasures.velocityLossPct} desc nulls last`, asc(sets.recordedAt), asc(sets.createdAt)],
  flags: [sql`${flagCountSql} desc`, asc(sets.recordedAt), asc(sets.createdAt)],
};

function statusCondition(filter: DeskStatusFilter): SQL | undefined {
  if (filter === "all") return undefined;
  if (filter === "open") return sql`${statusSql} in ('waiting', 'in_review')`;
  return sql`${statusSql} = ${filter}`;
}

export async function getDesk(viewer: Viewer, query: DeskQuery, limit = 500): Promise<Desk> {
  const scope = deskScope(viewer);
  const narrowed = and(
    scope,
    query.athlete ? eq(sets.athleteId, query.athlete) : undefined,
    query.lift ? eq(sets.lift, query.lift) : undefined,
  );
  const rowsSelect = db
    .select({
      setId: sets.id,
      athleteId: sets.athleteId,
      athleteName: user.name,
      lift: sets.lift,
      variant: sets.variant,
      loadKg: sets.loadKg,
      sessionDate: trainingSessions.sessionDate,
      recordedAt: sets.recordedAt,
      repCount: setMeasures.repCount,
      velocityLossPct: setMeasures.velocityLossPct,
      flagCount: flagCountSql,
      status: statusSql,
      shared: sharedSql,
    })
    .from(sets)
    .$dynamic();
  const rowsQuery = withDeskJoins(rowsSelect)
    .where(and(narrowed, statusCondition(query.status)))
    .orderBy(...ORDER[query.sort])
    .limit(limit);
  const countsQuery = withDeskJoins(db.select({ status: statusSql, n: sql<number>`count(*)::int` }).from(sets).$dynamic())
    .where(narrowed)
    .groupBy(statusSql);
  const athletesQuery = withDeskJoins(db.select({ id: sets.athleteId, name: user.name }).from(sets).$dynamic())
    .where(scope)
    .groupBy(sets.athleteId, user.name)
    .orderBy(asc(user.name));
  const [rows, countRows, athletes] = await Promise.all([rowsQuery, countsQuery, athletesQuery]);
  const counts = Object.fromEntries(REVIEW_STATUSES.map((s) => [s, 0])) as Record<ReviewStatus, number>;
  for (const row of countRows) counts[row.status] = row.n;
  return { rows, counts, athletes };
}
