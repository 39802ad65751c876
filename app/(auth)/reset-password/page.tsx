// Reset-password page: the mailed link lands here with `?token=` (or `?error=` when it is no longer valid).
import type { Metadata } from "next";
import { AuthPanel } from "@/components/auth/auth-panel";
import { ResetPasswordForm } from "@/components/auth/reset-password-form";
import { Banner } from "@/components/ui/banner";
import { ButtonLink } from "@/components/ui/button";

export const metadata: Metadata = { title: "Choose a new password" };

export default async function ResetPasswordPage({
  searchParams,
}: {
  searchParams: Promise<{ token?: string | string[]; error?: string | string[] }>;
}) {
  const { token, error } = await searchParams;
  if (error || typeof token !== "string" || token.length === 0) {
    return (
      <AuthPanel title="This link does not work any more">
        <div className="grid gap-4">
          <Banner tone="caution">
            Reset links work once and expire after an hour. Ask for a new one and use the latest mail.
          </Banner>
          <ButtonLink href="/forgot-password" size="lg" block>
            Send a new link
          </ButtonLink>
        </div>
      </AuthPanel>
    );
  }
  return (
    <AuthPanel title="Choose a new password">
      <ResetPasswordForm token={token} />
    </AuthPanel>
  );
}
