// The access matrix: one row per exported handler of every app/**/route.ts, saying what each actor gets.
// Adding a route is adding its rows here; access-matrix.test.ts fails for any handler without one.
import { eq } from "drizzle-orm";
import { db } from "@/db";
import { teams } from "@/db/schema";
import { OLD_DATE, type Actor, type MatrixWorld } from "./world";
import {
  MARKUP_SHAPE,
  draftedReviewSet,
  freshComment,
  freshInvitation,
  freshMember,
  freshSet,
  freshSetWithClip,
  freshShape,
  freshUpload,
  freshUploadedParts,
  sharedSet,
  throwawayInvitation,
} from "./world";

export const HTTP_METHODS = ["GET", "HEAD", "POST", "PUT", "PATCH", "DELETE", "OPTIONS"] as const;
export type HttpMethod = (typeof HTTP_METHODS)[number];

export interface RowRequest {
  /** Path and query string; only the query matters to the handlers (Next routes by folder). */
  path?: string;
  params?: Record<string, string>;
  body?: unknown;
}

export interface RouteRow {
  /** The route module, relative to the repository root. */
  file: string;
  method: HttpMethod;
  /** Called once per actor, so rows whose allowed calls change data get fresh data each time. */
  request: (w: MatrixWorld) => Promise<RowRequest> | RowRequest;
  /** The status each actor gets: below 400 is allowed (with data), 401/403/404 is refused (an error only). */
  expect: Record<Actor, number>;
  /**
   * A refusal other than 401/403/404, for a handler that authenticates its caller without a session: the
   * provider's webhook answers 400 with this error code to a request whose signature does not match.
   */
  otherRefusal?: { status: number; code: string };
  /** Undoes what an allowed call changed that later rows depend on (called with the response's text). */
  after?: (w: MatrixWorld, text: string) => Promise<void>;
}

/** Handlers deliberately outside the matrix, with the reason. */
export const EXEMPT: { file: string; reason: string }[] = [
  {
    file: "app/api/auth/[...all]/route.ts",
    reason: "better-auth's own endpoints (sign-in, sign-up, reset, admin); covered by tests/integration/auth.test.ts and rate-limited by better-auth",
  },
];

/** `ok` for the listed actors, 401 for anonymous, `refused` (403 unless said) for everyone else. */
function only(ok: number, allowed: Actor[], refused = 403): Record<Actor, number> {
  return {
    anonymous: 401,
    athleteA: allowed.includes("athleteA") ? ok : refused,
    athleteB: allowed.includes("athleteB") ? ok : refused,
    athleteC: allowed.includes("athleteC") ? ok : refused,
    coach: allowed.includes("coach") ? ok : refused,
    otherCoach: allowed.includes("otherCoach") ? ok : refused,
    admin: allowed.includes("admin") ? ok : refused,
  };
}

const SIGNED_IN: Actor[] = ["athleteA", "athleteB", "athleteC", "coach", "otherCoach", "admin"];
/** Who may read athlete A's team set: the athlete, the team's coach, an admin. */
const SET_READERS: Actor[] = ["athleteA", "coach", "admin"];
const TEAM_COACHES: Actor[] = ["coach", "admin"];
/** Who may read the review of athlete A's set once the coach has shared it with the team: athlete B joins. */
const SHARED_SET_READERS: Actor[] = ["athleteA", "athleteB", "coach", "admin"];
/** The team's members: its athletes and its coach (and admins). */
const TEAM_MEMBERS: Actor[] = ["athleteA", "athleteB", "coach", "admin"];
const COACHES: Actor[] = ["coach", "otherCoach", "admin"];
const setParams = (setId: string) => ({ params: { setId } });

