// The review of a set: its status and the coach's summary with cues, comments pinned to moments of the clip,
// and the opt-in share of a set with its team for peer critique. A set with an analysis and no review row is waiting.
import { relations, sql } from "drizzle-orm";
import {
  type AnyPgColumn,
  check,
  doublePrecision,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  text,
  uniqueIndex,
  uuid,
} from "drizzle-orm/pg-core";
import { createdAt, timestamptz, updatedAt } from "./columns";
import { sets, teams, user } from "./schema";
import { STORED_REVIEW_STATUSES, type ReviewCue } from "../lib/validation/review";


export const reviewStatusEnum = pgEnum("review_status", STORED_REVIEW_STATUSES);

/** One per set, created when a coach first opens or writes the review. */
export const setReviews = pgTable(
  "set_reviews",
  {
    setId: uuid("set_id")
      .primaryKey()
      .references(() => sets.id, { onDelete: "cascade" }),
    status: reviewStatusEnum("status").default("in_review").notNull(),
    summary: text("summary").default("").notNull(),
    cues: jsonb("cues").$type<ReviewCue[]>().default([]).notNull(),
    /** The coach (or admin) who opened the review first. */
    startedBy: text("started_by").references(() => user.id, { onDelete: "set null" }),
    startedAt: timestamptz("started_at").defaultNow().notNull(),
    answeredBy: text("answered_by").references(() => user.id, { onDelete: "set null" }),
    answeredAt: timestamptz("answered_at"),
    /** When the athlete first opened the answered review. */
    seenAt: timestamptz("seen_at"),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index("set_reviews_status_idx").on(t.status)],
);

/** A comment pinned to a moment of the clip (time and frame index), optionally naming a rep; replies carry parentId. */
export const setComments = pgTable(
  "set_comments",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    setId: uuid("set_id")
      .notNull()
      .references(() => sets.id, { onDelete: "cascade" }),
    parentId: uuid("parent_id").references((): AnyPgColumn => setComments.id, { onDelete: "cascade" }),
    authorId: text("author_id").references(() => user.id, { onDelete: "set null" }),
    body: text("body").notNull(),
    timeS: doublePrecision("time_s").notNull(),
    frameIndex: integer("frame_index").notNull(),
    repNumber: integer("rep_number"),
    /** A deleted comment with replies keeps its place in the thread with the text removed. */
    deletedAt: timestamptz("deleted_at"),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    index("set_comments_set_id_idx").on(t.setId, t.createdAt),
    index("set_comments_parent_id_idx").on(t.parentId),
    check("set_comments_time_s_check", sql`${t.timeS} >= 0`),
    check("set_comments_frame_index_check", sql`${t.frameIndex} >= 0`),
    check("set_comments_rep_number_check", sql`${t.repNumber} is null or ${t.repNumber} >= 1`),
  ],
);

/** A set shared with its team; withdrawing keeps the row (who and when) and ends the share. */
export const setShares = pgTable(
  "set_shares",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    setId: uuid("set_id")
      .notNull()
      .references(() => sets.id, { onDelete: "cascade" }),
    teamId: uuid("team_id")
      .notNull()
      .references(() => teams.id, { onDelete: "cascade" }),
    sharedBy: text("shared_by").references(() => user.id, { onDelete: "set null" }),
    sharedAt: timestamptz("shared_at").defaultNow().notNull(),
    withdrawnBy: text("withdrawn_by").references(() => user.id, { onDelete: "set null" }),
    withdrawnAt: timestamptz("withdrawn_at"),
  },
  (t) => [
    uniqueIndex("set_shares_active_set_key")
      .on(t.setId)
      .where(sql`${t.withdrawnAt} is null`),
    index("set_shares_team_id_idx").on(t.teamId),
  ],
);

export const setReviewRelations = relations(setReviews, ({ one }) => ({
  set: one(sets, { fields: [setReviews.setId], references: [sets.id] }),
}));

export const setCommentRelations = relations(setComments, ({ one }) => ({
  set: one(sets, { fields: [setComments.setId], references: [sets.id] }),
  author: one(user, { fields: [setComments.authorId], references: [user.id] }),
  parent: one(setComments, { fields: [setComments.parentId], references: [setComments.id] }),
}));

export const setShareRelations = relations(setShares, ({ one }) => ({
  set: one(sets, { fields: [setShares.setId], references: [sets.id] }),
  team: one(teams, { fields: [setShares.teamId], references: [teams.id] }),
}));

export type SetReview = typeof setReviews.$inferSelect;
export type NewSetReview = typeof setReviews.$inferInsert;
export type SetComment = typeof setComments.$inferSelect;
export type NewSetComment = typeof setComments.$inferInsert;
export type SetShare = typeof setShares.$inferSelect;
export type NewSetShare = typeof setShares.$inferInsert;
