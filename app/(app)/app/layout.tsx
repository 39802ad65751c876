// The signed-in shell: header with navigation and sign-out; on a phone, one column with tabs at the bottom.
import Link from "next/link";
import type { ReactNode } from "react";
import { requireServerViewer } from "@/lib/access";
import { listMemberships } from "@/db/queries/teams";
import { QueryProvider } from "@/components/providers/query-provider";
import { BottomNav, HeaderNav } from "@/components/shell/nav-links";
import { navItemsFor } from "@/components/shell/nav-items";
import { SignOutButton } from "@/components/shell/sign-out-button";
import { Banner } from "@/components/ui/banner";
import { Wordmark } from "@/components/ui/plumb-mark";

export default async function AppLayout({ children }: { children: ReactNode }) {
  const viewer = await requireServerViewer();
  const memberships = await listMemberships(viewer.userId);
  const items = navItemsFor(new Set(memberships.map((m) => m.role)));
  const teamNames = [...new Set(memberships.map((m) => m.teamName))];

  return (
    <QueryProvider>
      {/* The bottom tab bar's height, so sticky actions on a phone sit just above it. */}
      <div className="flex min-h-dvh flex-col pb-[calc(3rem+env(safe-area-inset-bottom))] [--app-bottom-nav:3rem] sm:pb-0 sm:[--app-bottom-nav:0px]">
        <header className="sticky top-0 z-20 border-b border-line bg-surface">
          <div className="mx-auto flex h-14 w-full max-w-page items-center gap-4 px-gutter sm:px-gutter-wide">
            <Link href="/app" aria-label="Plumbline, start page">
              <Wordmark />
            </Link>
            <HeaderNav items={items} />
            <div className="ml-auto flex min-w-0 items-center gap-3">
              <div className="hidden min-w-0 text-right text-xs leading-tight md:block">
                <div className="truncate font-medium text-ink">{viewer.name}</div>
                {teamNames.length > 0 ? <div className="truncate text-ink-muted">{teamNames.join(" · ")}</div> : null}
              </div>
              <SignOutButton />
            </div>
          </div>
        </header>
        {viewer.emailVerified ? null : (
          <div className="mx-auto w-full max-w-page px-gutter pt-4 sm:px-gutter-wide">
            <Banner tone="caution" title="Confirm your e-mail address">
              We sent a link to {viewer.email}.{" "}
              <Link href="/verify-email" className="font-medium text-ink underline underline-offset-2">
                Send it again
              </Link>
            </Banner>
          </div>
        )}
        <main className="mx-auto w-full max-w-page flex-1 px-gutter py-6 sm:px-gutter-wide sm:py-8">{children}</main>
        <BottomNav items={items} />
      </div>
    </QueryProvider>
  );
}
