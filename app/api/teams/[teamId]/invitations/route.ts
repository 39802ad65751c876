// POST /api/teams/[teamId]/invitations: invite 1..50 addresses; one e-mail each.
import { requireCoachOf, requireSession } from "@/lib/access";
import { parseOrThrow, readJson, withErrors } from "@/lib/errors";
import { sendInvitationMails } from "@/lib/mail";
import { inviteSchema } from "@/lib/validation/invitation";
import { createInvitations, SKIP_MESSAGES } from "@/db/queries/invitations";
import { consumeRate } from "@/lib/rate-limit";

export const POST = withErrors(async (request: Request, { params }: { params: Promise<{ teamId: string }> }) => {
  const viewer = await requireSession(request);
  const team = await requireCoachOf(viewer, (await params).teamId);
  const { emails } = parseOrThrow(inviteSchema, await readJson(request, "invitation"), "invitation");
  await consumeRate("invitation", viewer.userId, "rate_limited:invitation", "invitations", emails.length);
  const { issued, skipped } = await createInvitations(team.id, viewer.userId, emails);
  const failed = await sendInvitationMails(
    issued.map(({ invitation, token }) => ({
      to: invitation.email,
      token,
      teamName: team.name,
      inviterName: viewer.name,
      expiresAt: invitation.expiresAt,
    })),
  );
  const sent = issued.filter(({ invitation }) => !failed.has(invitation.email));
  return Response.json(
    {
      invited: sent.map(({ invitation: { id, email, expiresAt } }) => ({ id, email, expiresAt })),
      skipped: [...skipped, ...[...failed].map((email) => ({ email, reason: "mail_failed", message: SKIP_MESSAGES.mail_failed }))],
    },
    { status: 201 },
  );
});
