// How review pages write moments of a clip and group comments into threads.

/** "0:02.25": minutes, seconds and hundredths, which is as fine as a 30–60 fps frame needs. */
export function formatClipTime(timeS: number): string {
  const hundredths = Math.round(Math.max(0, timeS) * 100);
  const minutes = Math.floor(hundredths / 6000);
  const seconds = (hundredths % 6000) / 100;
  return `${minutes}:${seconds.toFixed(2).padStart(5, "0")}`;
}

export interface Threaded<C> {
  root: C;
  replies: C[];
}

/** Threads ordered by their moment in the clip (then by when they were written); replies keep their order. */
export function threadsOf<C extends { id: string; parentId: string | null; timeS: number; createdAt: string }>(comments: C[]): Threaded<C>[] {
  const replies = new Map<string, C[]>();
  for (const c of comments) if (c.parentId) replies.set(c.parentId, [...(replies.get(c.parentId) ?? []), c]);
  return comments
    .filter((c) => c.parentId === null)
    .sort((a, b) => a.timeS - b.timeS || a.createdAt.localeCompare(b.createdAt))
    .map((root) => ({ root, replies: replies.get(root.id) ?? [] }));
}

/** The rep whose span holds the time, or null between reps. */
export function repAt(reps: readonly { repIndex: number; startS: number; endS: number }[], timeS: number): number | null {
  return reps.find((r) => timeS >= r.startS && timeS <= r.endS)?.repIndex ?? null;
}
