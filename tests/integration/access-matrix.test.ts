// Who may call what: every exported handler of every app/**/route.ts (and every server action) against seven
// actors — signed out, athlete A, athlete B on the same team, athlete C on another team, the team's coach,
// another team's coach and an admin. Allowed calls answer with data; refused ones with 401/403/404 (or a row's
// declared other refusal, such as the unsigned webhook's 400) and an error only. A handler without a row fails
// the first test, so a new route cannot skip the matrix.
import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb } from "@/db";
import type { MailFake } from "@/dev/fakes/mail-fake";
import { call, startTestMail } from "./helpers";
import { startTestStorage, type TestStorage } from "./clip-helpers";
import { startTestPayments, type TestPayments } from "./payment-helpers";
import { ACTIONS, EXEMPT, HTTP_METHODS, ROUTES, type RouteRow } from "./access-matrix/routes";
import { ACTORS, buildMatrixWorld, type Actor, type MatrixWorld } from "./access-matrix/world";

const ROOT = path.resolve(import.meta.dirname, "../..");

function filesUnder(folder: string, keep: (file: string) => boolean): string[] {
  return readdirSync(path.join(ROOT, folder), { recursive: true, encoding: "utf8" })
    .map((file) => path.posix.join(folder, file.split(path.sep).join("/")))
    .filter(keep)
    .sort();
}

const routeFiles = filesUnder("app", (file) => /\/route\.(ts|tsx|js)$/.test(file));
/** Modules or functions marked "use server" anywhere in the app's own code. */
const serverActionFiles = ["app", "components", "lib"]
  .flatMap((folder) => filesUnder(folder, (file) => /\.(ts|tsx)$/.test(file)))
  .filter((file) => /^\s*["']use server["']/m.test(readFileSync(path.join(ROOT, file), "utf8")));

async function exportedMethods(file: string): Promise<string[]> {
  const module = (await import(/* @vite-ignore */ path.join(ROOT, file))) as Record<string, unknown>;
  return Object.keys(module).filter((name) => (HTTP_METHODS as readonly string[]).includes(name));
}

describe("discovery", () => {
  it("has a row for every exported handler, and no row for a handler that does not exist", async () => {
    expect(routeFiles.length).toBeGreaterThan(0);
    const exempt = new Set(EXEMPT.map((e) => e.file));
    const rows = new Set(ROUTES.map((r) => `${r.method} ${r.file}`));
    const found = new Set<string>();
    const missing: string[] = [];
    for (const file of routeFiles) {
      if (exempt.has(file)) continue;
      for (const method of await exportedMethods(file)) {
        found.add(`${method} ${file}`);
        if (!rows.has(`${method} ${file}`)) missing.push(`${method} ${file}`);
      }
    }
    expect(missing, "handlers without a row in tests/integration/access-matrix/routes.ts").toEqual([]);
    expect([...rows].filter((row) => !found.has(row)), "rows for handlers that do not exist").toEqual([]);
    expect(EXEMPT.filter((e) => !routeFiles.includes(e.file)), "exemptions for files that do not exist").toEqual([]);
  });

  it("has a row for every server action", async () => {
    const missing: string[] = [];
    for (const file of serverActionFiles) {
      const module = (await import(/* @vite-ignore */ path.join(ROOT, file))) as Record<string, unknown>;
      for (const name of Object.keys(module)) {
        if (!ACTIONS.some((a) => a.file === file && a.exportName === name)) missing.push(`${name} in ${file}`);
      }
    }
    expect(missing, "server actions without a row in ACTIONS").toEqual([]);
  });
});

let mail: MailFake;
let storage: TestStorage;
let pay: TestPayments;
let w: MatrixWorld;

beforeAll(async () => {
  mail = await startTestMail();
  storage = await startTestStorage();
  pay = await startTestPayments();
  w = await buildMatrixWorld();
}, 120_000);

afterAll(async () => {
  await pay?.stop();
  await storage?.stop();
  await mail?.stop();
  await closeDb();
});

/** Actors who may never see athlete A's team set, whatever route they call. */
const OUTSIDERS_OF_SET_A: Actor[] = ["anonymous", "athleteB", "athleteC", "otherCoach"];

async function callAs(row: RouteRow, actor: Actor): Promise<Response> {
  const module = (await import(/* @vite-ignore */ path.join(ROOT, row.file))) as Record<string, unknown>;
  const request = await row.request(w);
  const cookie = actor === "anonymous" ? undefined : w.people[actor].cookie;
  return call(module[row.method], request.path ?? "", { method: row.method, cookie, params: request.params, body: request.body });
}

describe.each(ROUTES.map((row) => [`${row.method} ${row.file}`, row] as const))("%s", (_name, row) => {
  it.each(ACTORS.map((actor) => [actor, row.expect[actor]] as const))("%s gets %i", async (actor, status) => {
    const response = await callAs(row, actor);
    const text = await response.text();
    await row.after?.(w, text);
    expect(response.status, text.slice(0, 300)).toBe(status);
    // Allowed answers may be other than JSON (the CSV export); refusals must be JSON with an error.
    const body = text && response.headers.get("content-type")?.includes("json") ? (JSON.parse(text) as Record<string, unknown>) : null;
    if (status >= 400) {
      expect(Object.keys(body ?? {}), "a refusal carries an error and nothing else").toEqual(["error"]);
      const error = (body as { error: Record<string, unknown> }).error;
      expect(Object.keys(error).filter((k) => !["code", "message", "fields"].includes(k))).toEqual([]);
      if (row.otherRefusal && status === row.otherRefusal.status) {
        expect(error.code).toBe(row.otherRefusal.code);
      } else {
        expect([401, 403, 404]).toContain(status);
        expect(String(error.code)).toMatch(/^(unauthorized|forbidden|not_found):/);
      }
    }
    if (OUTSIDERS_OF_SET_A.includes(actor)) {
      expect(text).not.toContain(w.setA);
      expect(text).not.toContain(w.secretNote);
    }
  });
});

// Server actions get their rows here once one exists (an empty describe would be an error).
if (ACTIONS.length > 0) {
  describe("server actions", () => {
    it.each(ACTIONS.flatMap((a) => ACTORS.map((actor) => [`${a.exportName} in ${a.file}`, actor, a] as const)))(
      "%s as %s",
      async (_name, actor, action) => {
        expect(await action.invoke(w, actor)).toBe(action.expect[actor]);
      },
    );
  });
}
