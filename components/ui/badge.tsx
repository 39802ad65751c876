// Small status label (invitation pending, expired …): text first, colour only as a second cue.
import { clsx } from "clsx";
import type { ReactNode } from "react";

export type BadgeTone = "neutral" | "action" | "caution" | "fault";

const tones: Record<BadgeTone, string> = {
  neutral: "border-line-strong text-ink-muted",
  action: "border-action text-action",
  caution: "border-caution-line bg-caution-soft text-ink",
  fault: "border-fault-line bg-fault-soft text-fault",
};

export function Badge({ tone = "neutral", children }: { tone?: BadgeTone; children: ReactNode }) {
  return (
    <span className={clsx("inline-flex items-center rounded-sm border px-1.5 py-px text-xs font-medium", tones[tone])}>
      {children}
    </span>
  );
}
