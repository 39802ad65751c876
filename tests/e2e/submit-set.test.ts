// Submitting and analysing a set in a real Chromium against the production build: the seeded demo athlete
// uploads a synthetic clip through the form (multipart, straight to the S3 fake), taps the plate on the
// first frame, the worker analyses the clip, the result page lists the reps, PostgreSQL holds them, and
// they agree with the command line's analysis of the same clip. A non-video and a broken video each get
// a clear message. The gym and athlete are the invented demo data of dev/demo/seed.ts.
import { execFileSync, spawnSync } from "node:child_process";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import type { Browser, BrowserContext, Page } from "playwright-core";
import pg from "pg";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { z } from "zod";
import { DEMO_ATHLETES, DEMO_COACH, DEMO_PASSWORD, seedDemoData } from "@/dev/demo/seed";
import { ensureClip, type GeneratedClip } from "@/tests/fixtures/clips/generate-clip";
import { launchBrowser } from "./browser";

const baseUrl = inject("baseUrl");
const databaseUrl = inject("databaseUrl");
const athlete = DEMO_ATHLETES[0];

// Client-side navigations never fire a load event; the URL changing is what to wait for.
const SOFT = { waitUntil: "commit" } as const;
const SET_URL = /\/app\/sets\/[0-9a-f-]{36}$/;

/**
 * Browser and command line decode with different decoders (WebCodecs, ffmpeg) and schedule pose on
 * their own clocks, but track the bar on every frame from the same plate circle: their mean concentric
 * velocities agree to within this (the brief's accuracy target for velocity, 0.03 m/s).
 */
const VELOCITY_TOLERANCE_MPS = 0.03;

const cliResultSchema = z.object({
  reps: z.array(z.object({ index: z.number(), meanConcentricVelocityMps: z.number(), romM: z.number() })),
});

let browser: Browser;
let context: BrowserContext;
let page: Page;
let db: pg.Client;
let clip: GeneratedClip;
let workDir: string;

async function signIn(person: { email: string } = athlete): Promise<void> {
  await page.goto("/sign-in");
  await page.getByLabel("E-mail").fill(person.email);
  await page.getByLabel("Password").fill(DEMO_PASSWORD);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL("**/app/**", SOFT);
}

async function fillSet(reps: number): Promise<void> {
  await page.goto("/app/sets/new");
  await page.getByLabel("Load").fill("170");
  await page.getByLabel("Reps").fill(String(reps));
  await page.getByLabel("RPE").fill("8");
}

beforeAll(async () => {
  await seedDemoData(databaseUrl);
  db = new pg.Client({ connectionString: databaseUrl });
  await db.connect();
  clip = await ensureClip({ width: 640, height: 360, durationS: 12 });
  workDir = mkdtempSync(path.join(tmpdir(), "plumbline-e2e-"));
  browser = await launchBrowser();
  context = await browser.newContext({ baseURL: baseUrl, viewport: { width: 1100, height: 900 } });
  page = await context.newPage();
  await signIn();
});

afterAll(async () => {
  await browser?.close();
  await db?.end();
  if (workDir) rmSync(workDir, { recursive: true, force: true });
});

/** Taps the plate's centre (clip pixels from the clip's truth) on the first frame shown by the analysis step. */
async function tapPlate(): Promise<void> {
  const marker = page.getByTestId("plate-marker").locator("canvas").first();
  await marker.waitFor({ timeout: 120_000 });
  const box = await marker.boundingBox();
  if (!box) throw new Error("the first frame is not on screen");
  const scale = box.width / clip.truth.options.width;
  const start = clip.truth.frames[0];
  await page.mouse.click(box.x + start.cx * scale, box.y + start.cy * scale);
}

/** Waits for the reps table, or fails with the text of the analysis step's failure banner. */
async function waitForReps(): Promise<void> {
  const failure = page.getByRole("alert").filter({ hasText: "could not finish" });
  await page.getByTestId("reps-table").or(failure).waitFor({ timeout: 240_000 });
  expect(await failure.count(), (await failure.allTextContents()).join(" ")).toBe(0);
}

