// Abuse limits at their real (or deliberately lowered) values: sign-in and sign-up rates per client
// address, invitation and upload rates per person, daily upload quotas per team, and presigned URLs that
// expire soon and open one object only. Clip keys carry 128 random bits.
import { createHash, createHmac, randomUUID } from "node:crypto";
import { afterAll, afterEach, beforeAll, describe, expect, it } from "vitest";
import { count, eq } from "drizzle-orm";
import { closeDb, db } from "@/db";
import { sets } from "@/db/schema";
import { clipUploadStarts } from "@/db/schema-hardening";
import type { MailFake } from "@/dev/fakes/mail-fake";
import { storageConfig } from "@/lib/storage";
import { PART_URL_TTL_S, READ_URL_TTL_S, presignRead, putJson } from "@/lib/clips/storage";
import * as authRoute from "@/app/api/auth/[...all]/route";
import * as invitationsRoute from "@/app/api/teams/[teamId]/invitations/route";
import { BASE_URL, buildWorld, call, json, signUp, startTestMail, uniqueEmail, type World } from "./helpers";
import { presignParts, startTestStorage, startUpload, type StartedUpload, type TestStorage } from "./clip-helpers";
import { createOldSet } from "./access-matrix/world";

let mail: MailFake;
let storage: TestStorage;
let world: World;
const savedEnv = { ...process.env };

beforeAll(async () => {
  mail = await startTestMail();
  storage = await startTestStorage();
  world = await buildWorld("abuse");
});

afterEach(() => {
  // Each test lowers the limits it checks; the next one starts from the test set-up's values.
  for (const key of Object.keys(process.env)) if (key.startsWith("PLUMBLINE_") && !(key in savedEnv)) delete process.env[key];
  Object.assign(process.env, savedEnv);
});

afterAll(async () => {
  await storage?.stop();
  await mail?.stop();
  await closeDb();
});

/** POSTs to better-auth as a client at `ip` (documentation addresses, RFC 5737), as a proxy would forward it. */
function authFrom(ip: string, path: string, body: unknown): Promise<Response> {
  const headers = new Headers({ origin: BASE_URL, "content-type": "application/json", "x-forwarded-for": ip });
  return authRoute.POST(new Request(new URL(`/api/auth${path}`, BASE_URL), { method: "POST", headers, body: JSON.stringify(body) }));
}

describe("rates", () => {
  it("allows 10 sign-in attempts a minute from one address, then answers 429; another address is not held back", async () => {
    const person = await signUp("abuse-sign-in");
    process.env.PLUMBLINE_RATE_LIMIT_FACTOR = "1";
    const statuses = [];
    for (let i = 0; i < 11; i++) statuses.push((await authFrom("203.0.113.10", "/sign-in/email", { email: person.email, password: "wrong-password" })).status);
    expect(statuses.slice(0, 10).every((s) => s === 401)).toBe(true);
    expect(statuses[10]).toBe(429);
    // Even the right password waits out the window from that address.
    expect((await authFrom("203.0.113.10", "/sign-in/email", { email: person.email, password: person.password })).status).toBe(429);
    expect((await authFrom("203.0.113.11", "/sign-in/email", { email: person.email, password: person.password })).status).toBe(200);
  });

  it("allows 5 sign-ups an hour from one address", async () => {
    process.env.PLUMBLINE_RATE_LIMIT_FACTOR = "1";
    const statuses = [];
    for (let i = 0; i < 6; i++) {
      statuses.push((await authFrom("203.0.113.20", "/sign-up/email", { name: "Rate Tester", email: uniqueEmail("abuse-sign-up"), password: `pw-${randomUUID()}` })).status);
    }
    expect(statuses).toEqual([200, 200, 200, 200, 200, 429]);
  });

  it("counts invited addresses per coach (PLUMBLINE_INVITATIONS_PER_HOUR), refusing before anything is stored or mailed", async () => {
    process.env.PLUMBLINE_RATE_LIMIT_FACTOR = "1";
    process.env.PLUMBLINE_INVITATIONS_PER_HOUR = "3";
    const invite = (emails: string[]) =>
      call(invitationsRoute.POST, "", { method: "POST", cookie: world.coachA.cookie, params: { teamId: world.teamA.id }, body: { emails } });
    const first = await invite([uniqueEmail("abuse-i1"), uniqueEmail("abuse-i2")]);
    expect(first.status, await first.clone().text()).toBe(201);
    const sent = mail.messages().length;
    const refused = await invite([uniqueEmail("abuse-i3"), uniqueEmail("abuse-i4")]);
    expect(refused.status).toBe(429);
    expect((await json<{ error: { code: string; message: string } }>(refused)).error).toMatchObject({
      code: "rate_limited:invitation",
      message: expect.stringMatching(/Too many invitations in a short time\. Try again in \d+ s\./),
    });
    expect(mail.messages().length).toBe(sent);
    // Refused attempts use the allowance up too (rate-limiter-flexible counts every attempt).
    expect((await invite([uniqueEmail("abuse-i5")])).status).toBe(429);
    // Another coach has an allowance of their own.
    const other = await call(invitationsRoute.POST, "", { method: "POST", cookie: world.coachB.cookie, params: { teamId: world.teamB.id }, body: { emails: [uniqueEmail("abuse-i6")] } });
    expect(other.status).toBe(201);
  });

  it("counts clip uploads started per person (PLUMBLINE_UPLOADS_PER_HOUR)", async () => {
    process.env.PLUMBLINE_RATE_LIMIT_FACTOR = "1";
    process.env.PLUMBLINE_UPLOADS_PER_HOUR = "2";
    const setId = await createOldSet(world.athleteA2, { teamId: world.teamA.id });
    const statuses = [];
    for (let i = 0; i < 3; i++) statuses.push((await startUpload(world.athleteA2, setId, 1000)).status);
    expect(statuses).toEqual([201, 201, 429]);
  });
});

