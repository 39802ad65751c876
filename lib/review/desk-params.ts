// The desk's URL and keyboard logic apart from React: filters and sort live in the search params (so a view can be
// bookmarked and shared), and j/k or the arrow keys move through the rows.
import type { DeskQuery } from "@/lib/validation/review";

export const DESK_PATH = "/app/desk";

/** The desk URL for the current query with some fields changed; empty and default values stay out of the URL. */
export function deskHref(query: DeskQuery, change: Partial<DeskQuery> = {}): string {
  const next = { ...query, ...change };
  const params = new URLSearchParams();
  if (next.athlete) params.set("athlete", next.athlete);
  if (next.lift) params.set("lift", next.lift);
  if (next.status && next.status !== "open") params.set("status", next.status);
  if (next.sort && next.sort !== "oldest") params.set("sort", next.sort);
  const search = params.toString();
  return search ? `${DESK_PATH}?${search}` : DESK_PATH;
}

/** The row to move to after a key press, or null when the key is not a move; -1 means no row is active yet. */
export function moveRow(current: number, key: string, rowCount: number): number | null {
  if (rowCount === 0) return null;
  if (key === "j" || key === "ArrowDown") return current < 0 ? 0 : Math.min(current + 1, rowCount - 1);
  if (key === "k" || key === "ArrowUp") return current < 0 ? 0 : Math.max(current - 1, 0);
  if (key === "Home") return 0;
  if (key === "End") return rowCount - 1;
  return null;
}
