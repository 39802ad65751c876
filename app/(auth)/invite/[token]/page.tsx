// Invitation page: shows the team and an accept button, or the way to sign in or up and come back here.
// Expired, withdrawn, used or unknown links get a plain explanation instead of an error.
import type { Metadata } from "next";
import Link from "next/link";
import { getServerViewer } from "@/lib/access";
import { describeInvitation } from "@/db/queries/invitations";
import { getProfile } from "@/db/queries/profiles";
import { pathAfterJoining } from "@/db/queries/billing";
import { invitationTokenSchema } from "@/lib/validation/invitation";
import { withNext } from "@/lib/next-path";
import { AcceptInvitation } from "@/components/auth/accept-invitation";
import { AuthPanel } from "@/components/auth/auth-panel";
import { SignOutButton } from "@/components/shell/sign-out-button";
import { ButtonLink } from "@/components/ui/button";

export const metadata: Metadata = { title: "Invitation" };

const ENDED = {
  expired: {
    title: "This invitation has expired",
    body: "Invitations are valid for a week. Ask your coach to send it again; the new mail has a fresh link.",
  },
  revoked: {
    title: "This invitation was withdrawn",
    body: "The coach withdrew it. If that was a mistake, ask them to invite you again.",
  },
  used: {
    title: "This invitation has been used",
    body: "Someone already joined the team with this link. If that was you, sign in to carry on.",
  },
  unknown: {
    title: "This invitation link does not work",
    body: "It may be incomplete: some mail programs cut long links. Open it again from the mail, or ask your coach to resend it.",
  },
} as const;

export default async function InvitationPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const valid = invitationTokenSchema.safeParse(token).success;
  const [invitation, viewer] = await Promise.all([valid ? describeInvitation(token) : null, getServerViewer()]);

  if (!invitation || invitation.status !== "valid") {
    const ended = ENDED[invitation && invitation.status !== "valid" ? invitation.status : "unknown"];
    return (
      <AuthPanel title={ended.title}>
        <div className="grid gap-4">
          <p className="text-sm text-ink-muted">{ended.body}</p>
          <ButtonLink href={viewer ? "/app" : "/sign-in"} size="lg" variant="secondary" block>
            {viewer ? "Go to Plumbline" : "Sign in"}
          </ButtonLink>
        </div>
      </AuthPanel>
    );
  }

  const here = `/invite/${token}`;
  const intro = (
    <>
      You are invited to lift for <strong className="font-semibold text-ink">{invitation.teamName}</strong>. Your coach will
      see the sets you film and answer them; your data stays yours.
    </>
  );

  if (!viewer) {
    return (
      <AuthPanel title={`Join ${invitation.teamName}`} intro={intro}>
        <div className="grid gap-3">
          <p className="text-sm text-ink-muted">
            Invitation for <span className="font-medium text-ink">{invitation.email}</span>
          </p>
          <ButtonLink href={`${withNext("/sign-up", here)}&email=${encodeURIComponent(invitation.email)}`} size="lg" block>
            Create an account
          </ButtonLink>
          <ButtonLink href={withNext("/sign-in", here)} size="lg" variant="secondary" block>
            I already have an account
          </ButtonLink>
        </div>
      </AuthPanel>
    );
  }

  const [hasProfile, after] = await Promise.all([getProfile(viewer.userId).then((p) => p !== null), pathAfterJoining(token)]);
  const otherAddress = viewer.email.toLowerCase() !== invitation.email.toLowerCase();
  return (
    <AuthPanel
      title={`Join ${invitation.teamName}`}
      intro={intro}
      footer={
        otherAddress ? (
          <div className="flex flex-wrap items-center gap-x-2">
            <span>Not you?</span>
            <SignOutButton />
          </div>
        ) : null
      }
    >
      <div className="grid gap-3">
        <p className="text-sm text-ink-muted">
          {otherAddress ? (
            <>
              The invitation went to <span className="font-medium text-ink">{invitation.email}</span>; you are signed in as{" "}
              <span className="font-medium text-ink">{viewer.email}</span>. You can accept it with this account.
            </>
          ) : (
            <>
              Signed in as <span className="font-medium text-ink">{viewer.email}</span>
            </>
          )}
        </p>
        <AcceptInvitation
          token={token}
          teamName={invitation.teamName}
          next={hasProfile ? after : `/app/settings/profile?next=${encodeURIComponent(after)}`}
        />
        <p className="text-xs text-ink-muted">
          <Link href="/app" className="underline underline-offset-2">
            Not now
          </Link>
        </p>
      </div>
    </AuthPanel>
  );
}
