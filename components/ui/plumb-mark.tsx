// The plumb-line mark: a hook, a thin vertical line and a bob. Line in the text colour, bob in teal.
import { clsx } from "clsx";

export function PlumbMark({ className, title }: { className?: string; title?: string }) {
  return (
    <svg
      viewBox="0 0 16 32"
      className={clsx("w-auto", className)}
      role={title ? "img" : undefined}
      aria-hidden={title ? undefined : true}
      aria-label={title}
      fill="none"
    >
      <circle cx="8" cy="2.5" r="1.75" stroke="currentColor" strokeWidth="1.25" />
      <line x1="8" y1="4.25" x2="8" y2="19" stroke="currentColor" strokeWidth="1.25" />
      <rect x="5.5" y="19" width="5" height="2.25" rx="0.5" className="fill-action" />
      <path d="M4 21.75h8L8 31z" className="fill-action" />
    </svg>
  );
}

/** The mark with the product name, for headers. */
export function Wordmark({ className }: { className?: string }) {
  return (
    <span className={clsx("inline-flex items-center gap-2 font-semibold tracking-tight text-ink", className)}>
      <PlumbMark className="h-6" />
      <span>Plumbline</span>
    </span>
  );
}
