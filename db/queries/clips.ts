// A set's clip through its life: upload started, uploaded and checked, converted to H.264 or failed.
// Every change locks the set row, so a second upload, a completion and a conversion never interleave.
import "server-only";
import { eq } from "drizzle-orm";
import { drizzle } from "drizzle-orm/node-postgres";
import type pg from "pg";
import { db, schema, type Executor } from "@/db";
import { sets, type LiftSet } from "@/db/schema";
import { ApiError } from "@/lib/errors";
import type { ClipStatus } from "@/lib/validation/set";

export interface ClipState {
  setId: string;
  status: ClipStatus;
  storageKey: string | null;
  uploadId: string | null;
  convertedKey: string | null;
  sizeBytes: number | null;
  container: string | null;
  codec: string | null;
  durationS: number | null;
  widthPx: number | null;
  heightPx: number | null;
  error: string | null;
}

export function clipStateOf(set: LiftSet): ClipState {
  return {
    setId: set.id,
    status: set.clipStatus,
    storageKey: set.clipStorageKey,
    uploadId: set.clipUploadId,
    convertedKey: set.clipConvertedKey,
    sizeBytes: set.clipSizeBytes,
    container: set.clipContainer,
    codec: set.clipCodec,
    durationS: set.clipDurationS,
    widthPx: set.clipWidthPx,
    heightPx: set.clipHeightPx,
    error: set.clipError,
  };
}

/** The set row, locked until the transaction ends. */
async function lockSet(executor: Executor, setId: string): Promise<LiftSet> {
  const [row] = await executor.select().from(sets).where(eq(sets.id, setId)).for("update");
  if (!row) throw new ApiError("not_found:set", "There is no such set.");
  return row;
}

const NO_CLIP = {
  clipStorageKey: null,
  clipUploadId: null,
  clipConvertedKey: null,
  clipSizeBytes: null,
  clipContainer: null,
  clipCodec: null,
  clipDurationS: null,
  clipWidthPx: null,
  clipHeightPx: null,
  clipError: null,
} as const;

/** Objects an earlier clip of the set left behind, for the caller to delete or abort. */
export interface ReplacedClip {
  storageKey: string | null;
  uploadId: string | null;
  convertedKey: string | null;
}

/** Records a new multipart upload as the set's clip; an analysed set keeps its clip. */
export async function beginClipUpload(
  setId: string,
  upload: { storageKey: string; uploadId: string; sizeBytes: number },
): Promise<ReplacedClip> {
  return db.transaction(async (tx) => {
    const set = await lockSet(tx, setId);
    if (set.status === "analysed") {
      throw new ApiError("conflict:clip", "This set is already analysed; its clip stays as it is. Record a new set for another clip.");
    }
    if (set.clipStatus === "converting") {
      throw new ApiError("conflict:clip", "The clip is being converted right now. Wait for it to finish before replacing it.");
    }
    await tx
      .update(sets)
      .set({ ...NO_CLIP, clipStatus: "uploading", clipStorageKey: upload.storageKey, clipUploadId: upload.uploadId, clipSizeBytes: upload.sizeBytes })
      .where(eq(sets.id, setId));
    return { storageKey: set.clipStorageKey, uploadId: set.clipUploadId, convertedKey: set.clipConvertedKey };
  });
}

/** The upload in progress, when `uploadId` is the set's current one; a 409 otherwise. */
export function requireCurrentUpload(set: LiftSet, uploadId: string): { storageKey: string; uploadId: string; sizeBytes: number } {
  if (set.clipStatus !== "uploading" || set.clipUploadId !== uploadId || !set.clipStorageKey) {
    throw new ApiError("conflict:upload", "This upload is no longer in progress (finished, cancelled or replaced). Start the upload again.");
  }
  return { storageKey: set.clipStorageKey, uploadId, sizeBytes: set.clipSizeBytes ?? 0 };
}

export interface CheckedClip {
  sizeBytes: number;
  container: string;
  codec: string;
  durationS: number;
  widthPx: number;
  heightPx: number;
}

