// Forgot-password page: asks for the address and mails a reset link.
import type { Metadata } from "next";
import Link from "next/link";
import { AuthPanel } from "@/components/auth/auth-panel";
import { ForgotPasswordForm } from "@/components/auth/forgot-password-form";

export const metadata: Metadata = { title: "Forgot password" };

export default function ForgotPasswordPage() {
  return (
    <AuthPanel
      title="Forgot your password?"
      intro="Enter the address you signed up with and we will mail you a link to choose a new one."
      footer={
        <p>
          <Link className="font-medium text-action underline-offset-2 hover:underline" href="/sign-in">
            Back to sign in
          </Link>
        </p>
      }
    >
      <ForgotPasswordForm />
    </AuthPanel>
  );
}
