// A labelled progress bar (upload, conversion, analysis): the share done as a bar and as a number.
import { clsx } from "clsx";

export function ProgressBar({ label, fraction, detail, className }: { label: string; fraction: number | null; detail?: string; className?: string }) {
  const pct = fraction === null ? null : Math.round(Math.min(1, Math.max(0, fraction)) * 100);
  return (
    <div className={clsx("grid gap-1.5", className)}>
      <div className="flex items-baseline justify-between gap-3 text-sm">
        <span className="font-medium text-ink">{label}</span>
        <span className="nums text-ink-muted">{pct === null ? (detail ?? "") : `${pct} %`}</span>
      </div>
      <div
        role="progressbar"
        aria-label={label}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={pct ?? undefined}
        className="h-2 overflow-hidden rounded-full bg-sunken"
      >
        <div
          className={clsx("h-full rounded-full bg-action transition-[width] duration-200", pct === null && "w-1/3 animate-pulse")}
          style={pct === null ? undefined : { width: `${pct}%` }}
        />
      </div>
      {pct !== null && detail ? <p className="text-xs text-ink-muted">{detail}</p> : null}
    </div>
  );
}
