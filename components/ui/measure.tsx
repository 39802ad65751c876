// Measure: a number in tabular figures with its unit beside it in a lighter weight.
import { clsx } from "clsx";

export type MeasureSize = "sm" | "md" | "lg" | "xl";

const sizes: Record<MeasureSize, string> = {
  sm: "text-sm",
  md: "text-base",
  lg: "text-xl",
  xl: "text-3xl tracking-tight",
};

// A fixed locale keeps the server and the browser rendering the same digits.
const formatters = new Map<number, Intl.NumberFormat>();
function formatter(digits: number): Intl.NumberFormat {
  let found = formatters.get(digits);
  if (!found) {
    found = new Intl.NumberFormat("en-GB", { minimumFractionDigits: digits, maximumFractionDigits: digits });
    formatters.set(digits, found);
  }
  return found;
}

export function formatNumber(value: number, digits = 0): string {
  return formatter(digits).format(value);
}

export function Measure({
  value,
  unit,
  digits = 0,
  size = "md",
  className,
}: {
  value: number | null | undefined;
  unit?: string;
  digits?: number;
  size?: MeasureSize;
  className?: string;
}) {
  const missing = value === null || value === undefined || !Number.isFinite(value);
  return (
    <span className={clsx("nums inline-flex items-baseline gap-[0.2em] whitespace-nowrap", sizes[size], className)}>
      {missing ? (
        <span className="text-ink-faint" aria-label="no value">
          –
        </span>
      ) : (
        <span className="font-medium text-ink">{formatNumber(value, digits)}</span>
      )}
      {unit && !missing ? <span className="font-light text-ink-muted">{unit}</span> : null}
    </span>
  );
}
