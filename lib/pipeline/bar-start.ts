// Starts the bar tracker on the first frame from the user's mark: a known plate circle, or a tap
// whose plate rim is searched for. Frames may be smaller than the clip; the mark and the circle
// are converted between clip pixels and frame pixels here.
import { createBarTracker, FrameInputError, suggestPlateCircle, type BarTracker, type RgbaFrame } from "@/lib/tracking";
import { PipelineError } from "./errors";
import type { BarMark } from "./options";

/** Clip pixels per frame pixel along each axis. */
export interface FrameScale {
  x: number;
  y: number;
}

/**
 * Tracker coordinates put pixel i's centre at i; a shrunk frame's pixel centres sit in the middle of
 * the blocks they average, hence the half-pixel terms.
 */
export function toClipPoint(scale: FrameScale, x: number, y: number): { x: number; y: number } {
  return { x: (x + 0.5) * scale.x - 0.5, y: (y + 0.5) * scale.y - 0.5 };
}

export function toFramePoint(scale: FrameScale, x: number, y: number): { x: number; y: number } {
  return { x: (x + 0.5) / scale.x - 0.5, y: (y + 0.5) / scale.y - 0.5 };
}

/** The plate's outer rim in clip pixels; `score` is the share of rim found (1 when the caller gave it). */
export interface PlateRim {
  cx: number;
  cy: number;
  radiusPx: number;
  score: number;
}

export interface BarStart {
  tracker: BarTracker;
  /** Null when a tap found no plate rim (the tracker then follows a disc of default size). */
  plate: PlateRim | null;
}

export function frameScale(source: { width: number; height: number }, frame: RgbaFrame): FrameScale {
  return { x: source.width / frame.width, y: source.height / frame.height };
}

function checkInsideClip(mark: BarMark, clipWidth: number, clipHeight: number): void {
  const [x, y] = mark.kind === "tap" ? [mark.x, mark.y] : [mark.cx, mark.cy];
  if (x > clipWidth - 1 || y > clipHeight - 1) {
    const what = mark.kind === "tap" ? "tap" : "plate centre";
    throw new PipelineError("bad-tap", `The ${what} (${x}, ${y}) lies outside the ${clipWidth}x${clipHeight} clip`);
  }
}

export function startBarTracker(mark: BarMark, first: RgbaFrame, scale: FrameScale): BarStart {
  // Square pixels: one factor converts radii.
  const radiusScale = Math.sqrt(scale.x * scale.y);
  checkInsideClip(mark, Math.round(first.width * scale.x), Math.round(first.height * scale.y));
  try {
    if (mark.kind === "plate") {
      const centre = toFramePoint(scale, mark.cx, mark.cy);
      const tracker = createBarTracker({ tapX: centre.x, tapY: centre.y, radiusPx: mark.radiusPx / radiusScale, firstFrame: first });
      return { tracker, plate: { cx: mark.cx, cy: mark.cy, radiusPx: mark.radiusPx, score: 1 } };
    }
    const tap = toFramePoint(scale, mark.x, mark.y);
    const circle = suggestPlateCircle(first, tap.x, tap.y);
    if (!circle) return { tracker: createBarTracker({ tapX: tap.x, tapY: tap.y, firstFrame: first }), plate: null };
    // The plate's centre is the bar's end, wherever on the plate the tap landed.
    const tracker = createBarTracker({ tapX: circle.cx, tapY: circle.cy, radiusPx: circle.radiusPx, firstFrame: first });
    const centre = toClipPoint(scale, circle.cx, circle.cy);
    return { tracker, plate: { cx: centre.x, cy: centre.y, radiusPx: circle.radiusPx * radiusScale, score: circle.score } };
  } catch (error) {
    if (error instanceof FrameInputError) {
      throw new PipelineError("bad-tap", `The bar mark cannot be tracked: ${error.message.replace(/^tapX\/tapY: /, "")}`);
    }
    throw error;
  }
}
