// Sign-up, e-mail verification, sign-in and password reset through the mounted better-auth route,
// with mails read from the in-process mail fake; plus the /app guard in proxy.ts.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { NextRequest } from "next/server";
import type { MailFake } from "@/dev/fakes/mail-fake";
import { closeDb } from "@/db";
import * as me from "@/app/api/me/route";
import { proxy } from "@/proxy";
import { authGet, authPost, call, cookiesFrom, json, linkIn, mailTo, makeAdmin, signIn, signUp, startTestMail, uniqueEmail } from "./helpers";

let mail: MailFake;

beforeAll(async () => {
  mail = await startTestMail();
});

afterAll(async () => {
  await mail.stop();
  await closeDb();
});

describe("sign-up and e-mail verification", () => {
  it("signs the person in at once, mails a verification link, and verifies the address through it", async () => {
    const person = await signUp("verify", "Vera Quill");
    const before = await json<{ user: { emailVerified: boolean; role: string; name: string } }>(
      await call(me.GET, "/api/me", { cookie: person.cookie }),
    );
    expect(before.user).toMatchObject({ name: "Vera Quill", emailVerified: false, role: "user" });

    const [message] = mailTo(mail, person.email);
    expect(message.subject).toBe("Confirm your e-mail address for Plumbline");
    expect(message.html).toContain("<a href=");
    const link = linkIn(message);
    expect(message.html).toContain(link.replaceAll("&", "&#38;"));
    expect(link).toContain("/api/auth/verify-email?token=");

    const verified = await authGet(link);
    expect(verified.status).toBe(302);
    expect(verified.headers.get("location")).toBe("/");
    const after = await json<{ user: { emailVerified: boolean } }>(await call(me.GET, "/api/me", { cookie: person.cookie }));
    expect(after.user.emailVerified).toBe(true);
  });

  it("sends the person on to the page the sign-up form asked for (an invitation, say) after verifying", async () => {
    const email = uniqueEmail("verify-next");
    const response = await authPost("/sign-up/email", { name: "Nell Crane", email, password: "long-enough-pw", callbackURL: "/invite/abc" });
    expect(response.status).toBe(200);
    const verified = await authGet(linkIn(mailTo(mail, email)[0]));
    expect(verified.status).toBe(302);
    expect(verified.headers.get("location")).toBe("/invite/abc");
  });

  it("refuses a second account with the same address", async () => {
    const person = await signUp("twice");
    const again = await authPost("/sign-up/email", { name: "Someone", email: person.email, password: "another-password" });
    expect(again.status).toBe(422);
  });

  it("rejects a password shorter than 8 characters", async () => {
    const response = await authPost("/sign-up/email", { name: "Short", email: "short-pw@test.example", password: "1234567" });
    expect(response.status).toBe(400);
  });
});

describe("sign-in", () => {
  it("accepts the right password and refuses a wrong one", async () => {
    const person = await signUp("signin");
    const wrong = await signIn(person.email, "not-the-password");
    expect(wrong.status).toBe(401);
    expect(cookiesFrom(wrong)).toBe("");

    const right = await signIn(person.email, person.password);
    expect(right.status).toBe(200);
    const cookie = cookiesFrom(right);
    expect(cookie).toMatch(/session_token=/);
    const body = await json<{ user: { email: string } }>(await call(me.GET, "/api/me", { cookie }));
    expect(body.user.email).toBe(person.email);
  });

  it("signing out ends the session", async () => {
    const person = await signUp("signout");
    const out = await authPost("/sign-out", {}, person.cookie);
    expect(out.status).toBe(200);
    const after = await call(me.GET, "/api/me", { cookie: person.cookie });
    expect(after.status).toBe(401);
  });
});

describe("password reset", () => {
  it("mails a reset link whose token sets a new password and ends the old sessions", async () => {
    const person = await signUp("reset");
    const requested = await authPost("/request-password-reset", { email: person.email, redirectTo: "/reset-password" });
    expect(requested.status).toBe(200);

    const message = mailTo(mail, person.email).find((m) => m.subject === "Reset your Plumbline password");
    expect(message).toBeDefined();
    const followed = await authGet(linkIn(message!));
    expect(followed.status).toBe(302);
    const location = new URL(followed.headers.get("location")!, "http://127.0.0.1:3000");
    expect(location.pathname).toBe("/reset-password");
    const token = location.searchParams.get("token");
    expect(token).toBeTruthy();

    const reset = await authPost("/reset-password", { newPassword: "a-brand-new-password", token });
    expect(reset.status).toBe(200);
    expect((await signIn(person.email, person.password)).status).toBe(401);
    expect((await signIn(person.email, "a-brand-new-password")).status).toBe(200);
    expect((await call(me.GET, "/api/me", { cookie: person.cookie })).status).toBe(401);

    const reused = await authPost("/reset-password", { newPassword: "yet-another-password", token });
    expect(reused.status).toBe(400);
  });

  it("answers the same for an unknown address and sends nothing", async () => {
    const before = mail.messages().length;
    const response = await authPost("/request-password-reset", { email: "nobody-here@test.example", redirectTo: "/reset-password" });
    expect(response.status).toBe(200);
    expect(mail.messages().length).toBe(before);
  });
});

describe("admin plugin (operator role)", () => {
  it("lets an admin list users and refuses everyone else", async () => {
    const operator = await signUp("operator");
    const plain = await signUp("plain");
    await makeAdmin(operator);
    const allowed = await authGet("/admin/list-users?searchValue=operator&searchField=email", operator.cookie);
    expect(allowed.status).toBe(200);
    const body = await json<{ users: { email: string }[] }>(allowed);
    expect(body.users.map((u) => u.email)).toContain(operator.email);
    expect((await authGet("/admin/list-users", plain.cookie)).status).toBe(403);
    expect((await authGet("/admin/list-users")).status).toBe(401);
  });
});

describe("the mail fake's web page", () => {
  it("lists caught mail as JSON and shows each mail with both parts", async () => {
    const person = await signUp("mailpage");
    const listed = await json<{ messages: { id: number; subject: string }[] }>(
      await fetch(`${mail.httpUrl}api/messages?to=${encodeURIComponent(person.email)}`),
    );
    expect(listed.messages).toHaveLength(1);
    const page = await (await fetch(`${mail.httpUrl}messages/${listed.messages[0].id}`)).text();
    expect(page).toContain("Plain-text part");
    expect(page).toContain("HTML part");
    expect((await fetch(`${mail.httpUrl}messages/999999`)).status).toBe(404);
  });
});

describe("proxy.ts", () => {
  it("sends signed-out visitors of /app to the sign-in page with the way back", () => {
    const response = proxy(new NextRequest("http://127.0.0.1:3000/app/roster?tab=invites"));
    expect(response.status).toBe(307);
    const location = new URL(response.headers.get("location")!);
    expect(location.pathname).toBe("/sign-in");
    expect(location.searchParams.get("next")).toBe("/app/roster?tab=invites");
  });

  it("lets requests with a session cookie through", async () => {
    const person = await signUp("proxy");
    const response = proxy(new NextRequest("http://127.0.0.1:3000/app", { headers: { cookie: person.cookie } }));
    expect(response.headers.get("location")).toBeNull();
    expect(response.headers.get("x-middleware-next")).toBe("1");
  });
});
