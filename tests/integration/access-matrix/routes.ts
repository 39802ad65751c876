// The access matrix: one row per exported handler of every app/**/route.ts, saying what each actor gets.
// Adding a route is adding its rows here; access-matrix.test.ts fails for any handler without one.
import { OLD_DATE, type Actor, type MatrixWorld } from "./world";
import { freshInvitation, freshMember, freshSet, freshSetWithClip, freshUpload, freshUploadedParts, throwawayInvitation } from "./world";

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
  { file: "app/api/teams/route.ts", method: "POST", request: () => ({ body: { name: "Matrix new team" } }), expect: only(201, SIGNED_IN) },
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
