// What every kind of markup shape knows about itself: hit testing, moving, the measure it shows, and
// its serialised form (checked by the shared zod union so the browser never queues what the server refuses).
import type { GeometryOf, MarkupKind } from "@/lib/validation/markup";
import type { Point } from "../geometry";

export interface MeasureContext {
  /** The analysis's calibration; null when the set has none. */
  metresPerPixel: number | null;
}

export interface ShapeMeasure {
  value: number;
  unit: "cm" | "°" | "px";
  label: string;
}

export interface ShapeKind<K extends MarkupKind> {
  kind: K;
  /** True when p is on the shape, within `tolerancePx` video pixels. */
  hitTest(geometry: GeometryOf<K>, p: Point, tolerancePx: number): boolean;
  translate(geometry: GeometryOf<K>, dx: number, dy: number): GeometryOf<K>;
  measure(geometry: GeometryOf<K>, context: MeasureContext): ShapeMeasure | null;
  /** The point where a label or read-out sits. */
  anchor(geometry: GeometryOf<K>): Point;
}
