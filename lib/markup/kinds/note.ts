// Note: a line of text pinned at a point (its top-left corner).
import { translatePoint } from "../geometry";
import type { GeometryOf } from "@/lib/validation/markup";
import type { Point } from "../geometry";
import type { ShapeKind } from "./types";

/** Notes are drawn at this size in video pixels, so they scale with the clip like every other shape. */
export const NOTE_FONT_PX = 18;
/** Average glyph width of the UI font relative to its size (common practice for a sans-serif estimate). */
const GLYPH_WIDTH_RATIO = 0.6;
export const NOTE_PADDING_PX = 6;

export function noteBox(g: GeometryOf<"note">): { x: number; y: number; width: number; height: number } {
  const lines = g.text.split("\n");
  const longest = Math.max(...lines.map((line) => line.length));
  return {
    x: g.at.x,
    y: g.at.y,
    width: longest * NOTE_FONT_PX * GLYPH_WIDTH_RATIO + 2 * NOTE_PADDING_PX,
    height: lines.length * NOTE_FONT_PX * 1.25 + 2 * NOTE_PADDING_PX,
  };
}

export const note: ShapeKind<"note"> = {
  kind: "note",
  hitTest(g, p: Point, tolerancePx) {
    const box = noteBox(g);
    return (
      p.x >= box.x - tolerancePx && p.x <= box.x + box.width + tolerancePx && p.y >= box.y - tolerancePx && p.y <= box.y + box.height + tolerancePx
    );
  },
  translate: (g, dx, dy) => ({ ...g, at: translatePoint(g.at, dx, dy) }),
  measure: () => null,
  anchor: (g) => g.at,
};
