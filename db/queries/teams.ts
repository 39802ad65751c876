// Teams and memberships: create a team (its creator coaches it), list a person's teams, the coach's roster, remove an athlete.
import "server-only";
import { and, asc, desc, eq, max } from "drizzle-orm";
import { db } from "@/db";
import { invitations, memberships, sets, teams, user, type Team } from "@/db/schema";
import type { MembershipRole } from "@/lib/validation/common";
import { invitationStatus, type InvitationStatus } from "./invitation-status";

export interface MembershipSummary {
  teamId: string;
  teamName: string;
  role: MembershipRole;
}

export interface RosterAthlete {
  userId: string;
  name: string;
  email: string;
  joinedAt: Date;
  lastSetAt: Date | null;
}

export interface RosterInvitation {
  id: string;
  email: string;
  status: InvitationStatus;
  expiresAt: Date;
  createdAt: Date;
}

export interface Roster {
  team: { id: string; name: string };
  athletes: RosterAthlete[];
  invitations: RosterInvitation[];
}

/** Creates the team and makes its creator the coach, in one transaction. */
export async function createTeam(creatorId: string, name: string): Promise<Team> {
  return db.transaction(async (tx) => {
    const [team] = await tx.insert(teams).values({ name, createdBy: creatorId }).returning();
    await tx.insert(memberships).values({ teamId: team.id, userId: creatorId, role: "coach" });
    return team;
  });
}

export async function getTeam(teamId: string): Promise<Team | null> {
  const [team] = await db.select().from(teams).where(eq(teams.id, teamId));
  return team ?? null;
}

export async function listMemberships(userId: string): Promise<MembershipSummary[]> {
  return db
    .select({ teamId: teams.id, teamName: teams.name, role: memberships.role })
    .from(memberships)
    .innerJoin(teams, eq(teams.id, memberships.teamId))
    .where(eq(memberships.userId, userId))
    .orderBy(asc(memberships.createdAt));
}

export async function getRoster(team: Pick<Team, "id" | "name">, now = new Date()): Promise<Roster> {
  const athletes = await db
    .select({
      userId: user.id,
      name: user.name,
      email: user.email,
      joinedAt: memberships.createdAt,
      lastSetAt: max(sets.recordedAt),
    })
    .from(memberships)
    .innerJoin(user, eq(user.id, memberships.userId))
    .leftJoin(sets, and(eq(sets.athleteId, memberships.userId), eq(sets.teamId, memberships.teamId)))
    .where(and(eq(memberships.teamId, team.id), eq(memberships.role, "athlete")))
    .groupBy(user.id, memberships.createdAt)
    .orderBy(asc(user.name));
  const invitationRows = await db
    .select()
    .from(invitations)
    .where(eq(invitations.teamId, team.id))
    .orderBy(desc(invitations.createdAt));
  return {
    team: { id: team.id, name: team.name },
    athletes,
    invitations: invitationRows.map((row) => ({
      id: row.id,
      email: row.email,
      status: invitationStatus(row, now),
      expiresAt: row.expiresAt,
      createdAt: row.createdAt,
    })),
  };
}

/** Ends an athlete's membership; their sets stay theirs (the team's coaches simply stop seeing them). */
export async function removeAthlete(teamId: string, userId: string): Promise<boolean> {
  const removed = await db
    .delete(memberships)
    .where(and(eq(memberships.teamId, teamId), eq(memberships.userId, userId), eq(memberships.role, "athlete")))
    .returning({ id: memberships.id });
  return removed.length > 0;
}
