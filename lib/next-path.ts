// Where to send someone after signing in: only paths inside this site, never another origin.
export function safeNextPath(value: unknown, fallback = "/app"): string {
  if (typeof value !== "string") return fallback;
  // "//host" and "/\host" are read by browsers as another origin.
  if (!value.startsWith("/") || value.startsWith("//") || value.startsWith("/\\")) return fallback;
  return value;
}

/** Appends `?next=` so the sign-in and sign-up pages can send the person back where they came from. */
export function withNext(path: string, next: string | undefined): string {
  return next ? `${path}?next=${encodeURIComponent(next)}` : path;
}
