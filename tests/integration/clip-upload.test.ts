// Clip uploads through presigned multipart URLs against the in-process S3 fake and real PostgreSQL:
// the round trip with resume, content checks by magic bytes and ffprobe (never the file name), the size
// and duration limits, nothing left behind when a clip is refused, and who may touch a set's clip.
import { execFileSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, db } from "@/db";
import { sets } from "@/db/schema";
import type { MailFake } from "@/dev/fakes/mail-fake";
import { ensureClip } from "@/tests/fixtures/clips/generate-clip";
import { objectSize } from "@/lib/clips/storage";
import * as clipRoute from "@/app/api/sets/[setId]/clip/route";
import * as partsRoute from "@/app/api/sets/[setId]/clip/parts/route";
import * as completeRoute from "@/app/api/sets/[setId]/clip/complete/route";
import * as conversionRoute from "@/app/api/sets/[setId]/clip/conversion/route";
import * as analysisRoute from "@/app/api/sets/[setId]/analysis/route";
import { buildWorld, call, json, startTestMail, type TestPerson, type World } from "./helpers";
import {
  completeUpload,
  createTestSet,
  getClip,
  listParts,
  partBytes,
  presignParts,
  putPart,
  startTestStorage,
  startUpload,
  uploadWhole,
  type StartedUpload,
  type TestStorage,
} from "./clip-helpers";

interface ClipBody {
  status: string;
  sizeBytes: number | null;
  container: string | null;
  codec: string | null;
  durationS: number | null;
  widthPx: number | null;
  heightPx: number | null;
  upload: StartedUpload | null;
  url: string | null;
}
interface ErrorBody {
  error: { code: string; message: string; fields?: Record<string, string> };
}

let mail: MailFake;
let storage: TestStorage;
let world: World;
let workDir: string;
let smallClip: Uint8Array;

beforeAll(async () => {
  mail = await startTestMail();
  storage = await startTestStorage();
  world = await buildWorld("clips");
  workDir = mkdtempSync(path.join(tmpdir(), "plumbline-clip-test-"));
  smallClip = readFileSync((await ensureClip({ width: 640, height: 360, durationS: 12 })).videoPath);
});

afterAll(async () => {
  rmSync(workDir, { recursive: true, force: true });
  await storage?.stop();
  await mail?.stop();
  await closeDb();
});

async function clipOf(person: TestPerson, setId: string): Promise<ClipBody> {
  const response = await getClip(person, setId);
  expect(response.status).toBe(200);
  return (await json<{ clip: ClipBody }>(response)).clip;
}

async function storageKeyOf(setId: string): Promise<string | null> {
  const [row] = await db.select({ key: sets.clipStorageKey }).from(sets).where(eq(sets.id, setId));
  return row.key;
}

describe("multipart upload through presigned URLs", () => {
  it("stores a real mp4 byte for byte, resuming from the parts storage lists, and reads it back", async () => {
    const clip = await ensureClip();
    const bytes = readFileSync(clip.videoPath);
    const setId = await createTestSet(world.athleteA1, { teamId: world.teamA.id });
    const started = await startUpload(world.athleteA1, setId, bytes.length);
    expect(started.status).toBe(201);
    const { upload } = await json<{ upload: StartedUpload }>(started);
    expect(upload.partCount).toBe(Math.ceil(bytes.length / upload.partSizeBytes));
    expect(upload.partCount).toBeGreaterThan(1);

    // First half of the parts, then the connection "drops".
    const firstHalf = Array.from({ length: Math.floor(upload.partCount / 2) }, (_, i) => i + 1);
    const urls = (await json<{ parts: { partNumber: number; url: string }[] }>(await presignParts(world.athleteA1, setId, upload.uploadId, firstHalf))).parts;
    for (const part of urls) await putPart(part.url, partBytes(bytes, part.partNumber));

    // Resume: the page asks which parts arrived and sends only the rest.
    expect((await clipOf(world.athleteA1, setId)).upload?.uploadId).toBe(upload.uploadId);
    const listed = await json<{ parts: { partNumber: number; etag: string; sizeBytes: number }[] }>(
      await listParts(world.athleteA1, setId, upload.uploadId),
    );
    expect(listed.parts.map((p) => p.partNumber)).toEqual(firstHalf);
    expect(listed.parts.every((p) => p.sizeBytes === upload.partSizeBytes)).toBe(true);
    const rest = Array.from({ length: upload.partCount }, (_, i) => i + 1).filter((n) => !firstHalf.includes(n));
    const restUrls = (await json<{ parts: { partNumber: number; url: string }[] }>(await presignParts(world.athleteA1, setId, upload.uploadId, rest))).parts;
    const restParts = [];
    for (const part of restUrls) restParts.push({ partNumber: part.partNumber, etag: await putPart(part.url, partBytes(bytes, part.partNumber)) });

    const completed = await completeUpload(world.athleteA1, setId, upload.uploadId, [
      ...listed.parts.map(({ partNumber, etag }) => ({ partNumber, etag })),
      ...restParts,
    ]);
    expect(completed.status).toBe(200);
    const stored = (await json<{ clip: ClipBody }>(completed)).clip;
    // The clip's own facts (tests/fixtures/clips: 1280x720, 12 s at 30 fps, H.264 in mp4).
    expect(stored).toMatchObject({ status: "uploaded", sizeBytes: bytes.length, container: "mp4", codec: "h264", widthPx: 1280, heightPx: 720 });
    expect(stored.durationS).toBeCloseTo(12, 1);

    const download = await fetch(stored.url as string);
    expect(download.status).toBe(200);
    expect(Buffer.from(await download.arrayBuffer()).equals(bytes)).toBe(true);
    const [row] = await db.select().from(sets).where(eq(sets.id, setId));
    expect(row.status).toBe("uploaded");
    expect(row.clipUploadId).toBeNull();
    // Unguessable and scoped per set: sets/<setId>/<22 base64url characters = 128 random bits>/original.
    expect(row.clipStorageKey).toMatch(new RegExp(`^sets/${setId}/[A-Za-z0-9_-]{22}/original$`));
  });

  it("gives each clip its own random folder", async () => {
    const setId = await createTestSet(world.athleteA1);
    await uploadWhole(world.athleteA1, setId, smallClip);
    const first = await storageKeyOf(setId);
    expect((await uploadWhole(world.athleteA1, setId, smallClip)).status).toBe(200);
    const second = await storageKeyOf(setId);
    expect(second).not.toBe(first);
    expect(await objectSize(first as string)).toBeNull();
  });

  it("accepts a WebM by its EBML header", async () => {
    const webm = readFileSync((await ensureClip({ width: 640, height: 360, durationS: 12, codec: "vp9", seed: 2 })).videoPath);
    const setId = await createTestSet(world.athleteA1);
    const response = await uploadWhole(world.athleteA1, setId, webm);
    expect(response.status).toBe(200);
    expect((await json<{ clip: ClipBody }>(response)).clip).toMatchObject({ container: "webm", codec: "vp9" });
  });
});

