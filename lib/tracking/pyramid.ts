// Grey, box-downscaled copies of a frame region and their 2x pyramid: the tracker reads only
// the pixels near the bar, at the coarsest resolution that still resolves the plate.
import { LUMA_B, LUMA_G, LUMA_R, type RgbaFrame } from "./frame";

/** A grey image cut from a frame: pixel (i, j) averages frame pixels
 * [originX + i*factor, originX + (i+1)*factor) x [originY + j*factor, originY + (j+1)*factor). */
export interface GrayImage {
  width: number;
  height: number;
  data: Float32Array;
  originX: number;
  originY: number;
  factor: number;
}

export interface PixelRect {
  x: number;
  y: number;
  width: number;
  height: number;
}

/** Frame coordinate of the centre of image coordinate `i` (pixel centres at integers). */
export function toFrameX(image: GrayImage, i: number): number {
  return image.originX + (i + 0.5) * image.factor - 0.5;
}

export function toFrameY(image: GrayImage, j: number): number {
  return image.originY + (j + 0.5) * image.factor - 0.5;
}

export function toImageX(image: GrayImage, x: number): number {
  return (x + 0.5 - image.originX) / image.factor - 0.5;
}

export function toImageY(image: GrayImage, y: number): number {
  return (y + 0.5 - image.originY) / image.factor - 0.5;
}

/** Grey copy of `rect` (clipped to the frame) averaged over factor x factor blocks. */
export function grayRegion(frame: RgbaFrame, rect: PixelRect, factor: number): GrayImage {
  if (!Number.isInteger(factor) || factor < 1) throw new RangeError(`factor: expected a positive integer, got ${factor}`);
  const x0 = Math.max(0, Math.floor(rect.x));
  const y0 = Math.max(0, Math.floor(rect.y));
  const x1 = Math.min(frame.width, Math.floor(rect.x + rect.width));
  const y1 = Math.min(frame.height, Math.floor(rect.y + rect.height));
  const width = Math.max(0, Math.floor((x1 - x0) / factor));
  const height = Math.max(0, Math.floor((y1 - y0) / factor));
  const data = new Float32Array(width * height);
  const src = frame.data;
  const stride = frame.width * 4;
  const norm = 1 / (factor * factor);
  for (let j = 0; j < height; j++) {
    const outRow = j * width;
    for (let dy = 0; dy < factor; dy++) {
      let p = (y0 + j * factor + dy) * stride + x0 * 4;
      for (let i = 0; i < width; i++) {
        let sum = 0;
        for (let dx = 0; dx < factor; dx++, p += 4) {
          sum += LUMA_R * src[p] + LUMA_G * src[p + 1] + LUMA_B * src[p + 2];
        }
        data[outRow + i] += sum;
      }
    }
    for (let i = 0; i < width; i++) data[outRow + i] *= norm;
  }
  return { width, height, data, originX: x0, originY: y0, factor };
}

/** Next pyramid level: 2x2 block averages (odd last row/column dropped). */
export function halve(image: GrayImage): GrayImage {
  const width = Math.floor(image.width / 2);
  const height = Math.floor(image.height / 2);
  const data = new Float32Array(width * height);
  const src = image.data;
  const w = image.width;
  for (let j = 0; j < height; j++) {
    const r0 = 2 * j * w;
    const r1 = r0 + w;
    for (let i = 0; i < width; i++) {
      const c = 2 * i;
      data[j * width + i] = 0.25 * (src[r0 + c] + src[r0 + c + 1] + src[r1 + c] + src[r1 + c + 1]);
    }
  }
  return { width, height, data, originX: image.originX, originY: image.originY, factor: image.factor * 2 };
}

/** Levels from fine to coarse: level 0 is `base`, each next one halves the previous. */
export function buildPyramid(base: GrayImage, levels: number): GrayImage[] {
  const pyramid = [base];
  for (let l = 1; l < levels; l++) pyramid.push(halve(pyramid[l - 1]));
  return pyramid;
}

/** Bilinear sample of a grey image; NaN outside it so callers can tell missing pixels apart. */
export function sampleGray(image: GrayImage, x: number, y: number): number {
  if (x < 0 || y < 0 || x > image.width - 1 || y > image.height - 1) return Number.NaN;
  const x0 = Math.min(Math.floor(x), image.width - 2 < 0 ? 0 : image.width - 2);
  const y0 = Math.min(Math.floor(y), image.height - 2 < 0 ? 0 : image.height - 2);
  const x1 = Math.min(x0 + 1, image.width - 1);
  const y1 = Math.min(y0 + 1, image.height - 1);
  const fx = x - x0;
  const fy = y - y0;
  const d = image.data;
  const w = image.width;
  const top = d[y0 * w + x0] * (1 - fx) + d[y0 * w + x1] * fx;
  const bottom = d[y1 * w + x0] * (1 - fx) + d[y1 * w + x1] * fx;
  return top * (1 - fy) + bottom * fy;
}
