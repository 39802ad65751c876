// The frame of every auth page: a heading, a line of explanation, the form, and links underneath.
import type { ReactNode } from "react";

export function AuthPanel({
  title,
  intro,
  children,
  footer,
}: {
  title: string;
  intro?: ReactNode;
  children: ReactNode;
  footer?: ReactNode;
}) {
  return (
    <div className="grid gap-6">
      <div>
        <h1 className="text-2xl font-semibold tracking-tight">{title}</h1>
        {intro ? <div className="mt-2 text-sm text-ink-muted">{intro}</div> : null}
      </div>
      <div className="rounded-lg border border-line bg-surface p-5 sm:p-6">{children}</div>
      {footer ? <div className="grid gap-2 text-sm text-ink-muted">{footer}</div> : null}
    </div>
  );
}
