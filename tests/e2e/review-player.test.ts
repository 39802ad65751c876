// The review player in a real Chromium against the production build: the demo coach opens the review page
// of an analysed set, steps to a frame with the keyboard (the video really presents that frame), draws a
// protractor, reloads and finds it on exactly that frame with the same angle; an edit made offline is
// saved once the connection is back; the athlete sees the markup read-only and cannot write it.
// The analysed set is made fast: a synthetic track (tests/fixtures/synthetic) analysed in Node and a test
// pattern clip of the same size and frame rate from ffmpeg, uploaded and saved through the real routes.
import { execFileSync } from "node:child_process";
import { randomUUID } from "node:crypto";
import { mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import type { APIRequestContext, Browser, BrowserContext, Page } from "playwright-core";
import pg from "pg";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { analyseTrack } from "@/lib/analysis/analyse";
import { parseTrack } from "@/lib/analysis/track";
import { DEMO_ATHLETES, DEMO_COACH, DEMO_PASSWORD, DEMO_TEAM_ID, seedDemoData } from "@/dev/demo/seed";
import { generateSyntheticSet, type TrackJson } from "@/tests/fixtures/synthetic";
import { launchBrowser } from "./browser";

const baseUrl = inject("baseUrl");
const databaseUrl = inject("databaseUrl");
const athlete = DEMO_ATHLETES[0];
const SOFT = { waitUntil: "commit" } as const;
const TARGET_FRAME = 12;

/** Waits for a value in the page; generous, because the machine running the tests is shared. */
const poll = <T>(read: () => Promise<T>) => expect.poll(read, { timeout: 15_000 });

// Points of a 3-4-5 right triangle scaled up (common practice): rays from the vertex to (0, -4) and
// (3, 4) meet at 180° − atan(3/4) = 143.13°.
const EXPECTED_ANGLE_DEG = 180 - (Math.atan(3 / 4) * 180) / Math.PI;

let browser: Browser;
let db: pg.Client;
let track: TrackJson;
let setId: string;
let workDir: string;

async function signIn(context: BrowserContext, person: { email: string }): Promise<Page> {
  const page = await context.newPage();
  await page.goto("/sign-in");
  await page.getByLabel("E-mail").fill(person.email);
  await page.getByLabel("Password").fill(DEMO_PASSWORD);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL("**/app/**", SOFT);
  return page;
}

async function ok<T>(response: Awaited<ReturnType<APIRequestContext["post"]>>): Promise<T> {
  if (!response.ok()) throw new Error(`${response.url()} answered ${response.status()}: ${await response.text()}`);
  return (await response.json()) as T;
}

/** A set with a clip and a saved analysis, created by the athlete through the API. */
async function analysedSet(request: APIRequestContext, clipPath: string): Promise<string> {
  const { set } = await ok<{ set: { id: string } }>(
    await request.post("/api/sets", { data: { teamId: DEMO_TEAM_ID, sessionDate: "2026-11-30", lift: "squat", loadKg: 150, reps: 2, cameraView: "side" } }),
  );
  const bytes = readFileSync(clipPath);
  const { upload } = await ok<{ upload: { uploadId: string; partSizeBytes: number; partCount: number } }>(
    await request.post(`/api/sets/${set.id}/clip`, { data: { sizeBytes: bytes.length, contentType: "video/mp4" } }),
  );
  const numbers = Array.from({ length: upload.partCount }, (_, i) => i + 1);
  const { parts } = await ok<{ parts: { partNumber: number; url: string }[] }>(
    await request.post(`/api/sets/${set.id}/clip/parts`, { data: { uploadId: upload.uploadId, partNumbers: numbers } }),
  );
  const done = [];
  for (const part of parts) {
    const chunk = bytes.subarray((part.partNumber - 1) * upload.partSizeBytes, part.partNumber * upload.partSizeBytes);
    const put = await fetch(part.url, { method: "PUT", body: new Uint8Array(chunk) });
    done.push({ partNumber: part.partNumber, etag: put.headers.get("etag") as string });
  }
  await ok(await request.post(`/api/sets/${set.id}/clip/complete`, { data: { uploadId: upload.uploadId, parts: done } }));
  const result = analyseTrack(parseTrack(track), { includeFrames: true, loadKg: 150 });
  await ok(
    await request.post(`/api/sets/${set.id}/analysis`, {
      data: { model: { id: "movenet-lightning", version: "test" }, settings: {}, calibration: track.calibration, result, track },
    }),
  );
  return set.id;
}

async function openReview(page: Page): Promise<void> {
  await page.goto(`/app/sets/${setId}/review`);
  await page
    .locator('[data-testid="review-player"][data-ready="true"]')
    .waitFor({ timeout: 60_000 })
    .catch(async (error: Error) => {
      // Say which part never arrived: the clip, the frame times or the markup.
      const player = page.getByTestId("review-player");
      const parts = ["data-video-ready", "data-frame-count", "data-markup-loaded"].map(async (name) => `${name}=${await player.getAttribute(name)}`);
      throw new Error(`the player never became ready (${(await Promise.all(parts)).join(", ")}): ${error.message}`);
    });
}

/** Focuses the player and steps to a frame with the arrow keys; waits until the video presents it. */
async function stepTo(page: Page, frame: number): Promise<void> {
  await page.getByTestId("review-player").focus();
  await page.keyboard.press("Shift+ArrowRight");
  for (let i = 10; i < frame; i++) await page.keyboard.press("ArrowRight");
  const shown = page.getByTestId("player-frame");
  await poll(() => shown.getAttribute("data-frame-index")).toBe(String(frame));
  await poll(() => shown.getAttribute("data-presented-index")).toBe(String(frame));
}

/** Screen position of a point given in video pixels (the player fits the clip to its width at zoom 1). */
async function screenOf(page: Page, x: number, y: number): Promise<{ x: number; y: number }> {
  const box = await page.getByTestId("review-player").locator("canvas").first().boundingBox();
  if (!box) throw new Error("the player's canvas is not on screen");
  const scale = box.width / track.width;
  return { x: box.x + x * scale, y: box.y + y * scale };
}

function markupOnFrame(page: Page) {
  return page.getByTestId("markup-shape");
}

beforeAll(async () => {
  await seedDemoData(databaseUrl);
  db = new pg.Client({ connectionString: databaseUrl });
  await db.connect();
  ({ track } = generateSyntheticSet({ lift: "squat", seed: 11, reps: 2, view: "side", fps: 30, noise: "none" }));
  workDir = mkdtempSync(path.join(tmpdir(), "plumbline-review-"));
  const clipPath = path.join(workDir, "clip.mp4");
  const durationS = track.frames[track.frames.length - 1].t + 0.5;
  // A test pattern with the track's size and frame rate: frame i is presented at i/30 s, like the track's.
  execFileSync("ffmpeg", [
    "-hide_banner", "-loglevel", "error", "-f", "lavfi", "-i", `testsrc2=size=${track.width}x${track.height}:rate=30`,
    "-t", durationS.toFixed(2), "-c:v", "libx264", "-preset", "ultrafast", "-pix_fmt", "yuv420p", "-g", "15", clipPath,
  ]);
  browser = await launchBrowser();
  const athleteContext = await browser.newContext({ baseURL: baseUrl });
  await signIn(athleteContext, athlete);
  setId = await analysedSet(athleteContext.request, clipPath);
  await athleteContext.close();
}, 180_000);

afterAll(async () => {
  await browser?.close();
  await db?.end();
  if (workDir) rmSync(workDir, { recursive: true, force: true });
});

describe("review player and markup", () => {
  let coach: BrowserContext;
  let page: Page;

  beforeAll(async () => {
    coach = await browser.newContext({ baseURL: baseUrl, viewport: { width: 1280, height: 1000 } });
    page = await signIn(coach, DEMO_COACH);
  });

  afterAll(async () => {
    await coach?.close();
  });

  it("steps to a frame with the keyboard, on the analysis's own frame times", { timeout: 90_000 }, async () => {
    await openReview(page);
    await stepTo(page, TARGET_FRAME);
    await expect(page.getByTestId("player-frame").getAttribute("data-time-s")).resolves.toBe(track.frames[TARGET_FRAME].t.toFixed(4));
    await page.keyboard.press("ArrowLeft");
    await poll(() => page.getByTestId("player-frame").getAttribute("data-frame-index")).toBe(String(TARGET_FRAME - 1));
    await page.keyboard.press("ArrowRight");
    await poll(() => page.getByTestId("player-frame").getAttribute("data-presented-index")).toBe(String(TARGET_FRAME));
  });

  it("draws a protractor that is back on exactly that frame, with the same angle, after a reload", { timeout: 90_000 }, async () => {
    await page.getByRole("button", { name: "Protractor", exact: true }).click();
    const unit = Math.round(track.height / 12);
    const vertex = { x: track.width / 2, y: track.height / 2 };
    const a = await screenOf(page, vertex.x, vertex.y - 4 * unit);
    const v = await screenOf(page, vertex.x, vertex.y);
    const b = await screenOf(page, vertex.x + 3 * unit, vertex.y + 4 * unit);
    await page.mouse.move(a.x, a.y);
    await page.mouse.down();
    await page.mouse.move(v.x, v.y, { steps: 6 });
    await page.mouse.up();
    await page.mouse.move(b.x, b.y, { steps: 6 });
    await page.mouse.down();
    await page.mouse.up();

    const shape = markupOnFrame(page);
    await poll(() => shape.count()).toBe(1);
    const drawnAngle = Number(await shape.getAttribute("data-measure"));
    // Pointer positions are rounded to whole screen pixels, so the drawn angle is near, not at, the ideal one.
    expect(Math.abs(drawnAngle - EXPECTED_ANGLE_DEG)).toBeLessThan(1.5);
    await poll(() => page.getByTestId("markup-sync").getAttribute("data-pending")).toBe("0");
    const { rows } = await db.query("select frame_index, kind, geometry from markup_shapes where set_id = $1 and deleted_at is null", [setId]);
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({ frame_index: TARGET_FRAME, kind: "protractor", geometry: { mode: "three-point" } });

    await page.reload();
    await page.locator('[data-testid="review-player"][data-ready="true"]').waitFor({ timeout: 60_000 });
    await expect(page.getByTestId("player-frame").getAttribute("data-frame-index")).resolves.toBe("0");
    await expect(markupOnFrame(page).count()).resolves.toBe(0);
    await stepTo(page, TARGET_FRAME);
    await poll(() => markupOnFrame(page).count()).toBe(1);
    await expect(markupOnFrame(page).getAttribute("data-measure")).resolves.toBe(drawnAngle.toFixed(2));
    await expect(markupOnFrame(page).getAttribute("data-frame-index")).resolves.toBe(String(TARGET_FRAME));
    await page.keyboard.press("ArrowRight");
    await poll(() => markupOnFrame(page).count()).toBe(0);
  });

  it("keeps an edit made offline and saves it when the connection is back", { timeout: 60_000 }, async () => {
    await page.getByTestId("review-player").focus();
    await page.getByRole("button", { name: "Ring", exact: true }).click();
    await coach.setOffline(true);
    const from = await screenOf(page, track.width * 0.3, track.height * 0.6);
    const to = await screenOf(page, track.width * 0.4, track.height * 0.7);
    await page.mouse.move(from.x, from.y);
    await page.mouse.down();
    await page.mouse.move(to.x, to.y, { steps: 5 });
    await page.mouse.up();
    await poll(() => page.getByTestId("markup-sync").getAttribute("data-pending")).toBe("1");
    const pending = await page.evaluate((key) => window.localStorage.getItem(key), `plumbline:markup:${setId}:pending`);
    expect(pending).toContain('"ring"');
    await coach.setOffline(false);
    await poll(() => page.getByTestId("markup-sync").getAttribute("data-pending")).toBe("0");
    const { rows } = await db.query("select count(*)::int as n from markup_shapes where set_id = $1 and kind = 'ring' and deleted_at is null", [setId]);
    expect(rows[0].n).toBe(1);
  });
});

describe("the athlete", () => {
  it("sees the markup where it was drawn, read-only, and cannot write it", { timeout: 90_000 }, async () => {
    const context = await browser.newContext({ baseURL: baseUrl, viewport: { width: 1280, height: 1000 } });
    try {
      const page = await signIn(context, athlete);
      await openReview(page);
      await expect(page.getByTestId("review-player").getAttribute("data-can-edit")).resolves.toBe("false");
      await expect(page.getByTestId("markup-toolbar").count()).resolves.toBe(0);
      await stepTo(page, TARGET_FRAME);
      await poll(() => markupOnFrame(page).count()).toBe(1);
      await expect(markupOnFrame(page).getAttribute("data-kind")).resolves.toBe("protractor");
      const { rows } = await db.query("select id, revision from markup_shapes where set_id = $1 and kind = 'protractor'", [setId]);
      const refused = await context.request.put(`/api/sets/${setId}/markup/${randomUUID()}`, {
        data: {
          frameIndex: 1,
          frameTimeS: track.frames[1].t,
          geometry: { kind: "arrow", from: { x: 0, y: 0 }, to: { x: 10, y: 10 } },
          style: { colour: "fault", stroke: "heavy" },
          revision: 1,
        },
      });
      expect(refused.status()).toBe(403);
      const deleteRefused = await context.request.delete(`/api/sets/${setId}/markup/${rows[0].id}?revision=${rows[0].revision + 1}`);
      expect(deleteRefused.status()).toBe(403);
      const after = await db.query("select count(*)::int as n from markup_shapes where set_id = $1 and deleted_at is null", [setId]);
      expect(after.rows[0].n).toBe(2);
    } finally {
      await context.close();
    }
  });
});
