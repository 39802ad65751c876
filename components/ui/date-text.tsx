// Dates in one fixed format ("14 Mar 2026", UTC), so the server and the browser render the same text.
const dayFormat = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", year: "numeric", timeZone: "UTC" });

export function formatDay(iso: string | Date): string {
  return dayFormat.format(typeof iso === "string" ? new Date(iso) : iso);
}

export function DateText({ value, className }: { value: string | Date; className?: string }) {
  const date = typeof value === "string" ? new Date(value) : value;
  return (
    <time dateTime={date.toISOString()} className={className ? `nums ${className}` : "nums"}>
      {formatDay(date)}
    </time>
  );
}
