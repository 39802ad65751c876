// The people and data the access matrix runs against: one team with two athletes and a coach, another
// team with its own coach and athlete, and an admin on no team. Athlete A's team set carries a clip and an
// analysis, so every set route has something real to hand out or to refuse. The team charges for a single set
// review but not for a membership, so it stays free for uploads (DEVELOPERS.md) while checkout has a price to sell.
import { readFileSync } from "node:fs";
import { randomUUID } from "node:crypto";
import { expect } from "vitest";
import { db } from "@/db";
import { memberships } from "@/db/schema";
import { createInvitations } from "@/db/queries/invitations";
import { createTeam } from "@/db/queries/teams";
import { analyseTrack } from "@/lib/analysis/analyse";
import { parseTrack } from "@/lib/analysis/track";
import { generateSyntheticSet } from "@/tests/fixtures/synthetic";
import { ensureClip } from "@/tests/fixtures/clips/generate-clip";
import { setProviderCustomer, setTeamPrices } from "@/db/queries/billing";
import { createCustomer } from "@/lib/payments";
import * as analysisRoute from "@/app/api/sets/[setId]/analysis/route";
import * as shareRoute from "@/app/api/sets/[setId]/share/route";
import * as commentsRoute from "@/app/api/sets/[setId]/comments/route";
import * as reviewRoute from "@/app/api/sets/[setId]/review/route";
import * as shapeRoute from "@/app/api/sets/[setId]/markup/[shapeId]/route";
import { call, json, makeAdmin, signUp, uniqueEmail, type TestPerson } from "../helpers";
import { OLD_DATE, createTestSet, presignParts, putPart, partBytes, startUpload, uploadWhole, type StartedUpload } from "../clip-helpers";

/** Sets made here are dated long ago, so lists that show "the latest 50" in other test files still show theirs. */
export { OLD_DATE };

export const ACTORS = ["anonymous", "athleteA", "athleteB", "athleteC", "coach", "otherCoach", "admin"] as const;
export type Actor = (typeof ACTORS)[number];
export type Person = Exclude<Actor, "anonymous">;

export interface MatrixWorld {
  people: Record<Person, TestPerson>;
  team: { id: string; name: string };
  otherTeam: { id: string; name: string };
  /** Athlete A's squat on the team, with a checked clip and a saved analysis. */
  setA: string;
  /** Text only athlete A, their coach and admins may ever see; a refused response must not carry it. */
  secretNote: string;
  clipBytes: Uint8Array;
  analysisBody: unknown;
}

/** Builds the world; the payment fake must be running (startTestPayments) for the team's price and customers. */
export async function buildMatrixWorld(): Promise<MatrixWorld> {
  const labels: Person[] = ["athleteA", "athleteB", "athleteC", "coach", "otherCoach", "admin"];
  const signed = await Promise.all(labels.map((label) => signUp(`matrix-${label}`)));
  const people = Object.fromEntries(labels.map((label, i) => [label, signed[i]])) as Record<Person, TestPerson>;
  await makeAdmin(people.admin);
  const team = await createTeam(people.coach.id, `Matrix team ${randomUUID().slice(0, 6)}`);
  const otherTeam = await createTeam(people.otherCoach.id, `Matrix other team ${randomUUID().slice(0, 6)}`);
  await db.insert(memberships).values([
    { teamId: team.id, userId: people.athleteA.id, role: "athlete" },
    { teamId: team.id, userId: people.athleteB.id, role: "athlete" },
    { teamId: otherTeam.id, userId: people.athleteC.id, role: "athlete" },
  ]);
  await setTeamPrices(team, people.coach.id, { membership: null, singleReview: { amountMinor: 1500, currency: "EUR" } });
  // Athletes A and B have paid before, so the provider's portal has a customer to open for them.
  for (const label of ["athleteA", "athleteB"] as const) {
    const person = people[label];
    await setProviderCustomer(person.id, team.id, await createCustomer({ email: person.email, name: person.name, athleteId: person.id }));
  }
  const clipBytes = readFileSync((await ensureClip({ width: 640, height: 360, durationS: 12 })).videoPath);
  const { track } = generateSyntheticSet({ lift: "squat", seed: 11, reps: 3, view: "side" });
  const analysisBody = {
    model: { id: "movenet-lightning", version: "matrix" },
    settings: { poseSchedule: "every-frame" },
    calibration: track.calibration,
    result: analyseTrack(parseTrack(track), { includeFrames: true, loadKg: 140 }),
    track,
  };
  const secretNote = `private-note-${randomUUID()}`;
  const setA = await createTestSet(people.athleteA, { teamId: team.id, note: secretNote, sessionDate: OLD_DATE });
  expect((await uploadWhole(people.athleteA, setA, clipBytes)).status).toBe(200);
  const saved = await call(analysisRoute.POST, "", { method: "POST", cookie: people.athleteA.cookie, params: { setId: setA }, body: analysisBody });
  expect(saved.status).toBe(201);
  return {
    people,
    team: { id: team.id, name: team.name },
    otherTeam: { id: otherTeam.id, name: otherTeam.name },
    setA,
    secretNote,
    clipBytes,
    analysisBody,
  };
}