describe("submit and analyse a set", () => {
  let setId: string;

  it("uploads the clip through the form and opens the set's analysis step", async () => {
    await fillSet(clip.truth.reps.length);
    await page.getByLabel("Clip").setInputFiles(clip.videoPath);
    await expect(page.getByTestId("clip-facts").textContent()).resolves.toMatch(/MP4 · \d+ MB · 12\.0 s · 640×360/);
    await page.getByRole("button", { name: "Save and upload" }).click();
    await page.waitForURL(SET_URL, { ...SOFT, timeout: 60_000 });
    setId = page.url().split("/").pop() as string;
    const { rows } = await db.query("select clip_status, clip_codec, status from sets where id = $1", [setId]);
    expect(rows[0]).toEqual({ clip_status: "uploaded", clip_codec: "h264", status: "uploaded" });
  });

  it("marks the plate with a tap, analyses in the worker and shows every rep", { timeout: 300_000 }, async () => {
    await tapPlate();
    await page.getByRole("button", { name: "Analyse the set" }).click();
    await page.getByRole("progressbar").first().waitFor();
    // The page answers while the worker runs.
    const answeredMs = await page.evaluate(async () => {
      const t0 = performance.now();
      await new Promise((resolve) => requestAnimationFrame(resolve));
      return performance.now() - t0;
    });
    expect(answeredMs).toBeLessThan(1000);
    await waitForReps();
    const rows = page.getByTestId("reps-table").locator("tbody tr");
    await expect(rows.count()).resolves.toBe(clip.truth.reps.length);
    await expect(page.getByTestId("bar-trace").locator("polyline").count()).resolves.toBeGreaterThan(clip.truth.reps.length);
    await expect(page.getByTestId("cautions").textContent()).resolves.toMatch(/./);
  });

  it("holds the reps in the database, matching the command line's analysis of the same clip", { timeout: 300_000 }, async () => {
    const analysis = await db.query(
      "select id, settings -> 'pipeline' -> 'plate' as plate, model from analyses where set_id = $1 and is_current",
      [setId],
    );
    expect(analysis.rows).toHaveLength(1);
    const plate = analysis.rows[0].plate as { cx: number; cy: number; radiusPx: number };
    const reps = await db.query("select rep_index, mean_concentric_velocity_mps from reps where analysis_id = $1 order by rep_index", [
      analysis.rows[0].id,
    ]);
    expect(reps.rows.map((r) => r.rep_index)).toEqual(clip.truth.reps.map((r) => r.index));
    const series = await db.query("select count(*)::int as n from rep_series s join reps r on r.id = s.rep_id where r.analysis_id = $1", [
      analysis.rows[0].id,
    ]);
    expect(series.rows[0].n).toBeGreaterThanOrEqual(3 * reps.rows.length);

    const cli = spawnSync(
      "npm",
      ["run", "--silent", "analyse", "--", "--video", clip.videoPath, "--lift", "squat", "--view", "side", "--plate", `${plate.cx},${plate.cy},${plate.radiusPx}`, "--compact"],
      { encoding: "utf8", maxBuffer: 64 * 1024 * 1024 },
    );
    expect(cli.status, cli.stderr).toBe(0);
    const fromCli = cliResultSchema.parse(JSON.parse(cli.stdout));
    expect(fromCli.reps).toHaveLength(reps.rows.length);
    for (const [i, row] of reps.rows.entries()) {
      expect(Math.abs(row.mean_concentric_velocity_mps - fromCli.reps[i].meanConcentricVelocityMps)).toBeLessThan(VELOCITY_TOLERANCE_MPS);
    }
  });

  it("analyses an HEVC clip, which this Chromium cannot decode, from the server's H.264 copy", { timeout: 300_000 }, async () => {
    const hevc = path.join(workDir, "phone-hevc.mp4");
    execFileSync("ffmpeg", ["-hide_banner", "-loglevel", "error", "-i", clip.videoPath, "-c:v", "libx265", "-preset", "ultrafast", "-x265-params", "log-level=error", "-tag:v", "hvc1", hevc]);
    await fillSet(clip.truth.reps.length);
    await page.getByLabel("Clip").setInputFiles(hevc);
    await page.getByTestId("clip-facts").waitFor();
    await page.getByRole("button", { name: "Save and upload" }).click();
    await page.waitForURL(SET_URL, { ...SOFT, timeout: 60_000 });
    const hevcSetId = page.url().split("/").pop() as string;
    await tapPlate();
    const { rows } = await db.query("select clip_codec, clip_status, clip_converted_key from sets where id = $1", [hevcSetId]);
    expect(rows[0]).toMatchObject({ clip_codec: "hevc", clip_status: "ready", clip_converted_key: expect.stringMatching(/\/converted\.mp4$/) });
    await page.getByRole("button", { name: "Analyse the set" }).click();
    await waitForReps();
    await expect(page.getByTestId("reps-table").locator("tbody tr").count()).resolves.toBe(clip.truth.reps.length);
  });

  it("lists the athlete's sets for their coach, who can open them", async () => {
    const coachContext = await browser.newContext({ baseURL: baseUrl, viewport: { width: 1100, height: 900 } });
    const athletePage = page;
    page = await coachContext.newPage();
    try {
      await signIn(DEMO_COACH);
      await page.goto("/app/sets");
      await page.locator(`a[href="/app/sets/${setId}"]`).click();
      await page.waitForURL(`**/app/sets/${setId}`, SOFT);
      await page.getByTestId("reps-table").waitFor();
      await expect(page.getByTestId("reps-table").locator("tbody tr").count()).resolves.toBe(clip.truth.reps.length);
    } finally {
      page = athletePage;
      await coachContext.close();
    }
  });

  it("refuses a text file named .mp4 in the browser, by its content", async () => {
    await fillSet(3);
    await page.getByLabel("Clip").setInputFiles({ name: "squat.mp4", mimeType: "video/mp4", buffer: Buffer.from("notes: top set felt heavy\n".repeat(40)) });
    await expect(page.getByRole("alert").filter({ hasText: "not a video" }).textContent()).resolves.toMatch(
      /This file is not a video we can read\..*checked by its content, not its name/,
    );
    await expect(page.getByTestId("clip-facts").count()).resolves.toBe(0);
  });

  it("refuses a broken video on upload with a clear message and keeps the set without a clip", { timeout: 120_000 }, async () => {
    await fillSet(3);
    // A right MP4 header, then garbage: the first bytes pass, the server's ffprobe cannot read it.
    const broken = Buffer.alloc(200_000, 7);
    Buffer.from([0, 0, 0, 24, ...Buffer.from("ftypisom"), 0, 0, 2, 0, ...Buffer.from("isomiso2")]).copy(broken);
    await page.getByLabel("Clip").setInputFiles({ name: "broken.mp4", mimeType: "video/mp4", buffer: broken });
    await page.getByTestId("clip-facts").waitFor();
    await page.getByRole("button", { name: "Save and upload" }).click();
    const message = page.getByRole("alert").filter({ hasText: "could not be read" });
    await message.waitFor({ timeout: 60_000 });
    await expect(message.textContent()).resolves.toMatch(/The video could not be read: the file may be damaged or cut short\./);
    await expect(page.getByRole("button", { name: "Retry the upload" }).isVisible()).resolves.toBe(true);
    const { rows } = await db.query(
      "select clip_status, clip_storage_key from sets where athlete_id = $1 order by created_at desc limit 1",
      [athlete.id],
    );
    expect(rows[0]).toEqual({ clip_status: "none", clip_storage_key: null });
  });
});
