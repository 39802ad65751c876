// Empty state: what this place will hold, and the one action that fills it.
import type { ReactNode } from "react";
import { PlumbMark } from "./plumb-mark";

export function EmptyState({ title, children, action }: { title: ReactNode; children?: ReactNode; action?: ReactNode }) {
  return (
    <div className="flex flex-col items-center gap-3 rounded-lg border border-dashed border-line-strong px-6 py-10 text-center">
      <PlumbMark className="h-10 text-ink-faint" />
      <h2 className="text-base font-semibold text-ink">{title}</h2>
      {children ? <div className="max-w-prose text-sm text-ink-muted">{children}</div> : null}
      {action ? <div className="mt-2">{action}</div> : null}
    </div>
  );
}
