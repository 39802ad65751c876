// Markup shapes of a set: listed for readers, written one shape at a time (never "replace the list"),
// so two editors working on different shapes never lose each other's work. Each write carries the
// shape's revision; a write older than the stored one is ignored (last write wins per shape), and a
// deletion keeps a tombstone at its revision so a late, older write cannot bring the shape back.
// Callers check access first (requireSetReader in lib/access.ts).
import "server-only";
import { and, asc, eq, isNull, lt, sql } from "drizzle-orm";
import { db } from "@/db";
import { markupShapes, type MarkupShapeRow } from "@/db/schema-markup";
import { ApiError } from "@/lib/errors";
import type { MarkupShapeInput } from "@/lib/validation/markup";
import type { Viewer } from "./viewer";

export interface MarkupShape {
  id: string;
  setId: string;
  kind: MarkupShapeRow["kind"];
  frameIndex: number;
  frameTimeS: number;
  spanEndS: number | null;
  geometry: MarkupShapeRow["geometry"];
  style: MarkupShapeRow["style"];
  revision: number;
  createdBy: string | null;
  createdAt: Date;
  updatedAt: Date;
}

function toShape(row: MarkupShapeRow): MarkupShape {
  return {
    id: row.id,
    setId: row.setId,
    kind: row.kind,
    frameIndex: row.frameIndex,
    frameTimeS: row.frameTimeS,
    spanEndS: row.spanEndS,
    geometry: row.geometry,
    style: row.style,
    revision: row.revision,
    createdBy: row.createdBy,
    createdAt: row.createdAt,
    updatedAt: row.updatedAt,
  };
}

/** The set's live shapes in frame order. */
export async function listMarkup(setId: string): Promise<MarkupShape[]> {
  const rows = await db
    .select()
    .from(markupShapes)
    .where(and(eq(markupShapes.setId, setId), isNull(markupShapes.deletedAt)))
    .orderBy(asc(markupShapes.frameIndex), asc(markupShapes.createdAt));
  return rows.map(toShape);
}

export interface UpsertResult {
  /** The shape as stored after the write (the newer one when this write lost). */
  shape: MarkupShape;
  /** False when the stored revision was already at or above this one. */
  applied: boolean;
  /** True when the stored shape is a deletion that this write did not outrank. */
  deleted: boolean;
}

/** Creates or replaces one shape at its revision, in one statement. */
export async function upsertMarkupShape(viewer: Viewer, setId: string, shapeId: string, input: MarkupShapeInput): Promise<UpsertResult> {
  const values = {
    kind: input.geometry.kind,
    frameIndex: input.frameIndex,
    frameTimeS: input.frameTimeS,
    spanEndS: input.spanEndS,
    geometry: input.geometry,
    style: input.style,
    revision: input.revision,
    updatedBy: viewer.userId,
  };
  const [written] = await db
    .insert(markupShapes)
    .values({ id: shapeId, setId, createdBy: viewer.userId, ...values })
    .onConflictDoUpdate({
      target: markupShapes.id,
      set: { ...values, updatedAt: sql`now()`, deletedAt: null },
      // Only a newer revision of a shape of this same set replaces what is stored.
      setWhere: and(lt(markupShapes.revision, input.revision), eq(markupShapes.setId, setId)),
    })
    .returning();
  if (written) return { shape: toShape(written), applied: true, deleted: false };
  const [stored] = await db.select().from(markupShapes).where(eq(markupShapes.id, shapeId));
  if (!stored || stored.setId !== setId) throw new ApiError("conflict:markup", "That shape id is already used elsewhere.");
  return { shape: toShape(stored), applied: false, deleted: stored.deletedAt !== null };
}

/** Marks one shape deleted at the given revision; an unknown shape or an older revision changes nothing. */
export async function deleteMarkupShape(viewer: Viewer, setId: string, shapeId: string, revision: number): Promise<void> {
  await db
    .update(markupShapes)
    .set({ deletedAt: sql`now()`, revision, updatedBy: viewer.userId, updatedAt: sql`now()` })
    .where(and(eq(markupShapes.id, shapeId), eq(markupShapes.setId, setId), lt(markupShapes.revision, revision)));
}
