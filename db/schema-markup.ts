// Markup: the shapes a coach draws over a set's clip, each pinned to one analysed frame (and optionally
// shown until a later time). Ids come from the browser so a shape can be saved, retried and edited
// before the server has seen it; `revision` orders writes (last write wins per shape); deletion is a
// tombstone so a late, older write cannot bring a deleted shape back.
import { relations, sql } from "drizzle-orm";
import { check, doublePrecision, index, integer, jsonb, pgEnum, pgTable, text, uuid } from "drizzle-orm/pg-core";
import { timestamptz } from "./columns";
import { sets, user } from "./schema";
import { MARKUP_KINDS, type MarkupGeometry, type MarkupStyle } from "../lib/validation/markup";


export const markupKindEnum = pgEnum("markup_kind", MARKUP_KINDS);

export const markupShapes = pgTable(
  "markup_shapes",
  {
    id: uuid("id").primaryKey(),
    setId: uuid("set_id")
      .notNull()
      .references(() => sets.id, { onDelete: "cascade" }),
    kind: markupKindEnum("kind").notNull(),
    frameIndex: integer("frame_index").notNull(),
    frameTimeS: doublePrecision("frame_time_s").notNull(),
    spanEndS: doublePrecision("span_end_s"),
    /** Video pixel coordinates, validated by markupGeometrySchema (lib/validation/markup.ts). */
    geometry: jsonb("geometry").$type<MarkupGeometry>().notNull(),
    style: jsonb("style").$type<MarkupStyle>().notNull(),
    createdBy: text("created_by").references(() => user.id, { onDelete: "set null" }),
    updatedBy: text("updated_by").references(() => user.id, { onDelete: "set null" }),
    revision: integer("revision").notNull(),
    createdAt: timestamptz("created_at").defaultNow().notNull(),
    updatedAt: timestamptz("updated_at").defaultNow().notNull(),
    deletedAt: timestamptz("deleted_at"),
  },
  (t) => [
    index("markup_shapes_set_id_idx").on(t.setId, t.frameIndex),
    check("markup_shapes_frame_index_check", sql`${t.frameIndex} >= 0`),
    check("markup_shapes_revision_check", sql`${t.revision} >= 1`),
    check("markup_shapes_span_check", sql`${t.spanEndS} is null or ${t.spanEndS} >= ${t.frameTimeS}`),
  ],
);

export const markupShapesRelations = relations(markupShapes, ({ one }) => ({
  set: one(sets, { fields: [markupShapes.setId], references: [sets.id] }),
  author: one(user, { fields: [markupShapes.createdBy], references: [user.id] }),
}));

export type MarkupShapeRow = typeof markupShapes.$inferSelect;
export type NewMarkupShapeRow = typeof markupShapes.$inferInsert;
