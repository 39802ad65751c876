// Paying the coach in a real Chromium against the production build: the demo coach (whose team charges a
// monthly price, dev/demo/seed-billing.ts) invites a new address; the athlete signs up from the e-mailed link,
// joins, is sent to pay, pays on the payment fake's hosted checkout page, comes back to an active membership
// and uploads a clip. People and gym are invented.
import type { Browser, Page } from "playwright-core";
import pg from "pg";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { z } from "zod";
import { DEMO_COACH, DEMO_PASSWORD, DEMO_TEAM_ID, seedDemoData } from "@/dev/demo/seed";
import { ensureClip, type GeneratedClip } from "@/tests/fixtures/clips/generate-clip";
import { launchBrowser } from "./browser";

const baseUrl = inject("baseUrl");
const mailUrl = inject("mailUrl");
const paymentsUrl = inject("paymentsUrl");
const databaseUrl = inject("databaseUrl");

const run = Date.now().toString(36);
const athlete = { name: "Ilse Brandvold", email: `ilse.${run}@lifter.example`, password: "chalk-dust-and-plates-9" };
const SOFT = { waitUntil: "commit" } as const;

const messagesSchema = z.object({ messages: z.array(z.object({ subject: z.string(), text: z.string() })) });

async function mailsTo(address: string): Promise<{ subject: string; text: string }[]> {
  const { messages } = messagesSchema.parse(await (await fetch(new URL(`api/messages?to=${encodeURIComponent(address)}`, mailUrl))).json());
  return messages;
}

async function waitForMail(address: string, match: RegExp): Promise<string> {
  for (let attempt = 0; attempt < 50; attempt += 1) {
    const found = (await mailsTo(address)).find((m) => match.test(m.subject) || match.test(m.text));
    if (found) return found.text;
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
  throw new Error(`no mail matching ${match} reached ${address}`);
}

let browser: Browser;
let page: Page;
let db: pg.Client;
let clip: GeneratedClip;

beforeAll(async () => {
  await seedDemoData(databaseUrl);
  db = new pg.Client({ connectionString: databaseUrl });
  await db.connect();
  clip = await ensureClip({ width: 640, height: 360, durationS: 12 });
  browser = await launchBrowser();
  const coach = await browser.newContext({ baseURL: baseUrl });
  const headers = { origin: baseUrl };
  expect((await coach.request.post("/api/auth/sign-in/email", { data: { email: DEMO_COACH.email, password: DEMO_PASSWORD }, headers })).status()).toBe(200);
  expect((await coach.request.post(`/api/teams/${DEMO_TEAM_ID}/invitations`, { data: { emails: [athlete.email] }, headers })).status()).toBeLessThan(300);
  await coach.close();
  const context = await browser.newContext({ baseURL: baseUrl, viewport: { width: 390, height: 844 }, isMobile: true });
  page = await context.newPage();
});

afterAll(async () => {
  await browser?.close();
  await db?.end();
});

describe("paying the coach", () => {
  it("sends an invited athlete to pay after joining a team that charges", async () => {
    const link = /https?:\/\/\S+\/invite\/[A-Za-z0-9_-]{43}/.exec(await waitForMail(athlete.email, /\/invite\//))![0];
    await page.goto(link);
    await page.getByRole("link", { name: "Create an account" }).click();
    await page.waitForURL((url) => url.pathname === "/sign-up", SOFT);
    await page.getByLabel("Name").fill(athlete.name);
    await page.getByLabel("Password").fill(athlete.password);
    await page.getByRole("button", { name: "Create account" }).click();
    await page.waitForURL((url) => url.pathname.startsWith("/invite/"), SOFT);
    await page.getByRole("button", { name: "Join Ironbark Barbell Club" }).click();
    await page.waitForURL((url) => url.pathname === "/app/settings/profile", SOFT);
    await page.getByLabel("Body mass").fill("74");
    await page.getByLabel("Height").fill("172");
    await page.getByRole("button", { name: "Save profile" }).click();
    await page.waitForURL((url) => url.pathname === "/app/billing" && url.searchParams.get("team") === DEMO_TEAM_ID, SOFT);
    await page.getByText("Pay your coach to start uploading sets for review.").waitFor();
    // Not paid yet: filing a set under the team is refused with the payment code.
    const refused = await page.request.post("/api/sets", {
      data: { teamId: DEMO_TEAM_ID, sessionDate: "2026-03-02", lift: "squat", loadKg: 100, reps: 3, cameraView: "side" },
      headers: { origin: baseUrl },
    });
    expect(refused.status()).toBe(402);
  });

  it("pays on the hosted checkout page and comes back to an active membership with its renewal date", async () => {
    await page.getByRole("button", { name: /^Pay your coach €49\.00 a month$/ }).click();
    await page.waitForURL((url) => url.toString().startsWith(`${paymentsUrl}/checkout/`));
    await page.getByRole("button", { name: "Pay €49.00" }).click();
    await page.waitForURL((url) => url.pathname === "/app/billing" && url.searchParams.get("checkout") === "done");
    await page.getByText("Thank you: your payment went through").waitFor();
    await expect(page.getByTestId("membership-state").textContent()).resolves.toMatch(/^Renews on \d{1,2} \w{3} \d{4}$/);
    await page.getByTestId("invoice-table").getByText("€49.00").waitFor();
    await waitForMail(athlete.email, /^Receipt: €49\.00/);
  });

  it("uploads a clip once paid", { timeout: 120_000 }, async () => {
    await page.goto("/app/sets/new");
    await page.getByLabel("Load").fill("100");
    await page.getByLabel("Reps").fill(String(clip.truth.reps.length));
    await page.getByLabel("Clip").setInputFiles(clip.videoPath);
    await page.getByTestId("clip-facts").waitFor();
    await page.getByRole("button", { name: "Save and upload" }).click();
    await page.waitForURL(/\/app\/sets\/[0-9a-f-]{36}$/, { ...SOFT, timeout: 60_000 });
    const setId = page.url().split("/").pop();
    const { rows } = await db.query("select clip_status, team_id from sets where id = $1", [setId]);
    expect(rows[0]).toEqual({ clip_status: "uploaded", team_id: DEMO_TEAM_ID });
  });
});
