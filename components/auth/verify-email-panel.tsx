"use client";
// The state of the person's e-mail confirmation, and a button to send the link again.
import { useState } from "react";
import { sendVerificationEmail } from "@/lib/auth-client";
import { Banner } from "@/components/ui/banner";
import { Button, ButtonLink } from "@/components/ui/button";
import { authErrorMessage } from "./auth-messages";

export interface VerifyEmailAccount {
  email: string;
  emailVerified: boolean;
}

export function VerifyEmailPanel({ account, linkFailed }: { account: VerifyEmailAccount | null; linkFailed: boolean }) {
  const [sent, setSent] = useState(false);
  const [sending, setSending] = useState(false);
  const [error, setError] = useState<string>();

  if (!account) {
    return (
      <div className="grid gap-4">
        {linkFailed ? <LinkFailed /> : null}
        <p className="text-sm text-ink-muted">Open the link in the mail we sent you, or sign in to have it sent again.</p>
        <ButtonLink href="/sign-in?next=/verify-email" size="lg" block>
          Sign in
        </ButtonLink>
      </div>
    );
  }
  if (account.emailVerified) {
    return (
      <div className="grid gap-4">
        <Banner title="Address confirmed">{account.email} is confirmed.</Banner>
        <ButtonLink href="/app" size="lg" block>
          Continue
        </ButtonLink>
      </div>
    );
  }

  async function resend(email: string) {
    setSending(true);
    setError(undefined);
    const { error: failure } = await sendVerificationEmail({ email, callbackURL: "/app" });
    setSending(false);
    if (failure) setError(authErrorMessage(failure));
    else setSent(true);
  }

  return (
    <div className="grid gap-4">
      {linkFailed ? <LinkFailed /> : null}
      <p className="text-sm">
        We sent a link to <strong className="font-semibold">{account.email}</strong>. Open it to confirm the address.
      </p>
      {sent ? (
        <Banner live title="Sent again">
          Use the newest mail; older links stop working.
        </Banner>
      ) : null}
      {error ? (
        <Banner live tone="fault">
          {error}
        </Banner>
      ) : null}
      <Button size="lg" variant="secondary" block pending={sending} onClick={() => resend(account.email)}>
        Send the link again
      </Button>
    </div>
  );
}

function LinkFailed() {
  return (
    <Banner tone="caution" title="That link did not work">
      It may have expired or been used already.
    </Banner>
  );
}
