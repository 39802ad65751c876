// Abuse limits that must survive a restart: every clip upload started, counted against its team's (or, for a
// personal set, its athlete's) daily quota. Kept apart from the sets so that replacing or cancelling a clip
// does not give the quota back.
import { bigint, index, pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";

export const clipUploadStarts = pgTable(
  "clip_upload_starts",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    /** `team:<teamId>` or, for a set filed under no team, `athlete:<userId>`. */
    quotaKey: text("quota_key").notNull(),
    setId: uuid("set_id").notNull(),
    userId: text("user_id").notNull(),
    sizeBytes: bigint("size_bytes", { mode: "number" }).notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).defaultNow().notNull(),
  },
  (t) => [index("clip_upload_starts_quota_key_created_at_idx").on(t.quotaKey, t.createdAt)],
);

export type ClipUploadStart = typeof clipUploadStarts.$inferSelect;
export type NewClipUploadStart = typeof clipUploadStarts.$inferInsert;
