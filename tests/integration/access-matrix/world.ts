// The people and data the access matrix runs against: one team with two athletes and a coach, another
// team with its own coach and athlete, and an admin on no team. Athlete A's team set carries a clip and an
// analysis, so every set route has something real to hand out or to refuse.
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
import * as analysisRoute from "@/app/api/sets/[setId]/analysis/route";
import { call, json, makeAdmin, signUp, uniqueEmail, type TestPerson } from "../helpers";
import { createTestSet, presignParts, putPart, partBytes, startUpload, uploadWhole, type StartedUpload } from "../clip-helpers";

/** Sets made here are dated long ago, so lists that show "the latest 50" in other test files still show theirs. */
export const OLD_DATE = "2024-01-15";

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
