// Comments on a set's review, pinned to a moment of the clip (time, frame, optional rep) and threaded one level deep:
// a reply hangs under its thread's first comment and shares its moment. Access is the caller's check (requireSetReader).
import "server-only";
import { and, asc, eq, isNull } from "drizzle-orm";
import { db } from "@/db";
import { user } from "@/db/schema";
import { setComments, type SetComment } from "@/db/schema-review";
import { ApiError } from "@/lib/errors";
import type { CreateCommentData } from "@/lib/validation/review";
import type { Viewer } from "./viewer";

export interface CommentView {
  id: string;
  parentId: string | null;
  authorId: string | null;
  authorName: string | null;
  body: string;
  timeS: number;
  frameIndex: number;
  repNumber: number | null;
  deleted: boolean;
  edited: boolean;
  createdAt: Date;
}

function view(row: SetComment, authorName: string | null): CommentView {
  const deleted = row.deletedAt !== null;
  return {
    id: row.id,
    parentId: row.parentId,
    authorId: deleted ? null : row.authorId,
    authorName: deleted ? null : authorName,
    body: deleted ? "" : row.body,
    timeS: row.timeS,
    frameIndex: row.frameIndex,
    repNumber: row.repNumber,
    deleted,
    edited: !deleted && row.updatedAt.getTime() - row.createdAt.getTime() > 1000,
    createdAt: row.createdAt,
  };
}

/** Every comment of the set, oldest first; deleted ones stay only while they still have replies. */
export async function listComments(setId: string): Promise<CommentView[]> {
  const rows = await db
    .select({ comment: setComments, authorName: user.name })
    .from(setComments)
    .leftJoin(user, eq(user.id, setComments.authorId))
    .where(eq(setComments.setId, setId))
    .orderBy(asc(setComments.createdAt), asc(setComments.id));
  const hasReplies = new Set(rows.flatMap((r) => (r.comment.parentId && !r.comment.deletedAt ? [r.comment.parentId] : [])));
  return rows
    .filter((r) => !r.comment.deletedAt || hasReplies.has(r.comment.id))
    .map((r) => view(r.comment, r.authorName));
}

async function findComment(setId: string, commentId: string): Promise<SetComment> {
  const [row] = await db
    .select()
    .from(setComments)
    .where(and(eq(setComments.id, commentId), eq(setComments.setId, setId), isNull(setComments.deletedAt)));
  if (!row) throw new ApiError("not_found:comment", "There is no such comment.");
  return row;
}

export async function addComment(viewer: Viewer, setId: string, input: CreateCommentData): Promise<CommentView> {
  let values = { setId, authorId: viewer.userId, body: input.body, parentId: null as string | null, ...pinOf(input) };
  if (input.parentId) {
    const parent = await findComment(setId, input.parentId);
    const root = parent.parentId ? await findComment(setId, parent.parentId) : parent;
    values = { ...values, parentId: root.id, ...pinOf(root) };
  }
  const [row] = await db.insert(setComments).values(values).returning();
  return view(row, viewer.name);
}

function pinOf(source: { timeS: number; frameIndex: number; repNumber: number | null }) {
  return { timeS: source.timeS, frameIndex: source.frameIndex, repNumber: source.repNumber };
}

/** Only the author edits a comment. */
export async function editComment(viewer: Viewer, setId: string, commentId: string, body: string): Promise<CommentView> {
  const found = await findComment(setId, commentId);
  if (found.authorId !== viewer.userId) throw new ApiError("forbidden:comment", "You can only change your own comments.");
  const [row] = await db.update(setComments).set({ body }).where(eq(setComments.id, commentId)).returning();
  return view(row, viewer.name);
}

/** The author deletes their comment; a coach or admin (`moderator`) may remove any on a set they review. */
export async function deleteComment(viewer: Viewer, setId: string, commentId: string, moderator: boolean): Promise<void> {
  const found = await findComment(setId, commentId);
  if (found.authorId !== viewer.userId && !moderator) throw new ApiError("forbidden:comment", "You can only delete your own comments.");
  await db.update(setComments).set({ deletedAt: new Date() }).where(eq(setComments.id, commentId));
}
