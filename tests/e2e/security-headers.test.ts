// Security headers on the production build: a CSP that keeps the analysis worker, wasm and object storage
// working while refusing framing, and the other headers, on pages, API answers and the worker script. A
// team name full of markup is shown as text under that CSP, and signed-in pages raise no CSP violation.
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Browser } from "playwright-core";
import { launchBrowser } from "./browser";

const baseUrl = inject("baseUrl");
let browser: Browser;

beforeAll(async () => {
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
});

function directives(csp: string): Map<string, string[]> {
  return new Map(csp.split(";").map((part) => part.trim().split(/\s+/)).map(([name, ...values]) => [name, values]));
}

describe("security headers", () => {
  it.each(["/", "/sign-in", "/api/me", "/workers/analyse-worker.js"])("are on %s", async (pathname) => {
    const response = await fetch(`${baseUrl}${pathname}`, { redirect: "manual" });
    const csp = directives(response.headers.get("content-security-policy") ?? "");
    expect(csp.get("frame-ancestors")).toEqual(["'none'"]);
    expect(csp.get("script-src")).toContain("'wasm-unsafe-eval'");
    expect(csp.get("script-src")).not.toContain("'unsafe-eval'");
    expect(csp.get("worker-src")).toEqual(["'self'"]);
    expect(csp.get("object-src")).toEqual(["'none'"]);
    // The object-storage fake listens on loopback: any port there, nothing else.
    expect(csp.get("connect-src")).toEqual(["'self'", "http://127.0.0.1:*"]);
    expect(csp.get("media-src")).toContain("http://127.0.0.1:*");
    expect(response.headers.get("x-frame-options")).toBe("DENY");
    expect(response.headers.get("referrer-policy")).toBe("strict-origin-when-cross-origin");
    expect(response.headers.get("x-content-type-options")).toBe("nosniff");
    expect(response.headers.get("permissions-policy")).toMatch(/camera=\(self\)/);
    expect(response.headers.get("x-powered-by")).toBeNull();
  });

  it("let signed-in pages run without a CSP violation, and show markup in a team name as text", async () => {
    const context = await browser.newContext({ baseURL: baseUrl });
    const page = await context.newPage();
    const violations: string[] = [];
    page.on("console", (message) => {
      if (/Content Security Policy|Refused to/i.test(message.text())) violations.push(message.text());
    });
    try {
      const email = `csp-${randomUUID().slice(0, 8)}@test.example`;
      const signUp = await page.request.post("/api/auth/sign-up/email", {
        data: { name: "Header Tester", email, password: `pw-${randomUUID()}` },
        headers: { origin: baseUrl },
      });
      expect(signUp.status()).toBe(200);
      const name = `<img src=x onerror="window.__pwned=1"><script>window.__pwned=2</script> & co`;
      const team = await page.request.post("/api/teams", { data: { name }, headers: { origin: baseUrl } });
      expect(team.status()).toBe(201);
      for (const pathname of ["/app", "/app/roster", "/app/sets/new"]) {
        await page.goto(pathname);
        await page.waitForLoadState("networkidle");
        await expect(page.getByText(name, { exact: false }).first().isVisible()).resolves.toBe(true);
        expect(await page.evaluate(() => (window as { __pwned?: number }).__pwned)).toBeUndefined();
        expect(await page.locator('img[src="x"]').count()).toBe(0);
      }
      expect(violations).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
