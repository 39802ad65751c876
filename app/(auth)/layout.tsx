// Layout of the sign-in, sign-up, password and invitation pages: one narrow column under the mark.
import Link from "next/link";
import type { ReactNode } from "react";
import { Caution } from "@/components/ui/banner";
import { Wordmark } from "@/components/ui/plumb-mark";

export default function AuthLayout({ children }: { children: ReactNode }) {
  return (
    <div className="flex min-h-dvh flex-col px-gutter py-6 sm:py-12">
      <header className="mx-auto w-full max-w-form">
        <Link href="/" aria-label="Plumbline home">
          <Wordmark />
        </Link>
      </header>
      <main className="mx-auto mt-8 w-full max-w-form flex-1">{children}</main>
      <footer className="mx-auto mt-10 w-full max-w-form">
        <Caution />
      </footer>
    </div>
  );
}