/** A set dated OLD_DATE, for the test files that make many (see OLD_DATE). */
export function createOldSet(person: TestPerson, body: Record<string, unknown> = {}): Promise<string> {
  return createTestSet(person, { sessionDate: OLD_DATE, ...body });
}

/** A new team set of athlete A's, for rows whose allowed calls change the set. */
export function freshSet(w: MatrixWorld): Promise<string> {
  return createTestSet(w.people.athleteA, { teamId: w.team.id, sessionDate: OLD_DATE });
}

/** A new set of athlete A's with its clip uploaded and checked. */
export async function freshSetWithClip(w: MatrixWorld): Promise<string> {
  const setId = await freshSet(w);
  expect((await uploadWhole(w.people.athleteA, setId, w.clipBytes)).status).toBe(200);
  return setId;
}

/** A new set of athlete A's with a clip upload started (nothing sent yet). */
export async function freshUpload(w: MatrixWorld): Promise<{ setId: string; upload: StartedUpload }> {
  const setId = await freshSet(w);
  const started = await startUpload(w.people.athleteA, setId, w.clipBytes.length);
  expect(started.status).toBe(201);
  return { setId, upload: (await json<{ upload: StartedUpload }>(started)).upload };
}

/** A new set whose every part is stored, waiting only for the completion call. */
export async function freshUploadedParts(w: MatrixWorld) {
  const { setId, upload } = await freshUpload(w);
  const numbers = Array.from({ length: upload.partCount }, (_, i) => i + 1);
  const presigned = await json<{ parts: { partNumber: number; url: string }[] }>(
    await presignParts(w.people.athleteA, setId, upload.uploadId, numbers),
  );
  const parts = [];
  for (const part of presigned.parts) parts.push({ partNumber: part.partNumber, etag: await putPart(part.url, partBytes(w.clipBytes, part.partNumber)) });
  return { setId, uploadId: upload.uploadId, parts };
}

/** A pending invitation on the team, sent long enough ago that a resend is not throttled. */
export async function freshInvitation(w: MatrixWorld, teamId = w.team.id): Promise<{ id: string; token: string }> {
  const { issued } = await createInvitations(teamId, w.people.coach.id, [uniqueEmail("matrix-invitee")], new Date(Date.now() - 10 * 60_000));
  const [{ invitation, token }] = issued;
  return { id: invitation.id, token };
}

/** An invitation to a throwaway team, so accepting it never changes who belongs to the matrix teams. */
export async function throwawayInvitation(w: MatrixWorld): Promise<{ id: string; token: string }> {
  const owner = await signUp("matrix-throwaway-coach");
  const team = await createTeam(owner.id, `Throwaway ${randomUUID().slice(0, 6)}`);
  return freshInvitation(w, team.id);
}

/** A new athlete on the team, for the removal row (removing athlete A or B would change later rows). */
export async function freshMember(w: MatrixWorld): Promise<string> {
  const person = await signUp("matrix-member");
  await db.insert(memberships).values({ teamId: w.team.id, userId: person.id, role: "athlete" });
  return person.id;
}

/** A new team set of athlete A's that the coach has shared with the team (teammates may read its review). */
export async function sharedSet(w: MatrixWorld): Promise<string> {
  const setId = await freshSet(w);
  const shared = await call(shareRoute.PUT, "", { method: "PUT", cookie: w.people.coach.cookie, params: { setId }, body: { shared: true } });
  expect(shared.status).toBe(200);
  return setId;
}

/** A new comment of athlete A's on their set A. */
export async function freshComment(w: MatrixWorld): Promise<string> {
  const response = await call(commentsRoute.POST, "", {
    method: "POST",
    cookie: w.people.athleteA.cookie,
    params: { setId: w.setA },
    body: { body: "Felt slow out of the hole.", timeS: 1.2, frameIndex: 36 },
  });
  expect(response.status).toBe(201);
  return (await json<{ comment: { id: string } }>(response)).comment.id;
}

/** A markup shape the coach drew on athlete A's set, at revision 1. */
export async function freshShape(w: MatrixWorld): Promise<string> {
  const shapeId = randomUUID();
  const response = await call(shapeRoute.PUT, "", { method: "PUT", cookie: w.people.coach.cookie, params: { setId: w.setA, shapeId }, body: MARKUP_SHAPE });
  expect(response.status).toBe(200);
  return shapeId;
}

/** A protractor shown for a moment (any valid shape would do; a number in spanEndS lets hostile-input try other types). */
export const MARKUP_SHAPE = {
  frameIndex: 12,
  frameTimeS: 0.4,
  spanEndS: 0.9,
  geometry: { kind: "protractor", mode: "three-point", a: { x: 100, y: 100 }, vertex: { x: 100, y: 400 }, b: { x: 500, y: 400 } },
  style: { colour: "action", stroke: "medium" },
  revision: 1,
};

/** A new set of athlete A's whose review the coach has drafted, ready to send. */
export async function draftedReviewSet(w: MatrixWorld): Promise<string> {
  const setId = await freshSet(w);
  const response = await call(reviewRoute.PUT, "", {
    method: "PUT",
    cookie: w.people.coach.cookie,
    params: { setId },
    body: { summary: "Depth was there on every rep; keep the chest up out of the hole.", cues: [] },
  });
  expect(response.status).toBe(200);
  return setId;
}
