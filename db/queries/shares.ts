// Peer review: a coach shares a set with its team so teammates can open the review read-only and comment.
// Withdrawing keeps the row (who shared, who withdrew, when); at most one share per set is active.
import "server-only";
import { and, eq, isNull } from "drizzle-orm";
import { db, type Executor } from "@/db";
import { setShares, type SetShare } from "@/db/schema-review";
import type { LiftSet } from "@/db/schema";
import { ApiError } from "@/lib/errors";
import type { Viewer } from "./viewer";

export async function findActiveShare(setId: string, executor: Executor = db): Promise<SetShare | null> {
  const [row] = await executor
    .select()
    .from(setShares)
    .where(and(eq(setShares.setId, setId), isNull(setShares.withdrawnAt)));
  return row ?? null;
}

/** Shares the set with its own team, or withdraws the share; idempotent either way. Access is the caller's check. */
export async function setShared(viewer: Viewer, set: LiftSet, shared: boolean): Promise<SetShare | null> {
  return db.transaction(async (tx) => {
    const active = await findActiveShare(set.id, tx);
    if (shared) {
      if (active) return active;
      if (!set.teamId) throw new ApiError("conflict:share", "This set is not filed under a team, so there is nobody to share it with.");
      // A concurrent share wins the partial unique index; then theirs is the active one.
      const [row] = await tx
        .insert(setShares)
        .values({ setId: set.id, teamId: set.teamId, sharedBy: viewer.userId })
        .onConflictDoNothing()
        .returning();
      return row ?? findActiveShare(set.id, tx);
    }
    if (active) {
      await tx
        .update(setShares)
        .set({ withdrawnAt: new Date(), withdrawnBy: viewer.userId })
        .where(eq(setShares.id, active.id));
    }
    return null;
  });
}
