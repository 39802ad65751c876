// Zero-mean normalised cross-correlation of a masked template against a grey image, with an
// exhaustive search in a small window and a parabolic sub-pixel peak.
import type { GrayImage } from "./pyramid";

/** Pixel offsets that make up a template's footprint (a disc, so background corners don't count). */
export interface Footprint {
  dx: Int32Array;
  dy: Int32Array;
  minDx: number;
  maxDx: number;
  minDy: number;
  maxDy: number;
}

export function discFootprint(radius: number): Footprint {
  if (!(radius >= 0.5)) throw new RangeError(`radius: expected at least 0.5 px, got ${radius}`);
  const reach = Math.floor(radius);
  const dx: number[] = [];
  const dy: number[] = [];
  for (let y = -reach; y <= reach; y++) {
    for (let x = -reach; x <= reach; x++) {
      if (x * x + y * y <= radius * radius) {
        dx.push(x);
        dy.push(y);
      }
    }
  }
  return { dx: Int32Array.from(dx), dy: Int32Array.from(dy), minDx: -reach, maxDx: reach, minDy: -reach, maxDy: reach };
}

/** Template values made zero-mean and unit-norm; null when the patch is flat (nothing to match). */
export function normaliseTemplate(values: Float32Array): Float32Array | null {
  let mean = 0;
  for (let k = 0; k < values.length; k++) mean += values[k];
  mean /= values.length;
  let energy = 0;
  for (let k = 0; k < values.length; k++) energy += (values[k] - mean) ** 2;
  // Below about a tenth of a grey level of spread the patch is noise-free flat colour.
  if (energy < 0.01 * values.length) return null;
  const norm = 1 / Math.sqrt(energy);
  const weights = new Float32Array(values.length);
  for (let k = 0; k < values.length; k++) weights[k] = (values[k] - mean) * norm;
  return weights;
}

export interface Match {
  /** Sub-pixel peak position in image coordinates. */
  x: number;
  y: number;
  /** NCC at the integer peak, -1..1. */
  score: number;
}

/** A prepared matcher for one template on images of one row stride. */
export class TemplateMatcher {
  private readonly offsets: Int32Array;

  constructor(
    readonly footprint: Footprint,
    readonly weights: Float32Array,
    readonly imageWidth: number,
  ) {
    this.offsets = new Int32Array(footprint.dx.length);
    for (let k = 0; k < this.offsets.length; k++) this.offsets[k] = footprint.dy[k] * imageWidth + footprint.dx[k];
  }

  /** NCC with the template centred at integer pixel (cx, cy); -2 when it does not fit the image. */
  scoreAt(image: GrayImage, cx: number, cy: number): number {
    const f = this.footprint;
    if (cx + f.minDx < 0 || cy + f.minDy < 0 || cx + f.maxDx >= image.width || cy + f.maxDy >= image.height) return -2;
    const data = image.data;
    const base = cy * image.width + cx;
    const off = this.offsets;
    const w = this.weights;
    const n = off.length;
    let sum = 0;
    let sumSq = 0;
    let cross = 0;
    for (let k = 0; k < n; k++) {
      const v = data[base + off[k]];
      sum += v;
      sumSq += v * v;
      cross += w[k] * v;
    }
    const variance = sumSq - (sum * sum) / n;
    // Weights sum to zero, so `cross` is already the covariance with the zero-mean patch.
    return variance > 1e-6 ? cross / Math.sqrt(variance) : 0;
  }

  /** Best match with centre within `radius` pixels (square window) of (cx, cy). */
  search(image: GrayImage, cx: number, cy: number, radius: number): Match | null {
    if (image.width !== this.imageWidth) throw new RangeError("image width differs from the one the matcher was prepared for");
    const f = this.footprint;
    const xStart = Math.max(Math.round(cx) - radius, -f.minDx);
    const xEnd = Math.min(Math.round(cx) + radius, image.width - 1 - f.maxDx);
    const yStart = Math.max(Math.round(cy) - radius, -f.minDy);
    const yEnd = Math.min(Math.round(cy) + radius, image.height - 1 - f.maxDy);
    let best = -2;
    let bx = 0;
    let by = 0;
    for (let y = yStart; y <= yEnd; y++) {
      for (let x = xStart; x <= xEnd; x++) {
        const s = this.scoreAt(image, x, y);
        if (s > best) {
          best = s;
          bx = x;
          by = y;
        }
      }
    }
    if (best <= -2) return null;
    return this.subPixel(image, bx, by, best);
  }

  private subPixel(image: GrayImage, bx: number, by: number, best: number): Match {
    const offsetX = parabolaVertex(this.scoreAt(image, bx - 1, by), best, this.scoreAt(image, bx + 1, by));
    const offsetY = parabolaVertex(this.scoreAt(image, bx, by - 1), best, this.scoreAt(image, bx, by + 1));
    return { x: bx + offsetX, y: by + offsetY, score: best };
  }
}

/** Vertex of the parabola through (-1, left), (0, centre), (1, right), clamped to half a pixel;
 * 0 when a neighbour is missing (-2) or the samples are not a peak. */
export function parabolaVertex(left: number, centre: number, right: number): number {
  if (left <= -2 || right <= -2) return 0;
  const curvature = left - 2 * centre + right;
  if (curvature >= 0) return 0;
  const offset = (left - right) / (2 * curvature);
  return Math.max(-0.5, Math.min(0.5, offset));
}
