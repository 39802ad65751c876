// PUT: create or replace one markup shape at its revision (last write wins per shape).
// DELETE ?revision=: delete it at that revision. Only the athlete's coach or an admin draws markup.
import { requireSession, requireSetReader, type Viewer } from "@/lib/access";
import { ApiError, parseOrThrow, readJson, withErrors } from "@/lib/errors";
import { canEditMarkup } from "@/lib/markup/access";
import { uuidSchema } from "@/lib/validation/common";
import { markupDeleteQuerySchema, markupShapeInputSchema } from "@/lib/validation/markup";
import { deleteMarkupShape, upsertMarkupShape } from "@/db/queries/markup";

type Context = { params: Promise<{ setId: string; shapeId: string }> };

async function requireMarkupEditor(viewer: Viewer, params: Context["params"]) {
  const { setId, shapeId } = await params;
  const { set, role } = await requireSetReader(viewer, setId);
  if (!canEditMarkup(role)) throw new ApiError("forbidden:markup", "Only the athlete's coach can draw markup on this set.");
  const id = uuidSchema.safeParse(shapeId);
  if (!id.success) throw new ApiError("bad_request:markup", "The shape id must be a UUID.");
  return { set, shapeId: id.data };
}

export const PUT = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireSession(request);
  const { set, shapeId } = await requireMarkupEditor(viewer, params);
  const input = parseOrThrow(markupShapeInputSchema, await readJson(request, "markup"), "markup");
  return Response.json(await upsertMarkupShape(viewer, set.id, shapeId, input));
});

export const DELETE = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireSession(request);
  const { set, shapeId } = await requireMarkupEditor(viewer, params);
  const { revision } = parseOrThrow(markupDeleteQuerySchema, Object.fromEntries(new URL(request.url).searchParams), "markup");
  await deleteMarkupShape(viewer, set.id, shapeId, revision);
  return new Response(null, { status: 204 });
});
