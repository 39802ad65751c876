// Role checks used by every route and page: who is signed in, and may they touch this team, athlete or set.
// Each helper returns what it checked (the team, the set) or throws an ApiError (401/403/404).
import "server-only";
import { headers as nextHeaders } from "next/headers";
import { redirect } from "next/navigation";
import { auth } from "@/lib/auth";
import { ApiError } from "@/lib/errors";
import { uuidSchema } from "@/lib/validation/common";
import { canReadSet, coachesAthlete, isCoachOf, teamRolesOf } from "@/db/queries/access";
import { findActiveShare } from "@/db/queries/shares";
import { canEditReviewRole, type SetReaderRole } from "@/lib/review/status";
import { getTeam, listMemberships } from "@/db/queries/teams";
import { findSet } from "@/db/queries/sets";
import { isAdmin, type Viewer } from "@/db/queries/viewer";
import { findReviewCredit, membershipAccess } from "@/db/queries/billing";
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
 * The viewer lifts on the team, admins included only when they do: paying (checkout, the provider's portal) is the
 * athlete's own membership, and an admin who is not an athlete of the team has none to pay.
 */
export async function requirePayingAthleteOf(viewer: Viewer, teamId: string): Promise<Team> {
  const id = parseTeamId(teamId);
  if (!(await teamRolesOf(viewer.userId, id)).includes("athlete")) {
    throw new ApiError("forbidden:team", "Only the team's athletes pay for a membership or a review.");
  }
  const team = await getTeam(id);
  if (!team) throw new ApiError("not_found:team", "There is no such team.");
  return team;
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

/** Whose membership an upload or review request draws on: the athlete's, on the team the set is filed under. */
export interface BilledWork {
  athleteId: string;
  teamId: string | null;
}

const PAUSED =
  "Your membership has lapsed, so new uploads and review requests are paused. Everything you recorded stays readable and exportable; pay your coach to carry on.";

/**
 * Uploads (a new set, a new clip) need a paid, comped or still-running membership when the team charges; a free
 * team, a personal set, the team's coach and admins pass. 402 `payment_required:membership` otherwise.
 */
export async function requireUploadAllowed(viewer: Viewer, work: BilledWork): Promise<void> {
  if (!work.teamId || isAdmin(viewer) || (await isCoachOf(viewer.userId, work.teamId))) return;
  const access = await membershipAccess(work.athleteId, work.teamId);
  if (!access.priced || access.view.uploadsAllowed) return;
  throw new ApiError("payment_required:membership", PAUSED);
}

/**
 * Review requests: as uploads, or else an unused paid single review (which the request then spends with
 * `useReviewCredit` from db/queries/billing.ts inside its own transaction). Says which one applies.
 */
export async function requireReviewAllowed(viewer: Viewer, work: BilledWork): Promise<"free" | "membership" | "credit"> {
  if (!work.teamId || isAdmin(viewer) || (await isCoachOf(viewer.userId, work.teamId))) return "free";
  const access = await membershipAccess(work.athleteId, work.teamId);
  if (!access.priced) return "free";
  if (access.view.uploadsAllowed) return "membership";
  if (await findReviewCredit(work.athleteId, work.teamId)) return "credit";
  throw new ApiError("payment_required:membership", PAUSED);
}

export type { SetReaderRole };

/**
 * The set exists and the viewer may read its review: its athlete, a coach who may read it (requireSetAccess's rule),
 * an admin, or an athlete on the set's team while the set is shared with that team. Write paths keep requireSetAccess.
 */
export async function requireSetReader(viewer: Viewer, setId: string): Promise<{ set: LiftSet; role: SetReaderRole }> {
  const id = uuidSchema.safeParse(setId);
  const set = id.success ? await findSet(id.data) : null;
  if (!set) throw new ApiError("not_found:set", "There is no such set.");
  if (set.athleteId === viewer.userId) return { set, role: "athlete" };
  if (await canReadSet(viewer, set)) return { set, role: isAdmin(viewer) && !(await coachesSet(viewer, set)) ? "admin" : "coach" };
  if (set.teamId && (await teamRolesOf(viewer.userId, set.teamId)).includes("athlete")) {
    const [share, athleteRoles] = await Promise.all([findActiveShare(set.id), teamRolesOf(set.athleteId, set.teamId)]);
    // Like a coach (canReadSet), teammates read only the sets of athletes still on the team: leaving ends the share.
    if (share && share.teamId === set.teamId && athleteRoles.includes("athlete")) return { set, role: "teammate" };
  }
  throw new ApiError("forbidden:set", "You do not have access to this set.");
}

/** Coaches and admins write the summary, change the status, share the set. */
export function canEditReview(role: SetReaderRole): boolean {
  return canEditReviewRole(role);
}

/** requireSetReader, then refuses anyone who may not edit the review (athlete, teammate). */
export async function requireReviewEditor(viewer: Viewer, setId: string): Promise<{ set: LiftSet; role: SetReaderRole }> {
  const reader = await requireSetReader(viewer, setId);
  if (!canEditReview(reader.role)) throw new ApiError("forbidden:review", "Only the athlete's coach can change the review.");
  return reader;
}

async function coachesSet(viewer: Viewer, set: LiftSet): Promise<boolean> {
  return set.teamId ? isCoachOf(viewer.userId, set.teamId) : false;
}

/** The viewer coaches some team (or is an admin): the review desk is theirs. */
export async function requireCoach(viewer: Viewer): Promise<void> {
  if (isAdmin(viewer)) return;
  const memberships = await listMemberships(viewer.userId);
  if (!memberships.some((m) => m.role === "coach")) throw new ApiError("forbidden:desk", "The review desk is for coaches.");
}
