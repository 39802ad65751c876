// Banners for messages that concern a whole page or section, and the standing cautions line.
import { clsx } from "clsx";
import type { ReactNode } from "react";

export type BannerTone = "info" | "caution" | "fault";

const tones: Record<BannerTone, string> = {
  info: "border-line border-l-action bg-surface",
  caution: "border-caution-line border-l-caution bg-caution-soft",
  fault: "border-fault-line border-l-fault bg-fault-soft",
};

export function Banner({
  tone = "info",
  title,
  children,
  className,
  live = false,
}: {
  tone?: BannerTone;
  title?: ReactNode;
  children?: ReactNode;
  className?: string;
  /** Announce the banner to screen readers when it appears after an action. */
  live?: boolean;
}) {
  return (
    <div
      role={live ? (tone === "fault" ? "alert" : "status") : undefined}
      className={clsx("rounded border border-l-4 px-4 py-3 text-sm text-ink", tones[tone], className)}
    >
      {title ? <p className="font-semibold">{title}</p> : null}
      {children ? <div className={clsx(title && "mt-1", "text-ink-muted")}>{children}</div> : null}
    </div>
  );
}

export const CAUTIONS_TEXT =
  "Measures are estimates from video, not medical advice. If a lift causes pain, stop and see a licensed health professional.";

/** The cautions line shown wherever technique measures or feedback appear. */
export function Caution({ className }: { className?: string }) {
  return (
    <p className={clsx("flex gap-2 text-xs text-ink-muted", className)}>
      <span aria-hidden="true" className="mt-1 inline-block size-2 shrink-0 rounded-full bg-caution" />
      <span>{CAUTIONS_TEXT}</span>
    </p>
  );
}
