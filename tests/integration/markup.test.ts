// Markup routes over a real PostgreSQL: who may read and draw (the athlete's coach and admins draw; the
// athlete reads; other teams and teammates are refused), input checks that leave nothing half-saved,
// and per-shape last-write-wins by revision so two editors never lose each other's shapes.
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, db } from "@/db";
import { markupShapes } from "@/db/schema-markup";
import type { MailFake } from "@/dev/fakes/mail-fake";
import * as listRoute from "@/app/api/sets/[setId]/markup/route";
import * as shapeRoute from "@/app/api/sets/[setId]/markup/[shapeId]/route";
import { buildWorld, call, json, startTestMail, type TestPerson, type World } from "./helpers";
import { createTestSet } from "./clip-helpers";

let world: World;
let mail: MailFake;
let setId: string;

// A 3-4-5 right triangle (common practice): easy to check by eye in the stored geometry.
const protractor = {
  frameIndex: 42,
  frameTimeS: 1.4,
  spanEndS: null,
  geometry: { kind: "protractor", mode: "three-point", a: { x: 100, y: 100 }, vertex: { x: 100, y: 400 }, b: { x: 500, y: 400 } },
  style: { colour: "action", stroke: "medium" },
  revision: 1,
};

function put(person: TestPerson | undefined, shapeId: string, body: unknown, set = setId): Promise<Response> {
  return call(shapeRoute.PUT, "", { method: "PUT", cookie: person?.cookie, params: { setId: set, shapeId }, body });
}

function remove(person: TestPerson, shapeId: string, revision: number): Promise<Response> {
  return call(shapeRoute.DELETE, `/x?revision=${revision}`, { method: "DELETE", cookie: person.cookie, params: { setId, shapeId } });
}

function list(person: TestPerson | undefined, set = setId): Promise<Response> {
  return call(listRoute.GET, "", { cookie: person?.cookie, params: { setId: set } });
}

async function storedRow(shapeId: string) {
  const [row] = await db.select().from(markupShapes).where(eq(markupShapes.id, shapeId));
  return row ?? null;
}

interface ListBody {
  shapes: { id: string; revision: number; geometry: Record<string, unknown>; frameIndex: number }[];
  canEdit: boolean;
}

beforeAll(async () => {
  mail = await startTestMail();
  world = await buildWorld("markup");
  setId = await createTestSet(world.athleteA1, { teamId: world.teamA.id });
});

afterAll(async () => {
  await mail?.stop();
  await closeDb();
});

describe("markup access", () => {
  it("lets the athlete's coach draw a shape that the athlete then reads, read-only", async () => {
    const shapeId = randomUUID();
    const saved = await put(world.coachA, shapeId, protractor);
    expect(saved.status).toBe(200);
    expect(await json(saved)).toMatchObject({ applied: true, deleted: false, shape: { id: shapeId, kind: "protractor", frameIndex: 42, revision: 1 } });

    const asAthlete = await json<ListBody>(await list(world.athleteA1));
    expect(asAthlete.canEdit).toBe(false);
    expect(asAthlete.shapes.find((s) => s.id === shapeId)?.geometry).toEqual(protractor.geometry);
    expect((await json<ListBody>(await list(world.coachA))).canEdit).toBe(true);
  });

  it("refuses the athlete's own edits and deletions, and writes nothing", async () => {
    const shapeId = randomUUID();
    const response = await put(world.athleteA1, shapeId, protractor);
    expect(response.status).toBe(403);
    expect((await json<{ error: { code: string } }>(response)).error.code).toBe("forbidden:markup");
    expect(await storedRow(shapeId)).toBeNull();

    const coachShape = randomUUID();
    await put(world.coachA, coachShape, protractor);
    expect((await remove(world.athleteA1, coachShape, 5)).status).toBe(403);
    expect((await storedRow(coachShape))?.deletedAt).toBeNull();
  });

  it("refuses another team's coach, a teammate the set is not shared with, an outsider and the signed-out", async () => {
    const shapeId = randomUUID();
    expect((await put(world.coachB, shapeId, protractor)).status).toBe(403);
    expect((await list(world.coachB)).status).toBe(403);
    expect((await list(world.athleteA2)).status).toBe(403);
    expect((await put(world.athleteA2, shapeId, protractor)).status).toBe(403);
    expect((await list(world.outsider)).status).toBe(403);
    expect((await put(undefined, shapeId, protractor)).status).toBe(401);
    expect(await storedRow(shapeId)).toBeNull();
  });

  it("lets an admin draw", async () => {
    const shapeId = randomUUID();
    expect((await put(world.admin, shapeId, { ...protractor, geometry: { kind: "ring", center: { x: 10, y: 10 }, radiusXPx: 5, radiusYPx: 8 } })).status).toBe(200);
    expect((await storedRow(shapeId))?.kind).toBe("ring");
  });

  it("answers 404 for a set that does not exist", async () => {
    expect((await put(world.admin, randomUUID(), protractor, randomUUID())).status).toBe(404);
  });
});

