// Sign-in page; `?next=` brings the person back to where they were going (an invitation, a set).
import type { Metadata } from "next";
import Link from "next/link";
import { AuthPanel } from "@/components/auth/auth-panel";
import { SignInForm } from "@/components/auth/sign-in-form";
import { safeNextPath, withNext } from "@/lib/next-path";

export const metadata: Metadata = { title: "Sign in" };

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ next?: string | string[] }> }) {
  const { next: rawNext } = await searchParams;
  const next = safeNextPath(rawNext);
  const nextParam = next === "/app" ? undefined : next;
  return (
    <AuthPanel
      title="Sign in"
      footer={
        <>
          <p>
            New here?{" "}
            <Link className="font-medium text-action underline-offset-2 hover:underline" href={withNext("/sign-up", nextParam)}>
              Create an account
            </Link>
          </p>
          <p>
            <Link className="font-medium text-action underline-offset-2 hover:underline" href="/forgot-password">
              Forgot your password?
            </Link>
          </p>
        </>
      }
    >
      <SignInForm next={next} />
    </AuthPanel>
  );
}
