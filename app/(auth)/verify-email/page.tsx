// Verify-email page: where to confirm the address, and where a failed confirmation link lands (`?error=`).
import type { Metadata } from "next";
import { getServerViewer } from "@/lib/access";
import { AuthPanel } from "@/components/auth/auth-panel";
import { VerifyEmailPanel } from "@/components/auth/verify-email-panel";

export const metadata: Metadata = { title: "Confirm your e-mail" };

export default async function VerifyEmailPage({ searchParams }: { searchParams: Promise<{ error?: string | string[] }> }) {
  const [{ error }, viewer] = await Promise.all([searchParams, getServerViewer()]);
  return (
    <AuthPanel title="Confirm your e-mail address" intro="Confirming the address lets us send you reviews and invitations.">
      <VerifyEmailPanel
        account={viewer ? { email: viewer.email, emailVerified: viewer.emailVerified } : null}
        linkFailed={Boolean(error)}
      />
    </AuthPanel>
  );
}
