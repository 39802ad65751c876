// Recorded sets (metadata only for now): create one under a training session, list and read them within the access rules.
import "server-only";
import { and, desc, eq, type SQL } from "drizzle-orm";
import { db } from "@/db";
import { sets, teams, trainingSessions, user, type LiftSet } from "@/db/schema";
import type { CreateSetData } from "@/lib/validation/set";
import { setVisibleTo } from "./access";
import type { Viewer } from "./viewer";

export interface SetSummary {
  id: string;
  sessionId: string;
  sessionDate: string;
  athleteId: string;
  athleteName: string;
  teamId: string | null;
  teamName: string | null;
  lift: LiftSet["lift"];
  variant: string | null;
  loadKg: number;
  reps: number;
  rpe: number | null;
  cameraView: LiftSet["cameraView"];
  note: string | null;
  clipStatus: LiftSet["clipStatus"];
  status: LiftSet["status"];
  recordedAt: Date;
  createdAt: Date;
}

const summaryColumns = {
  id: sets.id,
  sessionId: sets.sessionId,
  sessionDate: trainingSessions.sessionDate,
  athleteId: sets.athleteId,
  athleteName: user.name,
  teamId: sets.teamId,
  teamName: teams.name,
  lift: sets.lift,
  variant: sets.variant,
  loadKg: sets.loadKg,
  reps: sets.reps,
  rpe: sets.rpe,
  cameraView: sets.cameraView,
  note: sets.note,
  clipStatus: sets.clipStatus,
  status: sets.status,
  recordedAt: sets.recordedAt,
  createdAt: sets.createdAt,
};

function selectSummaries(where: SQL | undefined) {
  return db
    .select(summaryColumns)
    .from(sets)
    .innerJoin(trainingSessions, eq(trainingSessions.id, sets.sessionId))
    .innerJoin(user, eq(user.id, sets.athleteId))
    .leftJoin(teams, eq(teams.id, sets.teamId))
    .where(where);
}

/** Newest first; only rows the viewer may read, narrowed by the optional filters. */
export async function listSets(
  viewer: Viewer,
  filters: { athleteId?: string; teamId?: string; limit: number },
): Promise<SetSummary[]> {
  const where = and(
    setVisibleTo(viewer),
    filters.athleteId ? eq(sets.athleteId, filters.athleteId) : undefined,
    filters.teamId ? eq(sets.teamId, filters.teamId) : undefined,
  );
  return selectSummaries(where).orderBy(desc(sets.recordedAt)).limit(filters.limit);
}

/** The raw row, for access checks; null when there is no such set. */
export async function findSet(setId: string): Promise<LiftSet | null> {
  const [row] = await db.select().from(sets).where(eq(sets.id, setId));
  return row ?? null;
}

export async function getSetSummary(setId: string): Promise<SetSummary | null> {
  const [row] = await selectSummaries(eq(sets.id, setId));
  return row ?? null;
}

// A back-filled set without a time is placed at midday UTC of its session date, so it sorts with its day.
function defaultRecordedAt(sessionDate: string, now: Date): Date {
  return now.toISOString().slice(0, 10) === sessionDate ? now : new Date(`${sessionDate}T12:00:00Z`);
}

/** Files a set under the athlete's training session of that day (created on first use), in one transaction. */
/** Records a set for `athleteId`; `createdBy` is whoever recorded it (the athlete, or their coach). */
export async function createSet(
  athleteId: string,
  data: Omit<CreateSetData, "athleteId">,
  { createdBy = athleteId, now = new Date() }: { createdBy?: string; now?: Date } = {},
): Promise<SetSummary> {
  const setId = await db.transaction(async (tx) => {
    const [session] = await tx
      .insert(trainingSessions)
      .values({ athleteId, teamId: data.teamId, sessionDate: data.sessionDate })
      .onConflictDoUpdate({
        target: [trainingSessions.athleteId, trainingSessions.teamId, trainingSessions.sessionDate],
        set: { updatedAt: now },
      })
      .returning({ id: trainingSessions.id });
    const [row] = await tx
      .insert(sets)
      .values({
        sessionId: session.id,
        athleteId,
        teamId: data.teamId,
        lift: data.lift,
        variant: data.variant || null,
        loadKg: data.loadKg,
        reps: data.reps,
        rpe: data.rpe,
        cameraView: data.cameraView,
        note: data.note || null,
        recordedAt: data.recordedAt ? new Date(data.recordedAt) : defaultRecordedAt(data.sessionDate, now),
        createdBy,
      })
      .returning({ id: sets.id });
    return row.id;
  });
  return (await getSetSummary(setId)) as SetSummary;
}