describe("refused clips leave nothing behind", () => {
  async function expectRefused(setId: string, response: Response, message: RegExp): Promise<void> {
    expect(response.status).toBe(400);
    const body = await json<ErrorBody>(response);
    expect(body.error.code).toBe("bad_request:clip");
    expect(body.error.message).toMatch(message);
    const clip = await clipOf(world.athleteA1, setId);
    expect(clip).toMatchObject({ status: "none", url: null, upload: null });
    expect(await storageKeyOf(setId)).toBeNull();
    const [row] = await db.select({ status: sets.status }).from(sets).where(eq(sets.id, setId));
    expect(row.status).toBe("draft");
  }

  it("refuses a text file named .mp4 with a clear 400, by its content", async () => {
    const setId = await createTestSet(world.athleteA1);
    const text = new TextEncoder().encode("These are my squat notes, saved as squat.mp4 by mistake.\n".repeat(20));
    await expectRefused(setId, await uploadWhole(world.athleteA1, setId, text), /not a video.*checked by its content, not its name/);
  });

  it("refuses a broken video (a right header, then garbage) and a still image", async () => {
    const setId = await createTestSet(world.athleteA1);
    const broken = new Uint8Array(smallClip.length);
    broken.set(smallClip.subarray(0, 32));
    broken.fill(7, 32);
    await expectRefused(setId, await uploadWhole(world.athleteA1, setId, broken), /could not be read|no video picture/);
    // ISO/IEC 23008-12: a HEIF still image starts with an ftyp box of brand "heic" (from memory).
    const heic = new Uint8Array(64);
    heic.set([0, 0, 0, 24, ...new TextEncoder().encode("ftypheic")]);
    await expectRefused(setId, await uploadWhole(world.athleteA1, setId, heic), /still image/);
  });

  it("refuses a clip over the duration limit of 3 minutes", async () => {
    const longClip = path.join(workDir, "long.mp4");
    execFileSync("ffmpeg", ["-hide_banner", "-loglevel", "error", "-f", "lavfi", "-i", "color=c=gray:s=64x64:r=2", "-t", "185", "-c:v", "libx264", "-pix_fmt", "yuv420p", longClip]);
    const setId = await createTestSet(world.athleteA1);
    await expectRefused(setId, await uploadWhole(world.athleteA1, setId, readFileSync(longClip)), /185 s long; the limit is 3 minutes/);
  });

  it("refuses a declared size over 500 MB before any upload starts", async () => {
    const setId = await createTestSet(world.athleteA1);
    const response = await startUpload(world.athleteA1, setId, 500 * 1024 * 1024 + 1);
    expect(response.status).toBe(400);
    expect((await json<ErrorBody>(response)).error.fields?.sizeBytes).toMatch(/larger than 500 MB/);
    expect((await clipOf(world.athleteA1, setId)).status).toBe("none");
  });

  it("refuses an upload whose stored size differs from the declared one", async () => {
    const setId = await createTestSet(world.athleteA1);
    const started = await json<{ upload: StartedUpload }>(await startUpload(world.athleteA1, setId, 1000));
    const [part] = (await json<{ parts: { url: string }[] }>(await presignParts(world.athleteA1, setId, started.upload.uploadId, [1]))).parts;
    const etag = await putPart(part.url, smallClip);
    const response = await completeUpload(world.athleteA1, setId, started.upload.uploadId, [{ partNumber: 1, etag }]);
    await expectRefused(setId, response, /holds \d+ bytes but the clip has 1000/);
  });

  it("refuses parts beyond the declared size and a stale upload id", async () => {
    const setId = await createTestSet(world.athleteA1);
    const { upload } = await json<{ upload: StartedUpload }>(await startUpload(world.athleteA1, setId, 1000));
    expect((await presignParts(world.athleteA1, setId, upload.uploadId, [2])).status).toBe(400);
    const stale = await completeUpload(world.athleteA1, setId, "0123abcd", [{ partNumber: 1, etag: "x" }]);
    expect(stale.status).toBe(409);
    expect((await json<ErrorBody>(stale)).error.code).toBe("conflict:upload");
  });

  it("cancels an upload in progress: the set has no clip and can start again", async () => {
    const setId = await createTestSet(world.athleteA1);
    const { upload } = await json<{ upload: StartedUpload }>(await startUpload(world.athleteA1, setId, smallClip.length));
    const cancelled = await call(clipRoute.DELETE, `/x?uploadId=${upload.uploadId}`, { method: "DELETE", cookie: world.athleteA1.cookie, params: { setId } });
    expect(cancelled.status).toBe(204);
    expect((await clipOf(world.athleteA1, setId)).status).toBe("none");
    expect((await uploadWhole(world.athleteA1, setId, smallClip)).status).toBe(200);
  });
});

