// Outgoing e-mail through SMTP (SMTP_URL; the local mail fake on 127.0.0.1:2525 by default), each mail with a plain-text and an HTML part.
import nodemailer, { type Transporter } from "nodemailer";

export const DEFAULT_SMTP_URL = "smtp://127.0.0.1:2525";
const DEFAULT_FROM = "Plumbline <no-reply@plumbline.localhost>";

export interface MailContent {
  subject: string;
  text: string;
  html: string;
}

const transports = new Map<string, Transporter>();

// Read at send time so tests can start their own SMTP fake and point SMTP_URL at it.
function transport(): Transporter {
  const url = process.env.SMTP_URL ?? DEFAULT_SMTP_URL;
  let found = transports.get(url);
  if (!found) {
    found = nodemailer.createTransport(url);
    transports.set(url, found);
  }
  return found;
}

/** Absolute link into the app (BETTER_AUTH_URL, default http://127.0.0.1:3000). */
export function appUrl(pathname: string): string {
  return new URL(pathname, process.env.BETTER_AUTH_URL ?? "http://127.0.0.1:3000").toString();
}

export async function sendMail(to: string, content: MailContent): Promise<void> {
  await transport().sendMail({ from: process.env.MAIL_FROM ?? DEFAULT_FROM, to, ...content });
}

function escapeHtml(value: string): string {
  return value.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
}

/** One short layout for every mail: greeting, paragraphs, one button, the link spelled out, a footer. */
export function compose(subject: string, lines: string[], action: { label: string; url: string }, footer: string): MailContent {
  const text = [...lines, "", `${action.label}: ${action.url}`, "", footer].join("\n");
  const paragraphs = lines.map((line) => `<p style="margin:0 0 12px">${escapeHtml(line)}</p>`).join("");
  const href = escapeHtml(action.url);
  const html = `<!doctype html><html><body style="font-family:system-ui,sans-serif;color:#1f2937;line-height:1.5">
<div style="max-width:520px;margin:0 auto;padding:24px">${paragraphs}
<p style="margin:20px 0"><a href="${href}" style="background:#1f2937;color:#fff;padding:10px 16px;border-radius:6px;text-decoration:none">${escapeHtml(action.label)}</a></p>
<p style="margin:0 0 12px;font-size:13px;color:#6b7280">Or open this link: <a href="${href}">${href}</a></p>
<p style="margin:24px 0 0;font-size:13px;color:#6b7280">${escapeHtml(footer)}</p></div></body></html>`;
  return { subject, text, html };
}

export function verifyEmailMail(name: string, url: string): MailContent {
  return compose(
    "Confirm your e-mail address for Plumbline",
    [`Hello ${name},`, "Please confirm that this address is yours. The link works for one hour."],
    { label: "Confirm my address", url },
    "If you did not create a Plumbline account, you can ignore this mail.",
  );
}

export function resetPasswordMail(name: string, url: string): MailContent {
  return compose(
    "Reset your Plumbline password",
    [`Hello ${name},`, "Someone asked to reset the password of your Plumbline account. The link works for one hour."],
    { label: "Choose a new password", url },
    "If it was not you, ignore this mail: your password stays as it is.",
  );
}

export function invitationMail(input: { teamName: string; inviterName: string; url: string; expiresAt: Date }): MailContent {
  const expires = input.expiresAt.toUTCString();
  return compose(
    `${input.inviterName} invited you to ${input.teamName} on Plumbline`,
    [
      "Hello,",
      `${input.inviterName} invited you to join ${input.teamName} as an athlete on Plumbline, where your coach reviews the videos of your sets.`,
      `Sign in or create an account to accept. The invitation expires on ${expires}.`,
    ],
    { label: "Accept the invitation", url: input.url },
    "If you were not expecting this invitation, you can ignore this mail.",
  );
}

export interface InvitationMailInput {
  to: string;
  token: string;
  teamName: string;
  inviterName: string;
  expiresAt: Date;
}

/** Mails the invitation link `/invite/<token>` to the invited address. */
export async function sendInvitationMail(input: InvitationMailInput): Promise<void> {
  const url = appUrl(`/invite/${input.token}`);
  await sendMail(input.to, invitationMail({ teamName: input.teamName, inviterName: input.inviterName, url, expiresAt: input.expiresAt }));
}

// Each SMTP delivery is its own connection; a few at a time keep 50 invitations to about a second.
const PARALLEL_SENDS = 5;

/** Sends every invitation mail; returns the addresses whose mail failed (logged, not thrown). */
export async function sendInvitationMails(inputs: InvitationMailInput[]): Promise<Set<string>> {
  const failed = new Set<string>();
  for (let start = 0; start < inputs.length; start += PARALLEL_SENDS) {
    const batch = inputs.slice(start, start + PARALLEL_SENDS);
    const results = await Promise.allSettled(batch.map((input) => sendInvitationMail(input)));
    results.forEach((result, i) => {
      if (result.status === "fulfilled") return;
      console.error(`[plumbline] invitation mail to ${batch[i].to} failed:`, result.reason);
      failed.add(batch[i].to);
    });
  }
  return failed;
}

export function reviewAnsweredMail(input: { athleteName: string; coachName: string; setTitle: string; url: string }): MailContent {
  return compose(
    `${input.coachName} answered your ${input.setTitle}`,
    [
      `Hello ${input.athleteName},`,
      `${input.coachName} reviewed your ${input.setTitle} on Plumbline: open the review for the summary, the cues and the comments pinned to the clip. You can reply there.`,
      "The measures are estimates from video, not medical advice. If a lift causes pain, stop and see a licensed health professional.",
    ],
    { label: "Open the review", url: input.url },
    "You get this mail because your coach answered a set you recorded.",
  );
}
