// Rep compare in a real Chromium against the production build: the demo coach opens an analysed set of a
// demo athlete (saved fast through saveAnalysis from a synthetic analysis), follows "Compare rep 1 with last
// rep", and sees both reps' curves and the difference table; trends for the athlete open from the set.
import { spawnSync } from "node:child_process";
import path from "node:path";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { DEMO_COACH, DEMO_PASSWORD, seedDemoData } from "@/dev/demo/seed";
import { launchBrowser } from "./browser";

const baseUrl = inject("baseUrl");
const databaseUrl = inject("databaseUrl");
const repoRoot = path.resolve(import.meta.dirname, "../..");
const SOFT = { waitUntil: "commit" } as const;

let browser: Browser;
let page: Page;
let made: { setId: string; repIds: string[] };

beforeAll(async () => {
  await seedDemoData(databaseUrl);
  const child = spawnSync(process.execPath, ["--conditions=react-server", "--import", "tsx", "tests/e2e/support/analysed-demo-set.ts"], {
    cwd: repoRoot,
    env: { ...process.env, DATABASE_URL: databaseUrl },
    encoding: "utf8",
  });
  if (child.status !== 0) throw new Error(`could not file the analysed set: ${child.stderr}`);
  made = JSON.parse(child.stdout) as typeof made;
  browser = await launchBrowser();
  const context = await browser.newContext({ baseURL: baseUrl, viewport: { width: 1200, height: 900 } });
  page = await context.newPage();
  await page.goto("/sign-in");
  await page.getByLabel("E-mail").fill(DEMO_COACH.email);
  await page.getByLabel("Password").fill(DEMO_PASSWORD);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL("**/app/**", SOFT);
});

afterAll(async () => {
  await browser?.close();
});

describe("rep compare", () => {
  it("opens rep 1 against the last rep from the set page and shows both curves and the difference table", async () => {
    await page.goto(`/app/sets/${made.setId}`);
    await page.getByRole("link", { name: "Compare rep 1 with last rep" }).click();
    await page.waitForURL(`**/app/compare?reps=${made.repIds[0]},${made.repIds[made.repIds.length - 1]}`, SOFT);

    for (const series of ["barVelocityMps", "kneeAngleDeg", "hipAngleDeg", "torsoAngleDeg", "barYM"]) {
      const curves = page.getByTestId(`curve-${series}`).locator("path.recharts-line-curve");
      await curves.first().waitFor();
      await expect(curves.count(), series).resolves.toBe(2);
    }
    await expect(page.getByTestId("bar-paths").locator(".recharts-scatter-line").count()).resolves.toBe(2);

    const table = page.getByTestId("difference-table");
    await expect(table.locator("thead th").allTextContents()).resolves.toEqual(
      expect.arrayContaining(["Rep 1", expect.stringContaining(`Rep ${made.repIds.length}`)]),
    );
    await expect(table.getByRole("rowheader", { name: "Mean concentric velocity" }).count()).resolves.toBe(1);
    // The highlight follows the threshold typed in.
    const speedRow = table.locator("tr", { has: page.getByRole("rowheader", { name: "Mean concentric velocity" }) });
    const threshold = table.getByLabel("Threshold for Mean concentric velocity");
    await threshold.fill("5");
    await expect.poll(() => speedRow.locator("td[data-past-threshold]").count()).toBe(0);
    await threshold.fill("0");
    await expect.poll(() => speedRow.locator("td[data-past-threshold]").count()).toBe(1);
    await expect(page.getByText("not medical advice", { exact: false }).count()).resolves.toBeGreaterThan(0);
  });

  it("reaches trends for the athlete and lift from the set", async () => {
    await page.goto(`/app/sets/${made.setId}`);
    await page.locator('a[href^="/app/trends?athlete="]').click();
    await page.waitForURL("**/app/trends?**", SOFT);
    await page.getByTestId("trend-load-velocity").waitFor();
    await expect(page.getByRole("heading", { level: 1 }).textContent()).resolves.toBe("Trends · Squat");
  });
});