/** Marks the upload as a stored, checked clip; false when another upload replaced it meanwhile. */
export async function finishClipUpload(setId: string, uploadId: string, clip: CheckedClip): Promise<boolean> {
  return db.transaction(async (tx) => {
    const set = await lockSet(tx, setId);
    if (set.clipUploadId !== uploadId || set.clipStatus !== "uploading") return false;
    await tx
      .update(sets)
      .set({
        clipStatus: "uploaded",
        clipUploadId: null,
        clipSizeBytes: clip.sizeBytes,
        clipContainer: clip.container,
        clipCodec: clip.codec,
        clipDurationS: clip.durationS,
        clipWidthPx: clip.widthPx,
        clipHeightPx: clip.heightPx,
        clipError: null,
        status: set.status === "analysed" ? "analysed" : "uploaded",
      })
      .where(eq(sets.id, setId));
    return true;
  });
}

/** Forgets an upload that was refused or cancelled; false when it was no longer the set's upload. */
export async function dropClipUpload(setId: string, uploadId: string): Promise<boolean> {
  return db.transaction(async (tx) => {
    const set = await lockSet(tx, setId);
    if (set.clipUploadId !== uploadId) return false;
    await tx
      .update(sets)
      .set({ ...NO_CLIP, clipStatus: "none", status: set.status === "uploaded" ? "draft" : set.status })
      .where(eq(sets.id, setId));
    return true;
  });
}

/** Runs SQL on the transaction's connection: the job queue enqueues through it. */
export interface SqlExecutor {
  executeSql(text: string, values: unknown[]): Promise<{ rows: unknown[] }>;
}

/**
 * Marks the clip as converting and enqueues the conversion job in the same transaction, so a job
 * never runs for a set that does not say "converting", and a set never waits for a job that was lost.
 */
export async function requestClipConversion(setId: string, enqueue: (executor: SqlExecutor) => Promise<void>): Promise<ClipState> {
  // drizzle keeps its pool on `$client` (the Database type leaves it out); one connection carries both writes.
  const client = await (db as typeof db & { $client: pg.Pool }).$client.connect();
  try {
    await client.query("begin");
    const tx = drizzle(client, { schema });
    const set = await lockSet(tx, setId);
    if (set.clipStatus === "converting" || set.clipStatus === "ready") {
      await client.query("commit");
      return clipStateOf(set);
    }
    if (set.clipStatus !== "uploaded" && set.clipStatus !== "failed") {
      throw new ApiError("conflict:clip", "There is no uploaded clip to convert yet.");
    }
    const [updated] = await tx.update(sets).set({ clipStatus: "converting", clipError: null }).where(eq(sets.id, setId)).returning();
    await enqueue({ executeSql: (text, values) => client.query(text, values) });
    await client.query("commit");
    return clipStateOf(updated);
  } catch (error) {
    await client.query("rollback");
    throw error;
  } finally {
    client.release();
  }
}

/** The clip to convert, or null when the set no longer waits for a conversion. */
export async function clipAwaitingConversion(setId: string): Promise<{ storageKey: string } | null> {
  const [set] = await db.select().from(sets).where(eq(sets.id, setId));
  if (!set || set.clipStatus !== "converting" || !set.clipStorageKey) return null;
  return { storageKey: set.clipStorageKey };
}

/** Records the H.264 copy; false when the set moved on (new clip, deleted) and the copy is not needed. */
export async function finishClipConversion(setId: string, sourceKey: string, convertedKey: string): Promise<boolean> {
  return db.transaction(async (tx) => {
    const [set] = await tx.select().from(sets).where(eq(sets.id, setId)).for("update");
    if (!set || set.clipStatus !== "converting" || set.clipStorageKey !== sourceKey) return false;
    await tx.update(sets).set({ clipStatus: "ready", clipConvertedKey: convertedKey, clipError: null }).where(eq(sets.id, setId));
    return true;
  });
}

export async function failClipConversion(setId: string, sourceKey: string, message: string): Promise<void> {
  await db.transaction(async (tx) => {
    const [set] = await tx.select().from(sets).where(eq(sets.id, setId)).for("update");
    if (!set || set.clipStatus !== "converting" || set.clipStorageKey !== sourceKey) return;
    await tx.update(sets).set({ clipStatus: "failed", clipError: message }).where(eq(sets.id, setId));
  });
}
