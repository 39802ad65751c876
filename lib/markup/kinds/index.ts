// The registry of shape kinds: every caller goes through these helpers, so adding a kind touches its own
// module, this map and the zod union in lib/validation/markup.ts.
import type { GeometryOf, MarkupGeometry, MarkupKind } from "@/lib/validation/markup";
import { markupGeometrySchema } from "@/lib/validation/markup";
import type { Point } from "../geometry";
import { arrow } from "./arrow";
import { note } from "./note";
import { pen } from "./pen";
import { protractor } from "./protractor";
import { ring } from "./ring";
import { ruler } from "./ruler";
import type { MeasureContext, ShapeKind, ShapeMeasure } from "./types";

export type { MeasureContext, ShapeKind, ShapeMeasure };

const KINDS: { [K in MarkupKind]: ShapeKind<K> } = { ruler, protractor, arrow, ring, pen, note };

function kindOf<K extends MarkupKind>(geometry: GeometryOf<K>): ShapeKind<K> {
  return KINDS[geometry.kind as K];
}

export function hitTest(geometry: MarkupGeometry, p: Point, tolerancePx: number): boolean {
  return kindOf(geometry).hitTest(geometry, p, tolerancePx);
}

export function translateGeometry<G extends MarkupGeometry>(geometry: G, dx: number, dy: number): G {
  return kindOf(geometry).translate(geometry, dx, dy) as G;
}

export function measureOf(geometry: MarkupGeometry, context: MeasureContext): ShapeMeasure | null {
  return kindOf(geometry).measure(geometry, context);
}

export function anchorOf(geometry: MarkupGeometry): Point {
  return kindOf(geometry).anchor(geometry);
}

/** The geometry as the server stores it, or null when the server would refuse it. */
export function serialiseGeometry(geometry: MarkupGeometry): MarkupGeometry | null {
  const parsed = markupGeometrySchema.safeParse(geometry);
  return parsed.success ? parsed.data : null;
}
