// Follows the plate (or sleeve end) picked with one tap through a clip: coarse-to-fine template
// matching with zero-mean NCC, a slowly updated template checked against the first one (resized
// as the plate's scale changes), and a constant-velocity guess with a widening search window to
// get through short occlusions.
import { z } from "zod";
import { assertRgbaFrame, FrameInputError, type RgbaFrame } from "./frame";
import { parabolaVertex, type Match } from "./ncc";
import { buildPyramid, grayRegion, toFrameX, toFrameY, type GrayImage, type PixelRect } from "./pyramid";
import { suggestPlateCircle } from "./plate-circle";
import { TemplateLevel } from "./template-level";

export interface BarSample {
  /** Frame pixels, y down. */
  x: number;
  y: number;
  /** Confidence 0..1 (the template's NCC at the match). */
  score: number;
}

export interface BarTracker {
  /** Template radius in frame pixels (the plate radius when it was found or given). */
  readonly radiusPx: number;
  /** Current plate size relative to the first frame (it changes when the plate nears or leaves the camera). */
  readonly scale: number;
  /** Call once per frame in order, the first frame included; null while the bar is lost. */
  track(frame: RgbaFrame): BarSample | null;
  /**
   * The frame pixels the next track() call reads (clipped to the frame): a caller may fill only
   * these, which spares converting the whole frame when nothing else looks at it.
   */
  nextRegion(): PixelRect;
  dispose(): void;
}

export interface BarTrackerOptions {
  tapX: number;
  tapY: number;
  firstFrame: RgbaFrame;
  /** Radius of the tracked disc; found with suggestPlateCircle when omitted. */
  radiusPx?: number;
}

/** Tuning, in one place; scores are NCC values. `common practice` for NCC trackers, tuned on the synthetic clips. */
const TUNING = {
  /** Template radius per pyramid level stays between these (level pixels). */
  maxFineRadius: 24,
  minCoarseRadius: 6,
  /** Fallback template radius as a fraction of the frame's short side, when no plate rim is found. */
  fallbackRadiusFraction: 0.05,
  /** Search half-width in frame pixels, as a fraction of the radius, while tracking. */
  searchRadiusFraction: 0.5,
  /** Limit of the widened window while lost, as a multiple of the radius. */
  maxSearchRadiusFactor: 4,
  keepScore: 0.45,
  reacquireScore: 0.6,
  updateScore: 0.8,
  /** Blend weight of the new patch in the running template. */
  updateRate: 0.15,
  /** Largest disagreement (finest-level pixels) between running and first template that still counts as no drift. */
  driftTolerance: 1,
  /** Scale probe ratio per frame, and the change that resizes the templates. */
  scaleStep: 1.03,
  rescaleTolerance: 0.03,
  /** Velocity smoothing and its decay while coasting through an occlusion. */
  velocityGain: 0.7,
  coastDamping: 0.85,
} as const;

const optionsSchema = z.object({
  tapX: z.number().finite(),
  tapY: z.number().finite(),
  radiusPx: z.number().finite().positive().optional(),
});

export function createBarTracker(options: BarTrackerOptions): BarTracker {
  const parsed = optionsSchema.safeParse(options);
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    throw new FrameInputError(`${issue.path.join(".")}: ${issue.message}`);
  }
  assertRgbaFrame(options.firstFrame, "firstFrame");
  const { tapX, tapY } = parsed.data;
  const first = options.firstFrame;
  if (tapX < 0 || tapY < 0 || tapX > first.width - 1 || tapY > first.height - 1) {
    throw new FrameInputError(`tapX/tapY: (${tapX}, ${tapY}) lies outside the ${first.width}x${first.height} frame`);
  }
  const radiusPx = clampRadius(
    parsed.data.radiusPx ??
      suggestPlateCircle(first, tapX, tapY)?.radiusPx ??
      TUNING.fallbackRadiusFraction * Math.min(first.width, first.height),
    first,
  );
  return new NccBarTracker(first, tapX, tapY, radiusPx);
}

function clampRadius(radiusPx: number, frame: RgbaFrame): number {
  return Math.max(4, Math.min(radiusPx, 0.45 * Math.min(frame.width, frame.height)));
}

