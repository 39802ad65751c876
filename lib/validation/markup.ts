// Request schemas of the markup routes: one shape a coach drew on a frame of the clip. Geometry is a
// discriminated union on the shape kind, in video pixel coordinates (so a shape sits in the same place
// at any zoom); the server stores it as given once it passes these checks.
import { z } from "zod";

/** Far outside any clip we accept (MAX_IMAGE_SIDE_PX is 16 384): refuses garbage, not odd placements. */
const COORDINATE_LIMIT_PX = 100_000;
export const MAX_PEN_POINTS = 2_000;
export const MAX_NOTE_CHARS = 500;

const coordinate = z
  .number({ error: "Expected a number of pixels." })
  .refine(Number.isFinite, { error: "Expected a finite number of pixels." })
  .refine((v) => Math.abs(v) <= COORDINATE_LIMIT_PX, { error: "That point is far outside the clip." });

export const pointSchema = z.object({ x: coordinate, y: coordinate }, { error: "Expected a point { x, y } in video pixels." });
export type MarkupPoint = z.infer<typeof pointSchema>;

const rulerSchema = z.object({ kind: z.literal("ruler"), a: pointSchema, b: pointSchema });
const arrowSchema = z.object({ kind: z.literal("arrow"), from: pointSchema, to: pointSchema });
const ringSchema = z.object({
  kind: z.literal("ring"),
  center: pointSchema,
  radiusXPx: z.number().positive({ error: "A ring needs a radius above 0." }).max(COORDINATE_LIMIT_PX),
  radiusYPx: z.number().positive({ error: "A ring needs a radius above 0." }).max(COORDINATE_LIMIT_PX),
});
const penSchema = z.object({
  kind: z.literal("pen"),
  points: z
    .array(pointSchema)
    .min(2, { error: "A pen stroke needs at least two points." })
    .max(MAX_PEN_POINTS, { error: `A pen stroke has at most ${MAX_PEN_POINTS} points.` }),
});
const noteSchema = z.object({
  kind: z.literal("note"),
  at: pointSchema,
  text: z.string().trim().min(1, { error: "A note needs some text." }).max(MAX_NOTE_CHARS, { error: `A note has at most ${MAX_NOTE_CHARS} characters.` }),
});
/** Three points: the angle at the vertex between the rays to a and b. */
const protractorThreePointSchema = z.object({ kind: z.literal("protractor"), mode: z.literal("three-point"), a: pointSchema, vertex: pointSchema, b: pointSchema });
/** Two points: the angle of the line from the vertex to a against the vertical (the plumb line). */
const protractorVerticalSchema = z.object({ kind: z.literal("protractor"), mode: z.literal("vertical"), vertex: pointSchema, a: pointSchema });

export const markupGeometrySchema = z.discriminatedUnion(
  "kind",
  [
    rulerSchema,
    z.discriminatedUnion("mode", [protractorThreePointSchema, protractorVerticalSchema], { error: "A protractor is three-point or vertical." }),
    arrowSchema,
    ringSchema,
    penSchema,
    noteSchema,
  ],
  { error: "Unknown kind of shape." },
);
export type MarkupGeometry = z.infer<typeof markupGeometrySchema>;
export type MarkupKind = MarkupGeometry["kind"];
export const MARKUP_KINDS = ["ruler", "protractor", "arrow", "ring", "pen", "note"] as const satisfies readonly MarkupKind[];
export type GeometryOf<K extends MarkupKind> = Extract<MarkupGeometry, { kind: K }>;

/** Colours are names of design tokens (see components/markup/style.ts), never raw values. */
export const MARKUP_COLOURS = ["action", "caution", "fault", "eccentric", "ink", "surface"] as const;
export type MarkupColour = (typeof MARKUP_COLOURS)[number];
export const MARKUP_STROKES = ["fine", "medium", "heavy"] as const;
export type MarkupStroke = (typeof MARKUP_STROKES)[number];

export const markupStyleSchema = z.object({
  colour: z.enum(MARKUP_COLOURS, { error: "Pick one of the markup colours." }),
  stroke: z.enum(MARKUP_STROKES, { error: "Pick a stroke: fine, medium or heavy." }),
});
export type MarkupStyle = z.infer<typeof markupStyleSchema>;

const revisionSchema = z.number().int({ error: "The revision is a whole number." }).min(1).max(Number.MAX_SAFE_INTEGER);

/** Body of PUT /api/sets/[setId]/markup/[shapeId]: the whole shape at one revision (last write wins). */
export const markupShapeInputSchema = z
  .object({
    frameIndex: z.number().int({ error: "The frame is a whole number." }).min(0).max(10_000_000),
    frameTimeS: z.number().min(0, { error: "The frame time cannot be negative." }).max(86_400),
    spanEndS: z.number().max(86_400).nullable().default(null),
    geometry: markupGeometrySchema,
    style: markupStyleSchema,
    revision: revisionSchema,
  })
  .refine((shape) => shape.spanEndS === null || shape.spanEndS >= shape.frameTimeS, {
    path: ["spanEndS"],
    error: "A span ends at or after the frame it is pinned to.",
  });
export type MarkupShapeInput = z.output<typeof markupShapeInputSchema>;

/** Query of DELETE /api/sets/[setId]/markup/[shapeId]: the revision of the deletion (last write wins). */
export const markupDeleteQuerySchema = z.object({ revision: z.coerce.number().pipe(revisionSchema) });

/** A stored shape as the API sends it (dates as ISO strings). */
export const markupShapeSchema = z.object({
  id: z.uuid(),
  setId: z.uuid(),
  kind: z.enum(MARKUP_KINDS),
  frameIndex: z.number().int(),
  frameTimeS: z.number(),
  spanEndS: z.number().nullable(),
  geometry: markupGeometrySchema,
  style: markupStyleSchema,
  revision: z.number().int(),
  createdBy: z.string().nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type MarkupShapeView = z.infer<typeof markupShapeSchema>;

export const markupListResponseSchema = z.object({ shapes: z.array(markupShapeSchema), canEdit: z.boolean() });
export const markupPutResponseSchema = z.object({ shape: markupShapeSchema, applied: z.boolean(), deleted: z.boolean() });
