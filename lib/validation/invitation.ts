// Request schemas for invitations: a coach invites 1..50 addresses at once.
import { z } from "zod";
import { emailSchema } from "./common";

export const MAX_INVITATIONS_PER_REQUEST = 50;
export const INVITATION_TTL_DAYS = 7;

export const inviteSchema = z.object({
  emails: z
    .array(emailSchema, { error: "A list of e-mail addresses is required." })
    .min(1, { error: "Enter at least one e-mail address." })
    .max(MAX_INVITATIONS_PER_REQUEST, { error: `Invite at most ${MAX_INVITATIONS_PER_REQUEST} addresses at once.` }),
});
export type InviteInput = z.infer<typeof inviteSchema>;

/** Splits what a coach pastes (commas, semicolons, spaces or new lines) into addresses, for the invite form. */
export function splitEmailList(text: string): string[] {
  return text
    .split(/[\s,;]+/)
    .map((part) => part.trim())
    .filter((part) => part.length > 0);
}

/** Invitation tokens are 32 random bytes in base64url (43 characters). */
export const invitationTokenSchema = z
  .string()
  .regex(/^[A-Za-z0-9_-]{43}$/, { error: "This invitation link is malformed." });
