// The foundation flow in a real Chromium against the production build: a coach signs up, names the team and
// invites an address; the athlete follows the e-mailed link, signs up, accepts, fills the profile in pounds and
// lands on home; the coach's roster then lists them. People and gym are invented.
import type { Browser, BrowserContext, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { z } from "zod";
import { launchBrowser } from "./browser";

const baseUrl = inject("baseUrl");
const mailUrl = inject("mailUrl");

const run = Date.now().toString(36);
const TEAM_NAME = "Northbank Barbell Club";
const coach = { name: "Wren Calloway", email: `wren.${run}@coach.example`, password: "chalk-and-iron-42" };
const athlete = { name: "Juno Marsh", email: `juno.${run}@lifter.example`, password: "plates-on-the-bar-7" };

// Exact by definition (International Yard and Pound Agreement, 1959): 1 lb = 0.45359237 kg, 1 in = 0.0254 m.
const KG_PER_LB = 0.45359237;
const M_PER_IN = 0.0254;

// Client-side navigations never fire a load event; the URL changing is what to wait for.
const SOFT = { waitUntil: "commit" } as const;

const messagesSchema = z.object({
  messages: z.array(z.object({ to: z.array(z.string()), subject: z.string(), text: z.string() })),
});

/** Polls the mail fake until a mail to `address` carries an invitation link. */
async function invitationLink(address: string): Promise<string> {
  const url = new URL(`api/messages?to=${encodeURIComponent(address)}`, mailUrl);
  for (let attempt = 0; attempt < 50; attempt += 1) {
    const { messages } = messagesSchema.parse(await (await fetch(url)).json());
    const link = messages.map((m) => /https?:\/\/\S+\/invite\/[A-Za-z0-9_-]{43}/.exec(m.text)?.[0]).find(Boolean);
    if (link) return link;
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
  throw new Error(`no invitation mail reached ${address}`);
}

async function signUp(page: Page, person: { name: string; email?: string; password: string }): Promise<void> {
  await page.getByLabel("Name").fill(person.name);
  if (person.email) await page.getByLabel("E-mail").fill(person.email);
  await page.getByLabel("Password").fill(person.password);
  await page.getByRole("button", { name: "Create account" }).click();
}

describe("foundation: team set-up in the browser", () => {
  let browser: Browser;
  let coachContext: BrowserContext;
  let athleteContext: BrowserContext;
  let coachPage: Page;
  let athletePage: Page;
  let link: string;

  beforeAll(async () => {
    browser = await launchBrowser();
    // Two contexts: two people with separate cookies in the same browser.
    coachContext = await browser.newContext({ baseURL: baseUrl, viewport: { width: 1280, height: 900 } });
    athleteContext = await browser.newContext({ baseURL: baseUrl, viewport: { width: 360, height: 780 }, isMobile: true });
    coachPage = await coachContext.newPage();
    athletePage = await athleteContext.newPage();
  });

  afterAll(async () => {
    await browser?.close();
  });

  it("lets a coach sign up and name the team", async () => {
    await coachPage.goto("/sign-up");
    await signUp(coachPage, coach);
    await coachPage.waitForURL((url) => url.pathname === "/app/team/new", SOFT);
    await coachPage.getByLabel("Team name").fill(TEAM_NAME);
    await coachPage.getByRole("button", { name: "Create the team" }).click();
    await coachPage.waitForURL((url) => url.pathname === "/app/roster", SOFT);
    await expect(coachPage.getByRole("heading", { level: 1 }).textContent()).resolves.toBe(TEAM_NAME);
  });

  it("shows a too-short team name beside the field without calling the server", async () => {
    await coachPage.goto("/app/team/new");
    const teamPosts: string[] = [];
    const onRequest = (request: { method(): string; url(): string }) => {
      if (request.method() === "POST" && request.url().endsWith("/api/teams")) teamPosts.push(request.url());
    };
    coachPage.on("request", onRequest);
    await coachPage.getByLabel("Team name").fill("N");
    await coachPage.getByRole("button", { name: "Create the team" }).click();
    await coachPage.getByText("Use at least 2 characters.").waitFor();
    coachPage.off("request", onRequest);
    expect(await coachPage.getByLabel("Team name").getAttribute("aria-invalid")).toBe("true");
    expect(teamPosts).toEqual([]);
    await coachPage.goto("/app/roster");
  });

  it("sends an invitation and lists it without a page reload", async () => {
    await coachPage.getByLabel("E-mail addresses").fill(`${athlete.email}, not-an-address`);
    await coachPage.getByRole("button", { name: "Send invitations" }).click();
    await coachPage.getByText("Not a valid address: not-an-address.").waitFor();

    const navigations: string[] = [];
    coachPage.on("framenavigated", (frame) => navigations.push(frame.url()));
    await coachPage.getByLabel("E-mail addresses").fill(athlete.email);
    await coachPage.getByRole("button", { name: "Send invitations" }).click();
    await coachPage.getByText(`Invitation sent to ${athlete.email}`).waitFor();
    const row = coachPage.getByRole("row").filter({ hasText: athlete.email });
    await row.getByText("Pending").waitFor();
    expect(navigations).toEqual([]);

    link = await invitationLink(athlete.email);
    expect(link.startsWith(`${baseUrl}/invite/`)).toBe(true);
  });

  it("lets the invited athlete sign up from the link and accept", async () => {
    await athletePage.goto(link);
    await athletePage.getByRole("heading", { name: `Join ${TEAM_NAME}` }).waitFor();
    await athletePage.getByRole("link", { name: "Create an account" }).click();
    await athletePage.waitForURL((url) => url.pathname === "/sign-up", SOFT);
    expect(await athletePage.getByLabel("E-mail").inputValue()).toBe(athlete.email);
    await signUp(athletePage, { name: athlete.name, password: athlete.password });
    await athletePage.waitForURL((url) => url.pathname.startsWith("/invite/"), SOFT);
    await athletePage.getByRole("button", { name: `Join ${TEAM_NAME}` }).click();
    await athletePage.waitForURL(
      (url) => url.pathname === "/app/settings/profile" && url.searchParams.get("next") === "/app/home",
      SOFT,
    );
  });

  it("saves a profile typed in pounds and inches as kilograms and metres, then lands on home", async () => {
    await athletePage.locator("label", { hasText: /^lb$/ }).click();
    await athletePage.getByLabel("Body mass").fill("180");
    await athletePage.getByLabel("Height").fill("70");
    await athletePage.getByLabel("Squat").fill("315");
    await athletePage.getByRole("button", { name: "Save profile" }).click();
    await athletePage.waitForURL((url) => url.pathname === "/app/home", SOFT);
    await athletePage.getByRole("heading", { name: "Film your first set" }).waitFor();

    const response = await athletePage.request.get("/api/profile");
    const { profile } = z
      .object({
        profile: z.object({
          bodyMassKg: z.number(),
          heightM: z.number(),
          unitPreference: z.string(),
          oneRepMaxes: z.record(z.string(), z.number()),
        }),
      })
      .parse(await response.json());
    expect(profile.unitPreference).toBe("lb");
    expect(profile.bodyMassKg).toBeCloseTo(180 * KG_PER_LB, 9);
    expect(profile.heightM).toBeCloseTo(70 * M_PER_IN, 9);
    expect(profile.oneRepMaxes.squat).toBeCloseTo(315 * KG_PER_LB, 9);
    expect(profile.oneRepMaxes.bench).toBeUndefined();
  });

  it("shows the profile again in pounds, as the athlete left it", async () => {
    await athletePage.goto("/app/settings/profile");
    expect(await athletePage.getByLabel("Body mass").inputValue()).toBe("180");
    expect(await athletePage.getByLabel("Squat").inputValue()).toBe("315");
    expect(await athletePage.getByRole("radio", { name: "lb" }).isChecked()).toBe(true);
  });

  it("tells the athlete plainly that a used link is used", async () => {
    await athletePage.goto(link);
    await athletePage.getByRole("heading", { name: "This invitation has been used" }).waitFor();
  });

  it("lists the athlete on the coach's roster and closes the invitation", async () => {
    await coachPage.reload();
    const row = coachPage.getByRole("row").filter({ hasText: athlete.name });
    await row.getByText("No sets yet").waitFor();
    await coachPage.getByText("No open invitations.").waitFor();
  });
});