describe("who may touch a set's clip and analysis", () => {
  let setId: string;
  type Maker = (person: TestPerson | undefined) => Promise<Response>;
  const routes: Record<string, Maker> = {};

  beforeAll(async () => {
    setId = await createTestSet(world.athleteA1, { teamId: world.teamA.id });
    expect((await uploadWhole(world.athleteA1, setId, smallClip)).status).toBe(200);
    const params = { setId };
    const as = (person: TestPerson | undefined) => person?.cookie;
    Object.assign(routes, {
      "GET clip": (p: TestPerson | undefined) => call(clipRoute.GET, "", { cookie: as(p), params }),
      "POST clip": (p: TestPerson | undefined) => call(clipRoute.POST, "", { method: "POST", cookie: as(p), params, body: { sizeBytes: 10 } }),
      "DELETE clip": (p: TestPerson | undefined) => call(clipRoute.DELETE, "/x?uploadId=feed", { method: "DELETE", cookie: as(p), params }),
      "GET parts": (p: TestPerson | undefined) => call(partsRoute.GET, "/x?uploadId=feed", { cookie: as(p), params }),
      "POST parts": (p: TestPerson | undefined) => call(partsRoute.POST, "", { method: "POST", cookie: as(p), params, body: { uploadId: "feed", partNumbers: [1] } }),
      "POST complete": (p: TestPerson | undefined) =>
        call(completeRoute.POST, "", { method: "POST", cookie: as(p), params, body: { uploadId: "feed", parts: [{ partNumber: 1, etag: "x" }] } }),
      "POST conversion": (p: TestPerson | undefined) => call(conversionRoute.POST, "", { method: "POST", cookie: as(p), params }),
      "GET analysis": (p: TestPerson | undefined) => call(analysisRoute.GET, "", { cookie: as(p), params }),
      "POST analysis": (p: TestPerson | undefined) => call(analysisRoute.POST, "", { method: "POST", cookie: as(p), params, body: {} }),
    });
  });

  it("refuses a teammate, another team's coach and a person on no team (403), and anyone signed out (401)", async () => {
    for (const [name, make] of Object.entries(routes)) {
      for (const person of [world.athleteA2, world.coachB, world.athleteB1, world.outsider]) {
        const response = await make(person);
        expect(response.status, `${name} as ${person.name}`).toBe(403);
        expect((await json<ErrorBody>(response)).error.code).toBe("forbidden:set");
      }
      expect((await make(undefined)).status, `${name} signed out`).toBe(401);
    }
  });

  it("gives read URLs only to viewers with access, and 404 for an unknown set", async () => {
    const forCoach = await clipOf(world.coachA, setId);
    expect(forCoach.url ?? "").toMatch(/X-Amz-Expires=600/);
    const unknown = await getClip(world.admin, "00000000-0000-4000-8000-000000000000");
    expect(unknown.status).toBe(404);
  });

  it("lets the athlete, the team's coach and an admin through (the route then judges the request itself)", async () => {
    for (const [name, make] of Object.entries(routes)) {
      for (const person of [world.athleteA1, world.coachA, world.admin]) {
        const response = await make(person);
        expect([401, 403], `${name} as ${person.name}: ${response.status}`).not.toContain(response.status);
      }
    }
  });
});