describe("markup input", () => {
  const bad: [string, unknown][] = [
    ["a protractor without its third point", { ...protractor, geometry: { kind: "protractor", mode: "three-point", a: { x: 0, y: 0 }, vertex: { x: 1, y: 1 } } }],
    ["an unknown kind", { ...protractor, geometry: { kind: "blob", at: { x: 1, y: 1 } } }],
    ["a point far off the clip", { ...protractor, geometry: { kind: "arrow", from: { x: 0, y: 0 }, to: { x: 1e9, y: 0 } } }],
    ["a one-point pen stroke", { ...protractor, geometry: { kind: "pen", points: [{ x: 0, y: 0 }] } }],
    ["an empty note", { ...protractor, geometry: { kind: "note", at: { x: 0, y: 0 }, text: "   " } }],
    ["a colour that is not a token", { ...protractor, style: { colour: "#ff0000", stroke: "fine" } }],
    ["a span that ends before its frame", { ...protractor, spanEndS: 1.0 }],
    ["a negative frame", { ...protractor, frameIndex: -1 }],
    ["no revision", { ...protractor, revision: undefined }],
  ];

  it.each(bad)("refuses %s with a 400 and saves nothing", async (_label, body) => {
    const shapeId = randomUUID();
    const response = await put(world.coachA, shapeId, body);
    expect(response.status).toBe(400);
    expect((await json<{ error: { code: string } }>(response)).error.code).toBe("bad_request:markup");
    expect(await storedRow(shapeId)).toBeNull();
  });

  it("refuses a body that is not JSON and a shape id that is not a UUID", async () => {
    const shapeId = randomUUID();
    const raw = await call(shapeRoute.PUT, "", { method: "PUT", cookie: world.coachA.cookie, params: { setId, shapeId }, rawBody: "{not json" });
    expect(raw.status).toBe(400);
    expect((await put(world.coachA, "shape-1", protractor)).status).toBe(400);
    expect(await storedRow(shapeId)).toBeNull();
  });

  it("refuses a shape id already used on another set", async () => {
    const otherSet = await createTestSet(world.athleteA2, { teamId: world.teamA.id });
    const shapeId = randomUUID();
    expect((await put(world.coachA, shapeId, protractor, otherSet)).status).toBe(200);
    const response = await put(world.coachA, shapeId, { ...protractor, revision: 9 });
    expect(response.status).toBe(409);
    expect((await storedRow(shapeId))?.setId).toBe(otherSet);
  });
});

describe("markup revisions", () => {
  it("keeps the newer revision when an older write arrives late", async () => {
    const shapeId = randomUUID();
    const newer = { ...protractor, geometry: { kind: "ruler", a: { x: 0, y: 0 }, b: { x: 30, y: 40 } }, revision: 3 };
    expect((await json(await put(world.coachA, shapeId, newer))).applied).toBe(true);
    const late = await json<{ applied: boolean; shape: { revision: number; kind: string } }>(await put(world.admin, shapeId, { ...protractor, revision: 2 }));
    expect(late.applied).toBe(false);
    expect(late.shape).toMatchObject({ revision: 3, kind: "ruler" });
    expect((await storedRow(shapeId))?.kind).toBe("ruler");
  });

  it("keeps both shapes when two editors save different shapes of the same set at once", async () => {
    const fromTab1 = randomUUID();
    const fromTab2 = randomUUID();
    const responses = await Promise.all([put(world.coachA, fromTab1, protractor), put(world.admin, fromTab2, { ...protractor, frameIndex: 7 })]);
    expect(responses.map((r) => r.status)).toEqual([200, 200]);
    const ids = (await json<ListBody>(await list(world.coachA))).shapes.map((s) => s.id);
    expect(ids).toEqual(expect.arrayContaining([fromTab1, fromTab2]));
  });

  it("deletes at a revision; an older write cannot bring the shape back, a newer one (undo) can", async () => {
    const shapeId = randomUUID();
    await put(world.coachA, shapeId, protractor);
    expect((await remove(world.coachA, shapeId, 2)).status).toBe(204);
    expect((await json<ListBody>(await list(world.coachA))).shapes.some((s) => s.id === shapeId)).toBe(false);
    const stale = await json<{ applied: boolean; deleted: boolean }>(await put(world.coachA, shapeId, { ...protractor, revision: 2 }));
    expect(stale).toMatchObject({ applied: false, deleted: true });
    expect((await storedRow(shapeId))?.deletedAt).not.toBeNull();
    expect((await json(await put(world.coachA, shapeId, { ...protractor, revision: 3 }))).applied).toBe(true);
    expect((await json<ListBody>(await list(world.coachA))).shapes.find((s) => s.id === shapeId)?.revision).toBe(3);
  });

  it("treats deleting an unknown shape as done (a retried deletion is harmless)", async () => {
    expect((await remove(world.coachA, randomUUID(), 1)).status).toBe(204);
  });

  it("refuses a deletion without a revision", async () => {
    const response = await call(shapeRoute.DELETE, "/x", { method: "DELETE", cookie: world.coachA.cookie, params: { setId, shapeId: randomUUID() } });
    expect(response.status).toBe(400);
  });
});
