// A set's review: status, summary and cues, with the moves of lib/review/status.ts applied under a row lock so
// two tabs cannot both send. Access is checked by the caller (requireSetReader / requireReviewEditor).
import "server-only";
import { eq } from "drizzle-orm";
import { db, type Transaction } from "@/db";
import { user } from "@/db/schema";
import { setReviews, type SetReview } from "@/db/schema-review";
import { ApiError } from "@/lib/errors";
import { canSendReview, reviewStatusAfter, ReviewTransitionError, type ReviewEvent } from "@/lib/review/status";
import type { ReviewCue, ReviewDraft, ReviewStatus, StoredReviewStatus } from "@/lib/validation/review";
import { findActiveShare } from "./shares";
import type { Viewer } from "./viewer";

export interface ReviewState {
  setId: string;
  status: ReviewStatus;
  summary: string;
  cues: ReviewCue[];
  startedAt: Date | null;
  answeredAt: Date | null;
  seenAt: Date | null;
  updatedAt: Date | null;
}

export interface ShareState {
  sharedAt: Date;
  sharedByName: string | null;
}

function stateOf(setId: string, row: SetReview | undefined): ReviewState {
  if (!row) return { setId, status: "waiting", summary: "", cues: [], startedAt: null, answeredAt: null, seenAt: null, updatedAt: null };
  return {
    setId,
    status: row.status,
    summary: row.summary,
    cues: row.cues,
    startedAt: row.startedAt,
    answeredAt: row.answeredAt,
    seenAt: row.seenAt,
    updatedAt: row.updatedAt,
  };
}

export async function getReview(setId: string): Promise<ReviewState> {
  const [row] = await db.select().from(setReviews).where(eq(setReviews.setId, setId));
  return stateOf(setId, row);
}

export async function getShare(setId: string): Promise<ShareState | null> {
  const share = await findActiveShare(setId);
  if (!share) return null;
  const [by] = share.sharedBy ? await db.select({ name: user.name }).from(user).where(eq(user.id, share.sharedBy)) : [];
  return { sharedAt: share.sharedAt, sharedByName: by?.name ?? null };
}

async function lockedReview(tx: Transaction, setId: string): Promise<SetReview | undefined> {
  const [row] = await tx.select().from(setReviews).where(eq(setReviews.setId, setId)).for("update");
  return row;
}

/** The machine's next status, as stored: every move out of "waiting" leaves a review row behind. */
function nextStatus(current: ReviewStatus, event: ReviewEvent): StoredReviewStatus {
  try {
    const next = reviewStatusAfter(current, event);
    if (next === "waiting") throw new ApiError("conflict:review", "This review has not started yet.");
    return next;
  } catch (error) {
    if (error instanceof ReviewTransitionError) throw new ApiError("conflict:review", error.message);
    throw error;
  }
}

/** The coach opened the review: a waiting set becomes in review; any other status stays. */
export async function startReview(viewer: Viewer, setId: string): Promise<ReviewState> {
  await db
    .insert(setReviews)
    .values({ setId, status: nextStatus("waiting", "open"), startedBy: viewer.userId })
    .onConflictDoNothing();
  return getReview(setId);
}

/** Saves the summary and cues as a draft; after a send this reopens the review until it is sent again. */
export async function saveReviewDraft(viewer: Viewer, setId: string, draft: ReviewDraft): Promise<ReviewState> {
  return db.transaction(async (tx) => {
    const current = await lockedReview(tx, setId);
    const status = nextStatus(current?.status ?? "waiting", "draft");
    const [row] = current
      ? await tx.update(setReviews).set({ status, summary: draft.summary, cues: draft.cues }).where(eq(setReviews.setId, setId)).returning()
      : await tx.insert(setReviews).values({ setId, status, summary: draft.summary, cues: draft.cues, startedBy: viewer.userId }).returning();
    return stateOf(setId, row);
  });
}

/** Marks the review answered; the caller mails the athlete after the commit. */
export async function sendReview(viewer: Viewer, setId: string): Promise<ReviewState> {
  return db.transaction(async (tx) => {
    const current = await lockedReview(tx, setId);
    const status = nextStatus(current?.status ?? "waiting", "send");
    if (!current || !canSendReview(current)) {
      throw new ApiError("bad_request:review", "Write a summary or at least one cue before sending.");
    }
    const [row] = await tx
      .update(setReviews)
      .set({ status, answeredAt: new Date(), answeredBy: viewer.userId, seenAt: null })
      .where(eq(setReviews.setId, setId))
      .returning();
    return stateOf(setId, row);
  });
}

/** The athlete opened the answered review: it becomes seen once, keeping the first time. */
export async function markReviewSeen(setId: string): Promise<ReviewState> {
  return db.transaction(async (tx) => {
    const current = await lockedReview(tx, setId);
    if (!current) return stateOf(setId, undefined);
    const status = nextStatus(current.status, "athlete_open");
    if (status === current.status) return stateOf(setId, current);
    const [row] = await tx.update(setReviews).set({ status, seenAt: new Date() }).where(eq(setReviews.setId, setId)).returning();
    return stateOf(setId, row);
  });
}
