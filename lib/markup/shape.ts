// A markup shape as the browser holds it: what the server stores, minus the bookkeeping it adds.
import type { MarkupGeometry, MarkupShapeInput, MarkupStyle } from "@/lib/validation/markup";

export interface Shape {
  id: string;
  frameIndex: number;
  frameTimeS: number;
  /** Shown until this time as well as on its own frame; null for its frame only. */
  spanEndS: number | null;
  geometry: MarkupGeometry;
  style: MarkupStyle;
  revision: number;
}

/** Seconds of slack when comparing a frame's time with a span's end (well under one frame at 240 fps). */
const TIME_SLACK_S = 1e-4;

/**
 * A shape shows on the frame it is pinned to, and on every frame up to its span's end. The frame's time
 * counts as well as its index, so a shape stays put if the player falls back to the engine's frame list.
 */
export function isShapeVisible(shape: Pick<Shape, "frameIndex" | "frameTimeS" | "spanEndS">, frameIndex: number, timeS: number): boolean {
  if (frameIndex === shape.frameIndex || Math.abs(timeS - shape.frameTimeS) <= TIME_SLACK_S) return true;
  if (shape.spanEndS === null) return false;
  return timeS >= shape.frameTimeS - TIME_SLACK_S && timeS <= shape.spanEndS + TIME_SLACK_S;
}

export function toShapeInput(shape: Shape): MarkupShapeInput {
  return {
    frameIndex: shape.frameIndex,
    frameTimeS: shape.frameTimeS,
    spanEndS: shape.spanEndS,
    geometry: shape.geometry,
    style: shape.style,
    revision: shape.revision,
  };
}
