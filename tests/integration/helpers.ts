// Shared helpers for the integration tests: the in-process mail fake, people signed up through the real
// better-auth route, and calls into route handlers with constructed Requests (no HTTP server, no mocks).
import { randomUUID } from "node:crypto";
import { eq } from "drizzle-orm";
import { startMailFake, type CaughtMessage, type MailFake } from "@/dev/fakes/mail-fake";
import { db } from "@/db";
import { memberships, user } from "@/db/schema";
import { createTeam } from "@/db/queries/teams";
import * as authRoute from "@/app/api/auth/[...all]/route";

export const BASE_URL = "http://127.0.0.1:3000";

export async function startTestMail(): Promise<MailFake> {
  const mail = await startMailFake({ smtpPort: 0, httpPort: 0 });
  process.env.SMTP_URL = mail.smtpUrl;
  return mail;
}

/** A unique address per call, so test files sharing one database never collide. */
export function uniqueEmail(label: string): string {
  return `${label}-${randomUUID().slice(0, 8)}@test.example`.toLowerCase();
}

/** `name=value; name2=value2` from a response's Set-Cookie headers (expired cookies dropped). */
export function cookiesFrom(response: Response): string {
  return response.headers
    .getSetCookie()
    .filter((c) => !/max-age=0/i.test(c))
    .map((c) => c.split(";")[0])
    .join("; ");
}

interface CallOptions {
  method?: string;
  body?: unknown;
  rawBody?: string;
  cookie?: string;
  params?: Record<string, string>;
}

type Handler = (request: Request, context: { params: Promise<Record<string, string>> }) => Promise<Response>;

/** Calls a route handler the way Next does: a Request plus `{ params: Promise<…> }`. */
export async function call(handler: unknown, path: string, options: CallOptions = {}): Promise<Response> {
  const headers = new Headers({ origin: BASE_URL });
  if (options.cookie) headers.set("cookie", options.cookie);
  let body: string | undefined = options.rawBody;
  if (options.body !== undefined) {
    headers.set("content-type", "application/json");
    body = JSON.stringify(options.body);
  }
  const request = new Request(new URL(path, BASE_URL), { method: options.method ?? "GET", headers, body });
  return (handler as Handler)(request, { params: Promise.resolve(options.params ?? {}) });
}

/** POSTs to better-auth through the mounted /api/auth route. */
export function authPost(path: string, body: unknown, cookie?: string): Promise<Response> {
  return call(authRoute.POST, `/api/auth${path}`, { method: "POST", body, cookie });
}

export function authGet(pathAndQuery: string, cookie?: string): Promise<Response> {
  return call(authRoute.GET, pathAndQuery.startsWith("http") ? pathAndQuery : `/api/auth${pathAndQuery}`, { cookie });
}

export interface TestPerson {
  id: string;
  name: string;
  email: string;
  password: string;
  cookie: string;
}

export async function signUp(label: string, name = `Tester ${label}`): Promise<TestPerson> {
  const email = uniqueEmail(label);
  const password = `pw-${randomUUID()}`;
  const response = await authPost("/sign-up/email", { name, email, password });
  if (response.status !== 200) throw new Error(`sign-up failed: ${response.status} ${await response.text()}`);
  const { user: created } = (await response.json()) as { user: { id: string } };
  return { id: created.id, name, email, password, cookie: cookiesFrom(response) };
}

export async function signIn(email: string, password: string): Promise<Response> {
  return authPost("/sign-in/email", { email, password });
}

/** The operator role is granted by another admin in the product; tests set it directly. */
export async function makeAdmin(person: TestPerson): Promise<void> {
  await db.update(user).set({ role: "admin" }).where(eq(user.id, person.id));
}

export function mailTo(mail: MailFake, email: string): CaughtMessage[] {
  return mail.messages().filter((m) => m.to.includes(email.toLowerCase()));
}

/** The first link in the plain-text part that starts with the app's base URL. */
export function linkIn(message: CaughtMessage): string {
  const found = message.text.match(/https?:\/\/\S+/);
  if (!found) throw new Error(`no link in mail "${message.subject}"`);
  return found[0];
}

export async function json<T = Record<string, unknown>>(response: Response): Promise<T> {
  return (await response.json()) as T;
}

export interface World {
  coachA: TestPerson;
  athleteA1: TestPerson;
  athleteA2: TestPerson;
  coachB: TestPerson;
  athleteB1: TestPerson;
  outsider: TestPerson;
  admin: TestPerson;
  teamA: { id: string; name: string };
  teamB: { id: string; name: string };
}

/** Two teams, each with a coach and athletes, one person on no team and one admin. */
export async function buildWorld(label: string): Promise<World> {
  const people = await Promise.all(
    ["coachA", "athleteA1", "athleteA2", "coachB", "athleteB1", "outsider", "admin"].map((role) => signUp(`${label}-${role}`)),
  );
  const [coachA, athleteA1, athleteA2, coachB, athleteB1, outsider, admin] = people;
  await makeAdmin(admin);
  const teamA = await createTeam(coachA.id, `Team A ${label}`);
  const teamB = await createTeam(coachB.id, `Team B ${label}`);
  await db.insert(memberships).values([
    { teamId: teamA.id, userId: athleteA1.id, role: "athlete" },
    { teamId: teamA.id, userId: athleteA2.id, role: "athlete" },
    { teamId: teamB.id, userId: athleteB1.id, role: "athlete" },
  ]);
  return {
    coachA, athleteA1, athleteA2, coachB, athleteB1, outsider, admin,
    teamA: { id: teamA.id, name: teamA.name },
    teamB: { id: teamB.id, name: teamB.name },
  };
}