export const ROUTES: RouteRow[] = [
  { file: "app/api/me/route.ts", method: "GET", request: () => ({}), expect: only(200, SIGNED_IN) },
  { file: "app/api/profile/route.ts", method: "GET", request: () => ({}), expect: only(200, SIGNED_IN) },
  {
    file: "app/api/profile/route.ts",
    method: "PUT",
    request: () => ({ body: { bodyMassKg: 90, heightM: 1.8, unitPreference: "kg", oneRepMaxes: { squat: 180 } } }),
    expect: only(200, SIGNED_IN),
  },
  {
    file: "app/api/teams/route.ts",
    method: "POST",
    request: () => ({ body: { name: "Matrix new team" } }),
    expect: only(201, SIGNED_IN),
    // Whoever creates a team coaches it: removed again so the athletes stay athletes only (the desk row).
    after: async (_w, text) => {
      const created = JSON.parse(text) as { team?: { id: string } };
      if (created.team) await db.delete(teams).where(eq(teams.id, created.team.id));
    },
  },
  {
    file: "app/api/teams/[teamId]/roster/route.ts",
    method: "GET",
    request: (w) => ({ params: { teamId: w.team.id } }),
    expect: only(200, TEAM_COACHES),
  },
  {
    file: "app/api/teams/[teamId]/invitations/route.ts",
    method: "POST",
    request: (w) => ({ params: { teamId: w.team.id }, body: { emails: [`matrix-${crypto.randomUUID().slice(0, 8)}@test.example`] } }),
    expect: only(201, TEAM_COACHES),
  },
  {
    file: "app/api/teams/[teamId]/invitations/[invitationId]/route.ts",
    method: "DELETE",
    request: async (w) => ({ params: { teamId: w.team.id, invitationId: (await freshInvitation(w)).id } }),
    expect: only(200, TEAM_COACHES),
  },
  {
    file: "app/api/teams/[teamId]/invitations/[invitationId]/resend/route.ts",
    method: "POST",
    request: async (w) => ({ params: { teamId: w.team.id, invitationId: (await freshInvitation(w)).id } }),
    expect: only(200, TEAM_COACHES),
  },
  {
    file: "app/api/teams/[teamId]/members/[userId]/route.ts",
    method: "DELETE",
    request: async (w) => ({ params: { teamId: w.team.id, userId: await freshMember(w) } }),
    expect: only(204, TEAM_COACHES),
  },
  {
    // Public on purpose: the invitation page shows the team's name before the person signs in or up.
    file: "app/api/invitations/[token]/route.ts",
    method: "GET",
    request: async (w) => ({ params: { token: (await freshInvitation(w)).token } }),
    expect: { anonymous: 200, athleteA: 200, athleteB: 200, athleteC: 200, coach: 200, otherCoach: 200, admin: 200 },
  },
  {
    // Any signed-in account may accept: the link proves access to the mailbox.
    file: "app/api/invitations/[token]/accept/route.ts",
    method: "POST",
    request: async (w) => ({ params: { token: (await throwawayInvitation(w)).token } }),
    expect: only(200, SIGNED_IN),
  },
  {
    // Everyone signed in may list; what they see is filtered (the leak check holds the rest back).
    file: "app/api/sets/route.ts",
    method: "GET",
    request: (w) => ({ path: `/api/sets?teamId=${w.team.id}` }),
    expect: only(200, ["athleteA", "athleteB", "coach", "admin"]),
  },
  {
    // Sets are filed only under a team the person lifts on; the coach of that team included.
    file: "app/api/sets/route.ts",
    method: "POST",
    request: (w) => ({ body: { teamId: w.team.id, sessionDate: OLD_DATE, lift: "deadlift", loadKg: 180, reps: 3, cameraView: "side" } }),
    expect: only(201, ["athleteA", "athleteB", "admin"]),
  },
  { file: "app/api/sets/[setId]/route.ts", method: "GET", request: (w) => setParams(w.setA), expect: only(200, SET_READERS) },
  { file: "app/api/sets/[setId]/clip/route.ts", method: "GET", request: (w) => setParams(w.setA), expect: only(200, SET_READERS) },
  {
    file: "app/api/sets/[setId]/clip/route.ts",
    method: "POST",
    request: async (w) => ({ ...setParams(await freshSet(w)), body: { sizeBytes: w.clipBytes.length, contentType: "video/mp4" } }),
    expect: only(201, SET_READERS),
  },
  {
    file: "app/api/sets/[setId]/clip/route.ts",
    method: "DELETE",
    request: async (w) => {
      const { setId, upload } = await freshUpload(w);
      return { ...setParams(setId), path: `/x?uploadId=${encodeURIComponent(upload.uploadId)}` };
    },
    expect: only(204, SET_READERS),
  },
  {
    file: "app/api/sets/[setId]/clip/parts/route.ts",
    method: "GET",
    request: async (w) => {
      const { setId, upload } = await freshUpload(w);
      return { ...setParams(setId), path: `/x?uploadId=${encodeURIComponent(upload.uploadId)}` };
    },
    expect: only(200, SET_READERS),
  },
  {
    file: "app/api/sets/[setId]/clip/parts/route.ts",
    method: "POST",
    request: async (w) => {
      const { setId, upload } = await freshUpload(w);
      return { ...setParams(setId), body: { uploadId: upload.uploadId, partNumbers: [1] } };
    },
    expect: only(200, SET_READERS),
  },
  {
    file: "app/api/sets/[setId]/clip/complete/route.ts",
    method: "POST",
    request: async (w) => {
      const { setId, uploadId, parts } = await freshUploadedParts(w);
      return { ...setParams(setId), body: { uploadId, parts } };
    },
    expect: only(200, SET_READERS),
  },
  {
    file: "app/api/sets/[setId]/clip/conversion/route.ts",
    method: "POST",
    request: async (w) => setParams(await freshSetWithClip(w)),
    expect: only(202, SET_READERS),
  },
  { file: "app/api/sets/[setId]/analysis/route.ts", method: "GET", request: (w) => setParams(w.setA), expect: only(200, SET_READERS) },
  {
    file: "app/api/sets/[setId]/analysis/route.ts",
    method: "POST",
    request: (w) => ({ ...setParams(w.setA), body: w.analysisBody }),
    expect: only(201, SET_READERS),
  },
  { file: "app/api/preferences/route.ts", method: "GET", request: () => ({}), expect: only(200, SIGNED_IN) },
  {
    file: "app/api/preferences/route.ts",
    method: "PUT",
    request: () => ({ body: { massUnit: "kg", lengthUnit: "metric" } }),
    expect: only(200, SIGNED_IN),
  },
  // The review desk lists only the sets a coach may read (the leak check holds athlete A's back from otherCoach).
  { file: "app/api/desk/route.ts", method: "GET", request: () => ({ path: "/api/desk?status=all" }), expect: only(200, COACHES) },
  { file: "app/api/exports/reps/route.ts", method: "GET", request: (w) => ({ path: `/api/exports/reps?set=${w.setA}` }), expect: only(200, SET_READERS) },
  {
    file: "app/api/exports/reps/route.ts",
    method: "GET",
    request: (w) => ({ path: `/api/exports/reps?athlete=${w.people.athleteA.id}` }),
    expect: only(200, SET_READERS),
  },
  {
    // A date range is everyone's own export, filtered to what they may read.
    file: "app/api/exports/reps/route.ts",
    method: "GET",
    request: () => ({ path: `/api/exports/reps?from=${OLD_DATE}&to=${OLD_DATE}` }),
    expect: only(200, SIGNED_IN),
  },
  { file: "app/api/sets/[setId]/review/route.ts", method: "GET", request: (w) => setParams(w.setA), expect: only(200, SET_READERS) },
  // The shared-set rule: athlete B is refused above (not shared) and reads once the coach shares the set.
  { file: "app/api/sets/[setId]/review/route.ts", method: "GET", request: async (w) => setParams(await sharedSet(w)), expect: only(200, SHARED_SET_READERS) },
  {
    file: "app/api/sets/[setId]/review/route.ts",
    method: "PUT",
    request: async (w) => ({ ...setParams(await freshSet(w)), body: { summary: "Brace before the descent.", cues: [] } }),
    expect: only(200, TEAM_COACHES),
  },
  { file: "app/api/sets/[setId]/review/start/route.ts", method: "POST", request: async (w) => setParams(await freshSet(w)), expect: only(200, TEAM_COACHES) },
  { file: "app/api/sets/[setId]/review/send/route.ts", method: "POST", request: async (w) => setParams(await draftedReviewSet(w)), expect: only(200, TEAM_COACHES) },
  // Only the athlete marks their own review as seen; the coach and admins read it but do not.
  { file: "app/api/sets/[setId]/review/seen/route.ts", method: "POST", request: (w) => setParams(w.setA), expect: only(200, ["athleteA"]) },
  {
    file: "app/api/sets/[setId]/share/route.ts",
    method: "PUT",
    request: async (w) => ({ ...setParams(await freshSet(w)), body: { shared: true } }),
    expect: only(200, TEAM_COACHES),
  },
  { file: "app/api/sets/[setId]/comments/route.ts", method: "GET", request: (w) => setParams(w.setA), expect: only(200, SET_READERS) },
  { file: "app/api/sets/[setId]/comments/route.ts", method: "GET", request: async (w) => setParams(await sharedSet(w)), expect: only(200, SHARED_SET_READERS) },
  {
    file: "app/api/sets/[setId]/comments/route.ts",
    method: "POST",
    request: (w) => ({ ...setParams(w.setA), body: { body: "Knees out at the bottom.", timeS: 2.5, frameIndex: 75 } }),
    expect: only(201, SET_READERS),
  },
  {
    file: "app/api/sets/[setId]/comments/route.ts",
    method: "POST",
    request: async (w) => ({ ...setParams(await sharedSet(w)), body: { body: "Same groove as mine.", timeS: 1, frameIndex: 30 } }),
    expect: only(201, SHARED_SET_READERS),
  },
  {
    // Only the author edits a comment: the coach and admins moderate by deleting, not by rewording.
    file: "app/api/sets/[setId]/comments/[commentId]/route.ts",
    method: "PUT",
    request: async (w) => ({ params: { setId: w.setA, commentId: await freshComment(w) }, body: { body: "Felt slow out of the hole, again." } }),
    expect: only(200, ["athleteA"]),
  },
  {
    file: "app/api/sets/[setId]/comments/[commentId]/route.ts",
    method: "DELETE",
    request: async (w) => ({ params: { setId: w.setA, commentId: await freshComment(w) } }),
    expect: only(204, SET_READERS),
  },
  { file: "app/api/sets/[setId]/markup/route.ts", method: "GET", request: (w) => setParams(w.setA), expect: only(200, SET_READERS) },
  { file: "app/api/sets/[setId]/markup/route.ts", method: "GET", request: async (w) => setParams(await sharedSet(w)), expect: only(200, SHARED_SET_READERS) },
  {
    file: "app/api/sets/[setId]/markup/[shapeId]/route.ts",
    method: "PUT",
    request: (w) => ({ params: { setId: w.setA, shapeId: crypto.randomUUID() }, body: MARKUP_SHAPE }),
    expect: only(200, TEAM_COACHES),
  },
  {
    file: "app/api/sets/[setId]/markup/[shapeId]/route.ts",
    method: "DELETE",
    request: async (w) => ({ params: { setId: w.setA, shapeId: await freshShape(w) }, path: "/x?revision=2" }),
    expect: only(204, TEAM_COACHES),
  },
  { file: "app/api/teams/[teamId]/prices/route.ts", method: "GET", request: (w) => ({ params: { teamId: w.team.id } }), expect: only(200, TEAM_MEMBERS) },
  {
    // The same prices the world set (no membership, so the team stays free for uploads): the row changes nothing.
    file: "app/api/teams/[teamId]/prices/route.ts",
    method: "PUT",
    request: (w) => ({ params: { teamId: w.team.id }, body: { currency: "EUR", membership: "", singleReview: "15.00" } }),
    expect: only(200, TEAM_COACHES),
  },
  {
    file: "app/api/teams/[teamId]/members/[userId]/comp/route.ts",
    method: "PUT",
    request: async (w) => ({ params: { teamId: w.team.id, userId: await freshMember(w) }, body: { comped: true } }),
    expect: only(200, TEAM_COACHES),
  },
  {
    // With a team, its members see invoices (the coach all of them, an athlete their own); others are refused.
    file: "app/api/billing/invoices/route.ts",
    method: "GET",
    request: (w) => ({ path: `/api/billing/invoices?teamId=${w.team.id}` }),
    expect: only(200, TEAM_MEMBERS),
  },
  {
    // Paying is the athlete's own: the coach, admins and other teams' people have no membership here to pay.
    file: "app/api/billing/checkout/route.ts",
    method: "POST",
    request: (w) => ({ body: { teamId: w.team.id, kind: "single_review" } }),
    expect: only(201, ["athleteA", "athleteB"]),
  },
  {
    file: "app/api/billing/portal/route.ts",
    method: "POST",
    request: (w) => ({ body: { teamId: w.team.id } }),
    expect: only(201, ["athleteA", "athleteB"]),
  },
  {
    // No session here: the provider's signature is the authentication (tests/integration/payments.test.ts checks
    // signed, forged and replayed events). Unsigned, it is refused for everyone, signed in or not.
    file: "app/api/payments/webhook/route.ts",
    method: "POST",
    request: () => ({ body: { id: "evt_matrix", type: "invoice.paid", data: { object: {} } } }),
    expect: { anonymous: 400, athleteA: 400, athleteB: 400, athleteC: 400, coach: 400, otherCoach: 400, admin: 400 },
    otherRefusal: { status: 400, code: "bad_request:webhook" },
  },
];

/** Server actions ("use server" modules): one row per exported action. None exist yet. */
export interface ActionRow {
  file: string;
  exportName: string;
  /** Runs the action as the actor; resolves to "ok" or "refused" (an error result or a thrown ApiError). */
  invoke: (w: MatrixWorld, actor: Actor) => Promise<"ok" | "refused">;
  expect: Record<Actor, "ok" | "refused">;
}

export const ACTIONS: ActionRow[] = [];