/** Pyramid factors, fine to coarse: fine keeps the template under maxFineRadius, coarse above minCoarseRadius. */
function levelFactors(radiusPx: number): number[] {
  let fine = 1;
  while (radiusPx / fine > TUNING.maxFineRadius) fine *= 2;
  const factors = [fine];
  while (radiusPx / (factors[factors.length - 1] * 2) >= TUNING.minCoarseRadius) factors.push(factors[factors.length - 1] * 2);
  return factors;
}

interface Found {
  x: number;
  y: number;
  score: number;
  /** Running and first template agree, so the running one may learn from this frame. */
  driftFree: boolean;
  /** Position on the finest level, for the scale probe. */
  fine: { x: number; y: number };
}

class NccBarTracker implements BarTracker {
  private levels: TemplateLevel[] | null;
  private readonly width: number;
  private readonly height: number;
  private x: number;
  private y: number;
  private vx = 0;
  private vy = 0;
  private plateScale = 1;
  private lostFrames = 0;
  private lastGood: { x: number; y: number; framesAgo: number };

  constructor(
    firstFrame: RgbaFrame,
    tapX: number,
    tapY: number,
    readonly radiusPx: number,
  ) {
    this.width = firstFrame.width;
    this.height = firstFrame.height;
    this.x = tapX;
    this.y = tapY;
    this.lastGood = { x: tapX, y: tapY, framesAgo: 0 };
    this.levels = this.firstTemplates(firstFrame, levelFactors(radiusPx));
  }

  get scale(): number {
    return this.plateScale;
  }

  private firstTemplates(frame: RgbaFrame, factors: number[]): TemplateLevel[] {
    // The reference keeps room around the plate so templates can be resampled for a smaller plate.
    const pyramid = this.pyramidAround(frame, this.x, this.y, 0.25 * this.radiusPx, factors);
    return pyramid.map((image) => {
      const level = TemplateLevel.fromFirstFrame(image, this.x, this.y, this.radiusPx);
      if (level === "outside") throw new FrameInputError("tapX/tapY: the tracked disc around the tap must lie inside the frame");
      if (level === "flat") throw new FrameInputError("tapX/tapY: the image around the tap is flat; tap the plate or the sleeve end");
      return level;
    });
  }

  /** The region that holds every template position within `searchPx` of (x, y). */
  private regionAround(x: number, y: number, searchPx: number, factors: number[]): PixelRect {
    const coarse = factors[factors.length - 1];
    const reach = searchPx + this.radiusPx * this.plateScale + 3 * coarse;
    const x0 = Math.max(0, Math.floor((x - reach) / coarse) * coarse);
    const y0 = Math.max(0, Math.floor((y - reach) / coarse) * coarse);
    const x1 = Math.min(this.width, Math.ceil((x + reach) / coarse) * coarse);
    const y1 = Math.min(this.height, Math.ceil((y + reach) / coarse) * coarse);
    return { x: x0, y: y0, width: Math.max(0, x1 - x0), height: Math.max(0, y1 - y0) };
  }

  private pyramidAround(frame: RgbaFrame, x: number, y: number, searchPx: number, factors: number[]): GrayImage[] {
    return buildPyramid(grayRegion(frame, this.regionAround(x, y, searchPx, factors), factors[0]), factors.length);
  }

  /** Where the next frame is searched: around the constant-velocity guess, wider while lost. */
  private nextSearch(): { x: number; y: number; searchPx: number } {
    const radiusPx = this.radiusPx * this.plateScale;
    const searchPx = Math.min(
      TUNING.searchRadiusFraction * radiusPx * (1 + this.lostFrames),
      TUNING.maxSearchRadiusFactor * radiusPx,
    );
    return { x: this.x + this.vx, y: this.y + this.vy, searchPx };
  }

  nextRegion(): PixelRect {
    const levels = this.levels;
    if (!levels) throw new Error("bar tracker: nextRegion() called after dispose()");
    const { x, y, searchPx } = this.nextSearch();
    return this.regionAround(x, y, searchPx, levels.map((l) => l.factor));
  }

