// One pyramid level of the bar template: the first frame's appearance (resampled for the current
// plate scale) and a running template that follows slow changes in appearance.
import { discFootprint, normaliseTemplate, TemplateMatcher, type Footprint, type Match } from "./ncc";
import { sampleGray, toImageX, toImageY, type GrayImage } from "./pyramid";

export class TemplateLevel {
  private footprint: Footprint;
  private footprintScale = 1;
  private firstWeights: Float32Array;
  private running: Float32Array;
  private runningWeights: Float32Array;

  private constructor(
    readonly factor: number,
    private readonly reference: GrayImage,
    private readonly refX: number,
    private readonly refY: number,
    /** Template radius at scale 1, in this level's pixels. */
    private readonly baseRadius: number,
    values: Float32Array,
    weights: Float32Array,
  ) {
    this.footprint = discFootprint(baseRadius);
    this.firstWeights = weights;
    this.running = values;
    this.runningWeights = weights;
  }

  /** Template from the first frame's pyramid level, or why there is none (disc outside the image, flat patch). */
  static fromFirstFrame(
    reference: GrayImage,
    tapX: number,
    tapY: number,
    radiusPx: number,
  ): TemplateLevel | "outside" | "flat" {
    const refX = toImageX(reference, tapX);
    const refY = toImageY(reference, tapY);
    const baseRadius = radiusPx / reference.factor;
    const values = sampleScaled(reference, discFootprint(baseRadius), refX, refY, 1);
    if (!values) return "outside";
    const weights = normaliseTemplate(values);
    if (!weights) return "flat";
    return new TemplateLevel(reference.factor, reference, refX, refY, baseRadius, values, weights);
  }

  /** Best match of the running (or first) template within `radius` level pixels of a frame position. */
  search(image: GrayImage, frameX: number, frameY: number, radius: number, template: "running" | "first"): Match | null {
    const weights = template === "running" ? this.runningWeights : this.firstWeights;
    return new TemplateMatcher(this.footprint, weights, image.width).search(image, toImageX(image, frameX), toImageY(image, frameY), radius);
  }

  /** Best NCC within one pixel of an image position for the first frame's appearance at `scale`. */
  scoreAtScale(image: GrayImage, x: number, y: number, scale: number): number {
    const values = sampleScaled(this.reference, this.footprint, this.refX, this.refY, scale);
    const weights = values && normaliseTemplate(values);
    if (!weights) return -2;
    return new TemplateMatcher(this.footprint, weights, image.width).search(image, x, y, 1)?.score ?? -2;
  }

  /** Blends the patch at a frame position into the running template. */
  update(image: GrayImage, frameX: number, frameY: number, rate: number): void {
    const fresh = sampleScaled(image, this.footprint, toImageX(image, frameX), toImageY(image, frameY), 1);
    if (!fresh) return;
    const blended = new Float32Array(fresh.length);
    for (let k = 0; k < fresh.length; k++) blended[k] = (1 - rate) * this.running[k] + rate * fresh[k];
    const weights = normaliseTemplate(blended);
    if (!weights) return;
    this.running = blended;
    this.runningWeights = weights;
  }

  /** Resizes the footprint to the plate's new scale once it has moved by more than `tolerance`;
   * the running template restarts from the first frame's appearance at that scale. */
  rescale(scale: number, tolerance: number): void {
    if (Math.abs(scale / this.footprintScale - 1) <= tolerance) return;
    const footprint = discFootprint(this.baseRadius * scale);
    const values = sampleScaled(this.reference, footprint, this.refX, this.refY, scale);
    const weights = values && normaliseTemplate(values);
    if (!values || !weights) return;
    this.footprint = footprint;
    this.footprintScale = scale;
    this.firstWeights = weights;
    this.running = values;
    this.runningWeights = weights;
  }
}

/** Footprint values read from `image` around (cx, cy) with offsets divided by `scale`
 * (the image's content enlarged by `scale`); null when a sample falls outside. */
function sampleScaled(image: GrayImage, footprint: Footprint, cx: number, cy: number, scale: number): Float32Array | null {
  const values = new Float32Array(footprint.dx.length);
  for (let k = 0; k < values.length; k++) {
    const v = sampleGray(image, cx + footprint.dx[k] / scale, cy + footprint.dy[k] / scale);
    if (Number.isNaN(v)) return null;
    values[k] = v;
  }
  return values;
}
