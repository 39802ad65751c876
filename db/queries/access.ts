// Access rules next to the data: who coaches or lifts on which team, and which sets a viewer may read.
// An athlete reads their own sets; a coach reads the sets recorded under their team by its current athletes;
// nobody reads another team's; an admin reads everything.
import "server-only";
import { and, eq, exists, or, sql, type SQL } from "drizzle-orm";
import { db, type Executor } from "@/db";
import { memberships, sets, type LiftSet } from "@/db/schema";
import type { MembershipRole } from "@/lib/validation/common";
import { isAdmin, type Viewer } from "./viewer";

export async function teamRolesOf(userId: string, teamId: string, executor: Executor = db): Promise<MembershipRole[]> {
  const rows = await executor
    .select({ role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.userId, userId), eq(memberships.teamId, teamId)));
  return rows.map((row) => row.role);
}

export async function isCoachOf(userId: string, teamId: string, executor: Executor = db): Promise<boolean> {
  return (await teamRolesOf(userId, teamId, executor)).includes("coach");
}

/** True when the viewer coaches a team on which `athleteId` currently lifts. */
export async function coachesAthlete(viewer: Viewer, athleteId: string): Promise<boolean> {
  const rows = await db.execute<{ found: number }>(sql`
    select 1 as found from ${memberships} c
    join ${memberships} a on a.team_id = c.team_id and a.role = 'athlete'
    where c.user_id = ${viewer.userId} and c.role = 'coach' and a.user_id = ${athleteId}
    limit 1`);
  return rows.rows.length > 0;
}

/** SQL condition on `sets` selecting the rows the viewer may read (see the rules at the top). */
export function setVisibleTo(viewer: Viewer): SQL | undefined {
  if (isAdmin(viewer)) return undefined;
  const coach = db
    .select({ one: sql`1` })
    .from(memberships)
    .where(and(eq(memberships.teamId, sets.teamId), eq(memberships.userId, viewer.userId), eq(memberships.role, "coach")));
  const athleteStillOnTeam = db
    .select({ one: sql`1` })
    .from(memberships)
    .where(and(eq(memberships.teamId, sets.teamId), eq(memberships.userId, sets.athleteId), eq(memberships.role, "athlete")));
  return or(eq(sets.athleteId, viewer.userId), and(exists(coach), exists(athleteStillOnTeam)));
}

export async function canReadSet(viewer: Viewer, set: Pick<LiftSet, "athleteId" | "teamId">): Promise<boolean> {
  if (isAdmin(viewer) || set.athleteId === viewer.userId) return true;
  if (!set.teamId) return false;
  const [coach, athleteRoles] = await Promise.all([
    isCoachOf(viewer.userId, set.teamId),
    teamRolesOf(set.athleteId, set.teamId),
  ]);
  return coach && athleteRoles.includes("athlete");
}
