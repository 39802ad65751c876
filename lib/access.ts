// Role checks used by every route and page: who is signed in, and may they touch this team, athlete or set.
// Each helper returns what it checked (the team, the set) or throws an ApiError (401/403/404).
import "server-only";
import { headers as nextHeaders } from "next/headers";
import { redirect } from "next/navigation";
import { auth } from "@/lib/auth";
import { ApiError } from "@/lib/errors";
import { uuidSchema } from "@/lib/validation/common";
import { canReadSet, coachesAthlete, teamRolesOf } from "@/db/queries/access";
import { getTeam } from "@/db/queries/teams";
import { findSet } from "@/db/queries/sets";
import { isAdmin, type Viewer } from "@/db/queries/viewer";
import type { LiftSet, Team } from "@/db/schema";
import type { MembershipRole } from "@/lib/validation/common";

export type { Viewer };

export async function getViewer(requestHeaders: Headers): Promise<Viewer | null> {
  const found = await auth.api.getSession({ headers: requestHeaders });
  if (!found) return null;
  const { user } = found;
  return {
    userId: user.id,
    name: user.name,
    email: user.email,
    role: user.role === "admin" ? "admin" : "user",
    emailVerified: user.emailVerified,
  };
}

/** For route handlers: the viewer, or 401. */
export async function requireSession(request: Request): Promise<Viewer> {
  const viewer = await getViewer(request.headers);
  if (!viewer) throw new ApiError("unauthorized:auth", "Please sign in first.");
  return viewer;
}

/** For server components: the viewer or null. */
export async function getServerViewer(): Promise<Viewer | null> {
  return getViewer(await nextHeaders());
}

/** For server components under /app: the viewer, or a redirect to the sign-in page. */
export async function requireServerViewer(): Promise<Viewer> {
  const viewer = await getServerViewer();
  if (!viewer) redirect("/sign-in");
  return viewer;
}

function parseTeamId(teamId: string): string {
  const parsed = uuidSchema.safeParse(teamId);
  if (!parsed.success) throw new ApiError("not_found:team", "There is no such team.");
  return parsed.data;
}

async function requireTeamRole(viewer: Viewer, teamId: string, allowed: MembershipRole[], refusal: string): Promise<Team> {
  const id = parseTeamId(teamId);
  const roles = await teamRolesOf(viewer.userId, id);
  if (!isAdmin(viewer) && !roles.some((role) => allowed.includes(role))) throw new ApiError("forbidden:team", refusal);
  const team = await getTeam(id);
  if (!team) throw new ApiError("not_found:team", "There is no such team.");
  return team;
}

/** The viewer coaches the team (or is an admin). */
export function requireCoachOf(viewer: Viewer, teamId: string): Promise<Team> {
  return requireTeamRole(viewer, teamId, ["coach"], "Only the team's coaches can do this.");
}

/** The viewer coaches or lifts on the team (or is an admin). */
export function requireTeamMember(viewer: Viewer, teamId: string): Promise<Team> {
  return requireTeamRole(viewer, teamId, ["coach", "athlete"], "You are not a member of this team.");
}

/** The viewer lifts on the team: sets are only filed under teams the athlete belongs to (admins excepted). */
export function requireAthleteOf(viewer: Viewer, teamId: string): Promise<Team> {
  return requireTeamRole(viewer, teamId, ["athlete"], "You can only record sets for a team you lift on.");
}

/**
 * Whose a new set is: the viewer's own (filed under a team they lift on, if any), or, for a coach of the
 * team (or an admin), one of the team's athletes. Returns the athlete's id.
 */
export async function requireSetOwner(viewer: Viewer, target: { athleteId: string | null; teamId: string | null }): Promise<string> {
  const athleteId = target.athleteId ?? viewer.userId;
  if (athleteId === viewer.userId) {
    if (target.teamId) await requireAthleteOf(viewer, target.teamId);
    return athleteId;
  }
  // Filed under the team: that is what lets the athlete's coaches see it (db/queries/access.ts).
  if (!target.teamId) throw new ApiError("bad_request:set", "Choose the team the athlete's set is recorded for.");
  await requireCoachOf(viewer, target.teamId);
  if (!(await teamRolesOf(athleteId, target.teamId)).includes("athlete")) {
    throw new ApiError("forbidden:athlete", "That person does not lift on this team.");
  }
  return athleteId;
}

/** The viewer is the athlete, coaches them on some team, or is an admin. */
export async function requireAthleteAccess(viewer: Viewer, athleteId: string): Promise<void> {
  if (athleteId === viewer.userId || isAdmin(viewer)) return;
  if (!(await coachesAthlete(viewer, athleteId))) throw new ApiError("forbidden:athlete", "You do not coach this athlete.");
}

/** The set exists and the viewer may read it (see db/queries/access.ts for the rules). */
export async function requireSetAccess(viewer: Viewer, setId: string): Promise<LiftSet> {
  const id = uuidSchema.safeParse(setId);
  const set = id.success ? await findSet(id.data) : null;
  if (!set) throw new ApiError("not_found:set", "There is no such set.");
  if (!(await canReadSet(viewer, set))) throw new ApiError("forbidden:set", "You do not have access to this set.");
  return set;
}
