// Daily clip-upload quotas: each upload started is written down under its team (or its athlete for a
// personal set); a new one is refused once the last 24 hours hold too many uploads or too many bytes.
import "server-only";
import { and, count, eq, gt, sql, sum } from "drizzle-orm";
import { db, type Executor } from "@/db";
import { clipUploadStarts } from "@/db/schema-hardening";
import type { LiftSet } from "@/db/schema";
import { ApiError } from "@/lib/errors";
import { uploadQuota } from "@/lib/limits";
import { formatMegabytes } from "@/lib/clips/limits";

const DAY_MS = 24 * 60 * 60 * 1000;

export function quotaKeyOf(set: Pick<LiftSet, "teamId" | "athleteId">): string {
  return set.teamId ? `team:${set.teamId}` : `athlete:${set.athleteId}`;
}

export async function quotaUsed(quotaKey: string, now = new Date(), executor: Executor = db): Promise<{ uploads: number; bytes: number }> {
  const [row] = await executor
    .select({ uploads: count(), bytes: sum(clipUploadStarts.sizeBytes).mapWith(Number) })
    .from(clipUploadStarts)
    .where(and(eq(clipUploadStarts.quotaKey, quotaKey), gt(clipUploadStarts.createdAt, new Date(now.getTime() - DAY_MS))));
  return { uploads: row.uploads, bytes: row.bytes ?? 0 };
}

/**
 * Writes the upload down if it fits the quota, or throws a 429. A transaction-scoped advisory lock on the
 * quota key makes two uploads started at once count one after the other.
 */
export async function reserveUpload(set: Pick<LiftSet, "id" | "teamId" | "athleteId">, userId: string, sizeBytes: number, now = new Date()): Promise<void> {
  const quotaKey = quotaKeyOf(set);
  const quota = uploadQuota();
  await db.transaction(async (tx) => {
    await tx.execute(sql`select pg_advisory_xact_lock(hashtextextended(${quotaKey}, 0))`);
    const used = await quotaUsed(quotaKey, now, tx);
    const whose = set.teamId ? "This team" : "You";
    if (used.uploads + 1 > quota.uploadsPerDay) {
      throw new ApiError("rate_limited:upload", `${whose} started ${used.uploads} clip uploads in the last 24 hours, the daily limit. Try again tomorrow.`);
    }
    if (used.bytes + sizeBytes > quota.bytesPerDay) {
      throw new ApiError(
        "rate_limited:upload",
        `${whose} uploaded ${formatMegabytes(used.bytes)} of clips in the last 24 hours; the daily limit is ${formatMegabytes(quota.bytesPerDay)}. Try again tomorrow.`,
      );
    }
    await tx.insert(clipUploadStarts).values({ quotaKey, setId: set.id, userId, sizeBytes, createdAt: now });
  });
}