describe("daily upload quotas per team", () => {
  const ledger = async (quotaKey: string) => (await db.select({ n: count() }).from(clipUploadStarts).where(eq(clipUploadStarts.quotaKey, quotaKey)))[0].n;

  it("refuses the upload past the team's daily count; personal sets and other teams keep their own", async () => {
    const team = await buildWorld("abuse-quota");
    process.env.PLUMBLINE_TEAM_UPLOADS_PER_DAY = "3";
    const sets_ = await Promise.all([1, 2, 3, 4].map(() => createOldSet(team.athleteA1, { teamId: team.teamA.id })));
    const statuses = [];
    for (const setId of sets_) statuses.push((await startUpload(team.athleteA1, setId, 1000)).status);
    expect(statuses).toEqual([201, 201, 201, 429]);
    expect(await ledger(`team:${team.teamA.id}`)).toBe(3);
    // A teammate counts against the same team.
    const mate = await createOldSet(team.athleteA2, { teamId: team.teamA.id });
    const refused = await startUpload(team.athleteA2, mate, 1000);
    expect(refused.status).toBe(429);
    expect((await json<{ error: { message: string } }>(refused)).error.message).toMatch(/This team started 3 clip uploads in the last 24 hours/);
    const [row] = await db.select({ status: sets.clipStatus }).from(sets).where(eq(sets.id, mate));
    expect(row.status).toBe("none");
    expect((await startUpload(team.athleteA1, await createOldSet(team.athleteA1), 1000)).status).toBe(201);
    expect((await startUpload(team.athleteB1, await createOldSet(team.athleteB1, { teamId: team.teamB.id }), 1000)).status).toBe(201);
  });

  it("refuses the bytes past the team's daily volume", async () => {
    const team = await buildWorld("abuse-bytes");
    process.env.PLUMBLINE_TEAM_UPLOAD_GB_PER_DAY = String(1 / 1024); // 1 MiB
    const first = await createOldSet(team.athleteA1, { teamId: team.teamA.id });
    expect((await startUpload(team.athleteA1, first, 700 * 1024)).status).toBe(201);
    const second = await startUpload(team.athleteA1, await createOldSet(team.athleteA1, { teamId: team.teamA.id }), 700 * 1024);
    expect(second.status).toBe(429);
    expect((await json<{ error: { message: string } }>(second)).error.message).toMatch(/daily limit is 1 MB/);
  });

  it("counts uploads started at the same moment one after another", async () => {
    const team = await buildWorld("abuse-race");
    process.env.PLUMBLINE_TEAM_UPLOADS_PER_DAY = "3";
    const setIds = await Promise.all(Array.from({ length: 6 }, () => createOldSet(team.athleteA1, { teamId: team.teamA.id })));
    const statuses = await Promise.all(setIds.map((setId) => startUpload(team.athleteA1, setId, 1000).then((r) => r.status)));
    expect(statuses.filter((s) => s === 201)).toHaveLength(3);
    expect(statuses.filter((s) => s === 429)).toHaveLength(3);
    expect(await ledger(`team:${team.teamA.id}`)).toBe(3);
  });
});

