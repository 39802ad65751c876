// Sign-up page: coaches start here; athletes arrive from an invitation with `?next=/invite/<token>`.
import type { Metadata } from "next";
import Link from "next/link";
import { AuthPanel } from "@/components/auth/auth-panel";
import { SignUpForm } from "@/components/auth/sign-up-form";
import { safeNextPath, withNext } from "@/lib/next-path";

export const metadata: Metadata = { title: "Create an account" };

export default async function SignUpPage({
  searchParams,
}: {
  searchParams: Promise<{ next?: string | string[]; email?: string | string[] }>;
}) {
  const { next: rawNext, email } = await searchParams;
  const next = safeNextPath(rawNext);
  const nextParam = next === "/app" ? undefined : next;
  const fromInvitation = next.startsWith("/invite/");
  return (
    <AuthPanel
      title="Create an account"
      intro={
        fromInvitation
          ? "Create your account, then accept the invitation to join your coach's team."
          : "Coaches: create your account, then name your team and invite your athletes."
      }
      footer={
        <p>
          Already have an account?{" "}
          <Link className="font-medium text-action underline-offset-2 hover:underline" href={withNext("/sign-in", nextParam)}>
            Sign in
          </Link>
        </p>
      }
    >
      <SignUpForm next={next} email={typeof email === "string" ? email : undefined} />
    </AuthPanel>
  );
}
