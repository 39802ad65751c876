// Authentication: better-auth over the Drizzle schema with e-mail + password, e-mail verification,
// password reset and the admin plugin (role "admin" is the operator). Mails go out through lib/mail.ts.
//
// Decision: people may sign in before confirming their address (the app shows a banner until they do).
// It keeps sign-up -> invitation acceptance a single flow; an invitation link already proves the mailbox.
import { betterAuth } from "better-auth";
import { drizzleAdapter } from "better-auth/adapters/drizzle";
import { nextCookies } from "better-auth/next-js";
import { admin } from "better-auth/plugins";
import { db } from "@/db";
import { account, session, user, verification } from "@/db/schema";
import { resetPasswordMail, sendMail, verifyEmailMail, type MailContent } from "@/lib/mail";
import { PASSWORD_MAX_LENGTH, PASSWORD_MIN_LENGTH } from "@/lib/validation/auth";
import { rateRule, type RateName } from "@/lib/limits";

// Development-only secret, so a fresh checkout runs without configuration. Never valid in production.
const DEV_SECRET = "plumbline-dev-only-zC8adtz2M6BYKd6K5huVUwjY2FZl/XvftD5ipAWqOmO5";

function authSecret(): string {
  const secret = process.env.BETTER_AUTH_SECRET;
  if (secret) return secret;
  if (process.env.NODE_ENV === "production") {
    console.warn("[plumbline] BETTER_AUTH_SECRET is not set: using the development secret. Set it before going live.");
  }
  return DEV_SECRET;
}

export const AUTH_BASE_URL = process.env.BETTER_AUTH_URL ?? "http://127.0.0.1:3000";

// A mail that fails to send must not turn sign-up or a reset request into a 500; the person can ask again.
async function deliver(to: string, content: MailContent): Promise<void> {
  try {
    await sendMail(to, content);
  } catch (error) {
    console.error(`[plumbline] could not send "${content.subject}" to ${to}:`, error);
  }
}

/** better-auth's rule for a path from ours, read per request so a changed environment applies at once. */
const ruleOf = (name: RateName) => () => {
  const rule = rateRule(name);
  return { window: rule.durationS, max: rule.points };
};

export const auth = betterAuth({
  appName: "Plumbline",
  baseURL: AUTH_BASE_URL,
  secret: authSecret(),
  trustedOrigins: [AUTH_BASE_URL, "http://127.0.0.1:3000", "http://localhost:3000"],
  database: drizzleAdapter(db, { provider: "pg", schema: { user, session, account, verification } }),
  emailAndPassword: {
    enabled: true,
    requireEmailVerification: false,
    minPasswordLength: PASSWORD_MIN_LENGTH,
    maxPasswordLength: PASSWORD_MAX_LENGTH,
    revokeSessionsOnPasswordReset: true,
    sendResetPassword: ({ user: person, url }) => deliver(person.email, resetPasswordMail(person.name, url)),
  },
  emailVerification: {
    sendOnSignUp: true,
    autoSignInAfterVerification: true,
    sendVerificationEmail: ({ user: person, url }) => deliver(person.email, verifyEmailMail(person.name, url)),
  },
  // better-auth's own limiter, on in every environment (its default is production only), keyed by client
  // address; the in-memory store suits this single-process app (see lib/rate-limit.ts).
  rateLimit: {
    enabled: true,
    storage: "memory",
    customRules: { "/sign-in/*": ruleOf("signIn"), "/sign-up/*": ruleOf("signUp") },
  },
  plugins: [admin({ defaultRole: "user", adminRoles: ["admin"] }), nextCookies()],
});

export type AuthSession = NonNullable<Awaited<ReturnType<typeof auth.api.getSession>>>;
