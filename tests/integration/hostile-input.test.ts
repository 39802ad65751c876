// Hostile input against every route that reads a body, and against the clip and track checks: malformed
// JSON, wrong types, oversized bodies, broken Unicode, injection strings, path traversal, files that are
// not (usable) videos, tracks with non-finite numbers or a million frames. Each gives a clear 4xx, and the
// row counts of every table the routes write stay as they were.
import { execFileSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { count, eq } from "drizzle-orm";
import { closeDb, db } from "@/db";
import { analyses, athleteProfiles, invitations, memberships, oneRepMaxes, reps, sets, teams, trainingSessions } from "@/db/schema";
import { clipUploadStarts } from "@/db/schema-hardening";
import type { MailFake } from "@/dev/fakes/mail-fake";
import * as setsRoute from "@/app/api/sets/route";
import * as setRoute from "@/app/api/sets/[setId]/route";
import * as teamsRoute from "@/app/api/teams/route";
import * as meRoute from "@/app/api/me/route";
import * as clipRoute from "@/app/api/sets/[setId]/clip/route";
import * as partsRoute from "@/app/api/sets/[setId]/clip/parts/route";
import * as analysisRoute from "@/app/api/sets/[setId]/analysis/route";
import * as invitationRoute from "@/app/api/invitations/[token]/route";
import { BASE_URL, call, json, startTestMail } from "./helpers";
import { startTestStorage, uploadWhole, type TestStorage } from "./clip-helpers";
import { startTestPayments, type TestPayments } from "./payment-helpers";
import { ROUTES, type RouteRow } from "./access-matrix/routes";
import { OLD_DATE, buildMatrixWorld, freshSet, freshUpload, type Actor, type MatrixWorld } from "./access-matrix/world";

interface ErrorBody {
  error: { code: string; message: string; fields?: Record<string, string> };
}

const ROOT = path.resolve(import.meta.dirname, "../..");
const TABLES = { sets, teams, memberships, invitations, athleteProfiles, oneRepMaxes, trainingSessions, analyses, reps, clipUploadStarts };

async function rowCounts(): Promise<Record<string, number>> {
  const entries = await Promise.all(
    Object.entries(TABLES).map(async ([name, table]) => [name, (await db.select({ n: count() }).from(table))[0].n] as const),
  );
  return Object.fromEntries(entries);
}

let mail: MailFake;
let storage: TestStorage;
let pay: TestPayments;
let w: MatrixWorld;
let workDir: string;

beforeAll(async () => {
  mail = await startTestMail();
  storage = await startTestStorage();
  pay = await startTestPayments();
  w = await buildMatrixWorld();
  workDir = mkdtempSync(path.join(tmpdir(), "plumbline-hostile-"));
}, 120_000);

afterAll(async () => {
  rmSync(workDir, { recursive: true, force: true });
  await pay?.stop();
  await storage?.stop();
  await mail?.stop();
  await closeDb();
});

/** Sends raw bytes (or a stream with no Content-Length) to a handler, as a browser or a script might. */
function send(handler: unknown, body: BodyInit, cookie: string, params: Record<string, string> = {}, method = "POST"): Promise<Response> {
  const headers = new Headers({ origin: BASE_URL, cookie, "content-type": "application/json" });
  const request = new Request(new URL("/x", BASE_URL), { method, headers, body, duplex: "half" } as RequestInit);
  return (handler as (r: Request, c: unknown) => Promise<Response>)(request, { params: Promise.resolve(params) });
}

/** The rows of the matrix whose modules read a JSON body (through readJson), each with an actor allowed to call it. */
const BODY_ROWS = ROUTES.filter(
  (row) => ["POST", "PUT", "PATCH"].includes(row.method) && /readJson\(/.test(readFileSync(path.join(ROOT, row.file), "utf8")),
).flatMap((row) => {
  const actor = (["athleteA", "coach", "admin"] as Actor[]).find((a) => row.expect[a] < 400);
  return actor && actor !== "anonymous" ? [{ row, actor }] : [];
});

async function handlerOf(row: RouteRow): Promise<unknown> {
  return ((await import(/* @vite-ignore */ path.join(ROOT, row.file))) as Record<string, unknown>)[row.method];
}

/** Calls the row's handler as its allowed actor with `body` in place of the good one; nothing may be written. */
async function refusedWithout(row: RouteRow, actor: Actor, body: BodyInit, expected: number): Promise<ErrorBody> {
  const request = await row.request(w);
  const before = await rowCounts();
  const response = await send(await handlerOf(row), body, w.people[actor as Exclude<Actor, "anonymous">].cookie, request.params, row.method);
  const text = await response.text();
  expect(response.status, `${row.method} ${row.file}: ${text.slice(0, 200)}`).toBe(expected);
  expect(await rowCounts(), `${row.method} ${row.file} wrote rows`).toEqual(before);
  return JSON.parse(text) as ErrorBody;
}

describe("every route that reads a body", () => {
  it("has rows to test (the matrix lists them)", () => {
    expect(BODY_ROWS.length).toBeGreaterThanOrEqual(8);
  });

  it.each(BODY_ROWS.map(({ row, actor }) => [`${row.method} ${row.file}`, row, actor] as const))("%s refuses malformed JSON", async (_n, row, actor) => {
    for (const raw of ["{not json", "", "{\"a\":", "\u0000", "[".repeat(100_000)]) {
      const error = await refusedWithout(row, actor, raw, 400);
      expect(error.error.code).toMatch(/^bad_request:/);
    }
  });

  it.each(BODY_ROWS.map(({ row, actor }) => [`${row.method} ${row.file}`, row, actor] as const))(
    "%s refuses wrong types in every field with a message naming it",
    async (_n, row, actor) => {
      for (const whole of [null, 7, "text", [], [1, 2], true]) await refusedWithout(row, actor, JSON.stringify(whole), 400);
      const good = (await row.request(w)).body as Record<string, unknown> | undefined;
      for (const [key, value] of Object.entries(good ?? {})) {
        const kind = Array.isArray(value) ? "array" : value === null ? "null" : typeof value;
        for (const wrong of [12345, "text", [], { a: 1 }, true]) {
          const wrongKind = Array.isArray(wrong) ? "array" : typeof wrong;
          if (wrongKind === kind) continue;
          const error = await refusedWithout(row, actor, JSON.stringify({ ...good, [key]: wrong }), 400);
          const named = `${Object.keys(error.error.fields ?? {}).join(" ")} ${error.error.message}`;
          expect(named, `${key} = ${JSON.stringify(wrong)}`).toMatch(key);
        }
      }
    },
  );

  it.each(BODY_ROWS.map(({ row, actor }) => [`${row.method} ${row.file}`, row, actor] as const))(
    "%s refuses a body over its limit, with or without a Content-Length (413)",
    async (_n, row, actor) => {
      const limit = row.file.includes("analysis") ? 64 * 1024 * 1024 : 256 * 1024;
      const padding = JSON.stringify({ padding: "x".repeat(limit) });
      const declared = await refusedWithout(row, actor, padding, 413);
      expect(declared.error.code).toMatch(/^too_large:/);
      const bytes = new TextEncoder().encode(padding);
      const stream = new ReadableStream<Uint8Array>({
        start(controller) {
          for (let i = 0; i < bytes.length; i += 65_536) controller.enqueue(bytes.subarray(i, i + 65_536));
          controller.close();
        },
      });
      await refusedWithout(row, actor, stream, 413);
    },
  );

  it.each(BODY_ROWS.map(({ row, actor }) => [`${row.method} ${row.file}`, row, actor] as const))(
    "%s refuses NUL characters, lone surrogates and bytes that are not UTF-8",
    async (_n, row, actor) => {
      const good = ((await row.request(w)).body ?? {}) as Record<string, unknown>;
      // JSON escapes: what a script can send although no keyboard types it.
      for (const raw of ['"a\\u0000b"', '"a\\ud800b"', '"\\udfff"']) {
        const error = await refusedWithout(row, actor, JSON.stringify({ ...good, sneaky: "VALUE" }).replace('"VALUE"', raw), 400);
        expect(error.error.fields).toHaveProperty("sneaky");
        await refusedWithout(row, actor, JSON.stringify({ ...good, KEY: 1 }).replace('"KEY"', raw), 400);
      }
      await refusedWithout(row, actor, new Uint8Array([0x7b, 0x22, 0x61, 0x22, 0x3a, 0x22, 0xff, 0xfe, 0x22, 0x7d]), 400);
    },
  );
});

describe("text is stored verbatim", () => {
  const STRINGS = [
    "Robert'); DROP TABLE sets;--",
    "1' OR '1'='1",
    '<script>alert("x")</script><img src=x onerror=alert(1)>',
    "\u202Egnirts desrever\u202C and \u2067isolated\u2069", // bidi override and isolate (Unicode TR #9)
    "بار على منتصف القدم",
    "zero\u200Bwidth\u200Cjoin\u200Ders\u2060",
    "🏋️‍♀️ 💪🏽 𝔡𝔢𝔭𝔱𝔥", // 4-byte UTF-8, ZWJ sequences, skin-tone modifiers
    "e\u0301\u0308\u0327 combining",
  ];

  it("in a set's variant and note, read back exactly", async () => {
    for (const text of STRINGS) {
      const created = await call(setsRoute.POST, "/api/sets", {
        method: "POST",
        cookie: w.people.athleteA.cookie,
        body: { teamId: w.team.id, sessionDate: OLD_DATE, lift: "squat", loadKg: 100, reps: 3, cameraView: "side", variant: text.slice(0, 60), note: text },
      });
      expect(created.status, text).toBe(201);
      const { set } = await json<{ set: { id: string } }>(created);
      const read = await json<{ set: { note: string; variant: string } }>(await call(setRoute.GET, "", { cookie: w.people.coach.cookie, params: { setId: set.id } }));
      expect(read.set.note).toBe(text);
      expect(read.set.variant).toBe(text.slice(0, 60));
    }
  });

  it("in a team name, read back exactly; a name of invisible characters only is refused", async () => {
    for (const text of STRINGS) {
      const created = await call(teamsRoute.POST, "/api/teams", { method: "POST", cookie: w.people.athleteB.cookie, body: { name: text.slice(0, 80) } });
      expect(created.status, text).toBe(201);
      const { team } = await json<{ team: { id: string } }>(created);
      const me = await json<{ memberships: { teamId: string; teamName: string }[] }>(await call(meRoute.GET, "", { cookie: w.people.athleteB.cookie }));
      expect(me.memberships.find((m) => m.teamId === team.id)?.teamName).toBe(text.slice(0, 80));
    }
    const before = await rowCounts();
    const invisible = await call(teamsRoute.POST, "/api/teams", { method: "POST", cookie: w.people.athleteB.cookie, body: { name: "\u200B\u200B\u2060" } });
    expect(invisible.status).toBe(400);
    expect(await rowCounts()).toEqual(before);
  });
});

describe("path traversal in storage keys and ids", () => {
  const TRAVERSALS = ["../../etc/passwd", "..%2F..%2Fetc", "sets/../../x", "%00", "a/b", " "];

  it("a set id that is not one is 404 on every set route, for an admin too", async () => {
    const setRows = ROUTES.filter((r) => r.file.includes("[setId]"));
    for (const row of setRows) {
      for (const setId of TRAVERSALS) {
        const handler = await handlerOf(row);
        const response = await call(handler, "/x?uploadId=u", { method: row.method, cookie: w.people.admin.cookie, params: { setId }, body: row.method === "GET" || row.method === "DELETE" ? undefined : {} });
        expect(response.status, `${row.method} ${row.file} with ${setId}`).toBe(404);
      }
    }
  });

  it("an invitation token with slashes or dots is 404", async () => {
    for (const token of TRAVERSALS) {
      expect((await call(invitationRoute.GET, "", { params: { token } })).status).toBe(404);
    }
  });

  it("part numbers must be whole numbers within the clip; an upload id from elsewhere is refused", async () => {
    const { setId, upload } = await freshUpload(w);
    const before = await rowCounts();
    for (const partNumbers of [["../1"], [0], [-1], [1.5], [1e9], ["1"], [null], [1, "../../2"]]) {
      const response = await call(partsRoute.POST, "", { method: "POST", cookie: w.people.athleteA.cookie, params: { setId }, body: { uploadId: upload.uploadId, partNumbers } });
      expect(response.status, JSON.stringify(partNumbers)).toBe(400);
    }
    for (const uploadId of ["../../other", `${upload.uploadId}/../x`, "x".repeat(2000)]) {
      const response = await call(partsRoute.POST, "", { method: "POST", cookie: w.people.athleteA.cookie, params: { setId }, body: { uploadId, partNumbers: [1] } });
      expect([400, 409], uploadId.slice(0, 40)).toContain(response.status);
    }
    expect(await rowCounts()).toEqual(before);
  });

  it("a file name with a path changes nothing about where the clip is stored", async () => {
    const setId = await freshSet(w);
    const response = await call(clipRoute.POST, "", {
      method: "POST",
      cookie: w.people.athleteA.cookie,
      params: { setId },
      body: { sizeBytes: 1000, contentType: "../../video/mp4", fileName: "../../../etc/passwd" },
    });
    expect(response.status).toBe(201);
    const [row] = await db.select({ key: sets.clipStorageKey }).from(sets).where(eq(sets.id, setId));
    // 16 random bytes in base64url are 22 characters (RFC 4648 §5).
    expect(row.key).toMatch(new RegExp(`^sets/${setId}/[A-Za-z0-9_-]{22}/original$`));
  });
});

describe("clips that are not usable videos", () => {
  function ffmpeg(name: string, args: string[]): Uint8Array {
    const out = path.join(workDir, name);
    execFileSync("ffmpeg", ["-hide_banner", "-loglevel", "error", "-y", ...args, out]);
    return readFileSync(out);
  }

  async function refusedClip(bytes: Uint8Array, message: RegExp): Promise<void> {
    const setId = await freshSet(w);
    const response = await uploadWhole(w.people.athleteA, setId, bytes);
    const body = await json<ErrorBody>(response);
    expect(response.status, body.error.message).toBe(400);
    expect(body.error.message).toMatch(message);
    const [row] = await db.select({ status: sets.clipStatus, key: sets.clipStorageKey }).from(sets).where(eq(sets.id, setId));
    expect(row).toEqual({ status: "none", key: null });
  }

  it("refuses a truncated clip (the first 40 % of a real one)", async () => {
    await refusedClip(w.clipBytes.subarray(0, Math.floor(w.clipBytes.length * 0.4)), /cut short/);
  });

  it("refuses a picture too small or too large to analyse", async () => {
    const tiny = ffmpeg("tiny.mp4", ["-f", "lavfi", "-i", "testsrc=size=64x48:rate=30:duration=2", "-pix_fmt", "yuv420p", "-c:v", "libx264"]);
    await refusedClip(tiny, /64×48 pixels/);
    const wide = ffmpeg("wide.mp4", ["-f", "lavfi", "-i", "color=c=gray:size=8192x256:rate=5:duration=2", "-pix_fmt", "yuv420p", "-c:v", "libx264", "-preset", "ultrafast"]);
    await refusedClip(wide, /8192×256 pixels/);
  });

  it("refuses a clip too short to hold a rep", async () => {
    const blink = ffmpeg("blink.mp4", ["-f", "lavfi", "-i", "testsrc=size=640x360:rate=30:duration=0.3", "-pix_fmt", "yuv420p", "-c:v", "libx264"]);
    await refusedClip(blink, /only 0\.\d+ s long/);
  });

  it("refuses audio only", async () => {
    const audio = ffmpeg("audio.mp4", ["-f", "lavfi", "-i", "sine=frequency=440:duration=3", "-c:a", "aac"]);
    await refusedClip(audio, /no video picture/);
  });
});

describe("tracks that cannot be analysed", () => {
  const analysisBody = () => structuredClone(w.analysisBody) as { track: { frames: unknown[]; fps: unknown } };

  async function refusedTrack(raw: string, status = 400): Promise<ErrorBody> {
    const before = await rowCounts();
    const response = await send(analysisRoute.POST, raw, w.people.athleteA.cookie, { setId: w.setA });
    const text = await response.text();
    expect(response.status, text.slice(0, 300)).toBe(status);
    expect(await rowCounts()).toEqual(before);
    return JSON.parse(text) as ErrorBody;
  }

  it("refuses numbers JSON turns into Infinity, and NaN spelled out", async () => {
    const body = analysisBody();
    const text = JSON.stringify(body);
    const overflow = await refusedTrack(text.replace(/"fps":\d+(\.\d+)?/, '"fps":1e999'));
    expect(overflow.error.message).toMatch(/fps/);
    body.track.fps = "NaN";
    expect((await refusedTrack(JSON.stringify(body))).error.message).toMatch(/fps/);
  });

  it("refuses a million frames with a clear message, writing nothing", async () => {
    const body = analysisBody();
    const frames = `[${Array.from({ length: 1_000_000 }, (_, i) => `{"t":${i},"keypoints":[]}`).join(",")}]`;
    const raw = JSON.stringify({ ...body, track: { ...body.track, frames: "FRAMES" } }).replace('"FRAMES"', frames);
    expect(raw.length).toBeLessThan(64 * 1024 * 1024);
    expect((await refusedTrack(raw)).error.message).toMatch(/too many frames/);
  });
});