const rfc3986 = (text: string) => encodeURIComponent(text).replace(/[!'()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);
const sha256 = (text: string) => createHash("sha256").update(text).digest("hex");
const hmac = (key: string | Buffer, text: string) => createHmac("sha256", key).update(text).digest();

/**
 * Recomputes a presigned URL's signature the way S3 checks it (AWS Signature Version 4, "Authenticating
 * requests: using query parameters", Amazon S3 API reference): canonical request, string to sign, HMAC chain.
 */
function signatureMatches(href: string): boolean {
  const url = new URL(href);
  const query = [...url.searchParams.entries()].filter(([name]) => name !== "X-Amz-Signature");
  const canonicalQuery = query.map(([n, v]) => `${rfc3986(n)}=${rfc3986(v)}`).sort().join("&");
  const canonicalRequest = ["GET", url.pathname, canonicalQuery, `host:${url.host}\n`, "host", "UNSIGNED-PAYLOAD"].join("\n");
  const [, date, region, service] = (url.searchParams.get("X-Amz-Credential") ?? "").split("/");
  const scope = `${date}/${region}/${service}/aws4_request`;
  const toSign = ["AWS4-HMAC-SHA256", url.searchParams.get("X-Amz-Date"), scope, sha256(canonicalRequest)].join("\n");
  const { secretAccessKey } = storageConfig();
  const signingKey = hmac(hmac(hmac(hmac(`AWS4${secretAccessKey}`, date), region), service), "aws4_request");
  return createHmac("sha256", signingKey).update(toSign).digest("hex") === url.searchParams.get("X-Amz-Signature");
}

describe("presigned URLs and keys", () => {
  it("expire within minutes: 15 for an upload part, 10 for a read (common practice)", async () => {
    expect(PART_URL_TTL_S).toBeLessThanOrEqual(15 * 60);
    expect(READ_URL_TTL_S).toBeLessThanOrEqual(10 * 60);
    const setId = await createOldSet(world.athleteA1, { teamId: world.teamA.id });
    const { upload } = await json<{ upload: StartedUpload }>(await startUpload(world.athleteA1, setId, 1000));
    const { parts } = await json<{ parts: { url: string }[] }>(await presignParts(world.athleteA1, setId, upload.uploadId, [1]));
    expect(new URL(parts[0].url).searchParams.get("X-Amz-Expires")).toBe(String(PART_URL_TTL_S));
  });

  it("open their own object only (the signature covers the key), and nothing once expired", async () => {
    const key = `sets/${randomUUID()}/${randomUUID()}/tracks/a.json`;
    await putJson(key, { mine: true });
    const url = await presignRead(key);
    expect(await (await fetch(url)).json()).toEqual({ mine: true });
    // s3rver does not check version 4 signatures, so check the signature as S3 does.
    expect(signatureMatches(url)).toBe(true);
    const moved = new URL(url);
    moved.pathname = moved.pathname.replace("a.json", "b.json");
    expect(signatureMatches(moved.href)).toBe(false);
    const shortLived = await presignRead(key, 1);
    await new Promise((resolve) => setTimeout(resolve, 2100));
    expect((await fetch(shortLived)).status).toBe(403);
  });

  it("clip keys hold 128 random bits and set ids are random (version 4) UUIDs, never a sequence", async () => {
    const setIds = await Promise.all([1, 2, 3].map(() => createOldSet(world.athleteA1)));
    for (const setId of setIds) expect(setId).toMatch(/^[0-9a-f]{8}-[0-9a-f]{4}-4[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/);
    const keys = new Set<string>();
    for (let i = 0; i < 3; i++) {
      expect((await startUpload(world.athleteA1, setIds[0], 1000)).status).toBe(201);
      const [row] = await db.select({ key: sets.clipStorageKey }).from(sets).where(eq(sets.id, setIds[0]));
      // 16 bytes in base64url are 22 characters (RFC 4648 §5).
      expect(row.key).toMatch(new RegExp(`^sets/${setIds[0]}/[A-Za-z0-9_-]{22}/original$`));
      keys.add(row.key as string);
    }
    expect(keys.size).toBe(3);
  });
});
