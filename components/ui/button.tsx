// Buttons and button-styled links: one action colour, quiet secondary styles, large size for phones.
import Link from "next/link";
import { clsx } from "clsx";
import type { ComponentProps } from "react";

export type ButtonVariant = "primary" | "secondary" | "quiet" | "danger";
export type ButtonSize = "sm" | "md" | "lg";

const base =
  "inline-flex items-center justify-center gap-2 rounded font-medium whitespace-nowrap transition-colors " +
  "disabled:cursor-not-allowed disabled:opacity-50 aria-disabled:pointer-events-none aria-disabled:opacity-50";

const variants: Record<ButtonVariant, string> = {
  primary: "bg-action text-on-action hover:bg-action-hover",
  secondary: "border border-line-strong bg-surface text-ink hover:bg-sunken",
  quiet: "text-action hover:bg-action-soft",
  danger: "border border-fault-line bg-surface text-fault hover:bg-fault-soft",
};

const sizes: Record<ButtonSize, string> = {
  sm: "h-8 px-3 text-sm",
  md: "h-10 px-4 text-sm",
  // Touch target for athletes on a phone.
  lg: "min-h-touch px-5 text-base",
};

export function buttonClasses({
  variant = "primary",
  size = "md",
  block = false,
}: { variant?: ButtonVariant; size?: ButtonSize; block?: boolean } = {}): string {
  return clsx(base, variants[variant], sizes[size], block && "w-full");
}

type StyleProps = { variant?: ButtonVariant; size?: ButtonSize; block?: boolean };

export function Button({
  variant,
  size,
  block,
  className,
  type = "button",
  pending = false,
  disabled,
  children,
  ...props
}: ComponentProps<"button"> & StyleProps & { pending?: boolean }) {
  return (
    <button
      type={type}
      className={clsx(buttonClasses({ variant, size, block }), className)}
      disabled={disabled || pending}
      aria-busy={pending || undefined}
      {...props}
    >
      {pending ? <Spinner /> : null}
      {children}
    </button>
  );
}

export function ButtonLink({ variant, size, block, className, ...props }: ComponentProps<typeof Link> & StyleProps) {
  return <Link className={clsx(buttonClasses({ variant, size, block }), className)} {...props} />;
}

function Spinner() {
  return (
    <span
      aria-hidden="true"
      className="size-3.5 animate-spin rounded-full border-2 border-current border-r-transparent"
    />
  );
}
