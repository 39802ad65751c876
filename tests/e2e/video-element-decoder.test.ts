// The <video>-element decoder in a real Chromium: with VideoDecoder removed from the page before any
// script runs (as in a browser without WebCodecs), the analysis step decodes the demo clip with a hidden
// <video> element and the worker analyses the frames it is sent. Its reps match those of the WebCodecs
// path on the same clip, and the saved analysis names the decoder. Demo data from dev/demo/seed.ts.
import type { Browser, Page } from "playwright-core";
import pg from "pg";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { DEMO_ATHLETES, DEMO_PASSWORD, seedDemoData } from "@/dev/demo/seed";
import { ensureClip, type GeneratedClip } from "@/tests/fixtures/clips/generate-clip";
import { launchBrowser } from "./browser";

const baseUrl = inject("baseUrl");
const databaseUrl = inject("databaseUrl");
const athlete = DEMO_ATHLETES[1];
const SOFT = { waitUntil: "commit" } as const;
const SET_URL = /\/app\/sets\/[0-9a-f-]{36}$/;

/**
 * Both decoders give the same frames at the same times, but pose is scheduled on each run's own clock:
 * mean concentric velocities agree within the brief's accuracy target for velocity, 0.03 m/s.
 */
const VELOCITY_TOLERANCE_MPS = 0.03;

let browser: Browser;
let db: pg.Client;
let clip: GeneratedClip;

beforeAll(async () => {
  await seedDemoData(databaseUrl);
  db = new pg.Client({ connectionString: databaseUrl });
  await db.connect();
  clip = await ensureClip({ width: 640, height: 360, durationS: 12 });
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await db?.end();
});

async function signedInPage(withoutWebCodecs: boolean): Promise<Page> {
  const context = await browser.newContext({ baseURL: baseUrl, viewport: { width: 1100, height: 900 } });
  if (withoutWebCodecs) await context.addInitScript("delete globalThis.VideoDecoder;");
  const page = await context.newPage();
  await page.goto("/sign-in");
  await page.getByLabel("E-mail").fill(athlete.email);
  await page.getByLabel("Password").fill(DEMO_PASSWORD);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL("**/app/**", SOFT);
  return page;
}

/** Uploads the clip through the form, taps the plate, analyses; returns the set's id. */
async function submitAndAnalyse(page: Page): Promise<string> {
  await page.goto("/app/sets/new");
  await page.getByLabel("Load").fill("170");
  await page.getByLabel("Reps").fill(String(clip.truth.reps.length));
  await page.getByLabel("RPE").fill("8");
  await page.getByLabel("Clip").setInputFiles(clip.videoPath);
  await page.getByTestId("clip-facts").waitFor();
  await page.getByRole("button", { name: "Save and upload" }).click();
  await page.waitForURL(SET_URL, { ...SOFT, timeout: 60_000 });
  const setId = page.url().split("/").pop() as string;
  const marker = page.getByTestId("plate-marker").locator("canvas").first();
  await marker.waitFor({ timeout: 120_000 });
  const box = await marker.boundingBox();
  if (!box) throw new Error("the first frame is not on screen");
  const scale = box.width / clip.truth.options.width;
  await page.mouse.click(box.x + clip.truth.frames[0].cx * scale, box.y + clip.truth.frames[0].cy * scale);
  await page.getByRole("button", { name: "Analyse the set" }).click();
  const failure = page.getByRole("alert").filter({ hasText: "could not finish" });
  await page.getByTestId("reps-table").or(failure).waitFor({ timeout: 240_000 });
  expect(await failure.count(), (await failure.allTextContents()).join(" ")).toBe(0);
  return setId;
}

async function savedRun(setId: string) {
  const analysis = await db.query(
    "select id, settings -> 'pipeline' ->> 'decoder' as decoder, settings -> 'pipeline' -> 'stats' as stats from analyses where set_id = $1 and is_current",
    [setId],
  );
  expect(analysis.rows).toHaveLength(1);
  const reps = await db.query("select rep_index, mean_concentric_velocity_mps from reps where analysis_id = $1 order by rep_index", [analysis.rows[0].id]);
  return {
    decoder: analysis.rows[0].decoder as string,
    stats: analysis.rows[0].stats as { frameCount: number; decoder: string },
    velocities: reps.rows.map((r) => r.mean_concentric_velocity_mps as number),
  };
}

describe("analysis without WebCodecs", () => {
  it("decodes with the <video> element and finds the same reps as WebCodecs", { timeout: 600_000 }, async () => {
    const fallbackPage = await signedInPage(true);
    await expect(fallbackPage.evaluate("typeof VideoDecoder")).resolves.toBe("undefined");
    const fallback = await savedRun(await submitAndAnalyse(fallbackPage));
    await fallbackPage.context().close();

    const webCodecsPage = await signedInPage(false);
    const webCodecs = await savedRun(await submitAndAnalyse(webCodecsPage));
    await webCodecsPage.context().close();

    expect(fallback.decoder).toBe("video-element");
    expect(fallback.stats.decoder).toBe("video-element");
    expect(webCodecs.decoder).toBe("webcodecs");
    // Every frame of the clip reached the worker, exactly once.
    expect(fallback.stats.frameCount).toBe(clip.truth.frameCount);
    expect(webCodecs.stats.frameCount).toBe(clip.truth.frameCount);
    expect(fallback.velocities).toHaveLength(clip.truth.reps.length);
    expect(webCodecs.velocities).toHaveLength(clip.truth.reps.length);
    for (const [i, velocityMps] of fallback.velocities.entries()) {
      expect(Math.abs(velocityMps - webCodecs.velocities[i])).toBeLessThan(VELOCITY_TOLERANCE_MPS);
    }
  });
});