  track(frame: RgbaFrame): BarSample | null {
    const levels = this.levels;
    if (!levels) throw new Error("bar tracker: track() called after dispose()");
    if (frame.width !== this.width || frame.height !== this.height || frame.data.length !== this.width * this.height * 4) {
      throw new FrameInputError(
        `frame: expected ${this.width}x${this.height} RGBA (${this.width * this.height * 4} bytes), got ${frame.width}x${frame.height} with ${frame.data.length} bytes`,
      );
    }
    const { x: predictedX, y: predictedY, searchPx } = this.nextSearch();
    const pyramid = this.pyramidAround(frame, predictedX, predictedY, searchPx, levels.map((l) => l.factor));
    const found = this.locate(pyramid, levels, predictedX, predictedY, searchPx);
    const needed = this.lostFrames > 0 ? TUNING.reacquireScore : TUNING.keepScore;
    if (!found || found.score < needed) return this.coast(predictedX, predictedY);
    this.accept(found.x, found.y);
    if (found.score >= TUNING.updateScore && found.driftFree) this.learn(pyramid, levels, found);
    return { x: found.x, y: found.y, score: Math.max(0, Math.min(1, found.score)) };
  }

  /** Coarse search with the running (and, when lost, the first) template, then refinement per level. */
  private locate(pyramid: GrayImage[], levels: TemplateLevel[], predictedX: number, predictedY: number, searchPx: number): Found | null {
    const top = levels.length - 1;
    if (pyramid[top].width === 0 || pyramid[top].height === 0) return null;
    const radius = Math.ceil(searchPx / levels[top].factor) + 1;
    let match = levels[top].search(pyramid[top], predictedX, predictedY, radius, "running");
    if (this.lostFrames > 0) {
      const byFirst = levels[top].search(pyramid[top], predictedX, predictedY, radius, "first");
      if (byFirst && (!match || byFirst.score > match.score)) match = byFirst;
    }
    if (!match) return null;
    let frameX = toFrameX(pyramid[top], match.x);
    let frameY = toFrameY(pyramid[top], match.y);
    for (let l = top - 1; l >= 0; l--) {
      match = levels[l].search(pyramid[l], frameX, frameY, 2, "running");
      if (!match) return null;
      frameX = toFrameX(pyramid[l], match.x);
      frameY = toFrameY(pyramid[l], match.y);
    }
    return this.correctDrift(levels[0], pyramid[0], match, frameX, frameY);
  }

  /** Re-match the finest level with the first template; keep its answer when both agree. */
  private correctDrift(level: TemplateLevel, image: GrayImage, running: Match, frameX: number, frameY: number): Found {
    const byFirst = level.search(image, frameX, frameY, 2, "first");
    const gap = byFirst ? Math.hypot(byFirst.x - running.x, byFirst.y - running.y) : Infinity;
    if (!byFirst || gap > TUNING.driftTolerance || byFirst.score < TUNING.keepScore) {
      return { x: frameX, y: frameY, score: Math.max(running.score, byFirst?.score ?? -1), driftFree: false, fine: running };
    }
    return {
      x: toFrameX(image, byFirst.x),
      y: toFrameY(image, byFirst.y),
      score: Math.max(running.score, byFirst.score),
      driftFree: true,
      fine: byFirst,
    };
  }

  /** After a clear match: follow the plate's scale and blend the new look into the running templates. */
  private learn(pyramid: GrayImage[], levels: TemplateLevel[], found: Found): void {
    const probes = [1 / TUNING.scaleStep, 1, TUNING.scaleStep].map((k) =>
      levels[0].scoreAtScale(pyramid[0], Math.round(found.fine.x), Math.round(found.fine.y), this.plateScale * k),
    );
    this.plateScale *= TUNING.scaleStep ** parabolaVertex(probes[0], probes[1], probes[2]);
    levels.forEach((level, l) => {
      level.update(pyramid[l], found.x, found.y, TUNING.updateRate);
      level.rescale(this.plateScale, TUNING.rescaleTolerance);
    });
  }

  private accept(x: number, y: number): void {
    const steps = this.lastGood.framesAgo + 1;
    const stepX = (x - this.lastGood.x) / steps;
    const stepY = (y - this.lastGood.y) / steps;
    const gain = this.lostFrames > 0 ? 1 : TUNING.velocityGain;
    this.vx += gain * (stepX - this.vx);
    this.vy += gain * (stepY - this.vy);
    this.x = x;
    this.y = y;
    this.lastGood = { x, y, framesAgo: 0 };
    this.lostFrames = 0;
  }

  private coast(predictedX: number, predictedY: number): null {
    this.x = predictedX;
    this.y = predictedY;
    this.vx *= TUNING.coastDamping;
    this.vy *= TUNING.coastDamping;
    this.lostFrames += 1;
    this.lastGood.framesAgo += 1;
    return null;
  }

  dispose(): void {
    this.levels = null;
  }
}
