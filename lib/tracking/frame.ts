// Plain RGBA frames as the tracker receives them, and the checks that reject malformed ones.
import { z } from "zod";

export interface RgbaFrame {
  width: number;
  height: number;
  /** Row-major RGBA bytes, 4 per pixel, no row padding. */
  data: Uint8Array | Uint8ClampedArray;
}

export class FrameInputError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "FrameInputError";
  }
}

const frameShapeSchema = z.object({
  width: z.number().int().positive().max(16_384),
  height: z.number().int().positive().max(16_384),
  data: z.custom<Uint8Array | Uint8ClampedArray>(
    (value) => value instanceof Uint8Array || value instanceof Uint8ClampedArray,
    { message: "expected a Uint8Array or Uint8ClampedArray of RGBA bytes" },
  ),
});

/** Throws FrameInputError naming the field when `frame` is not a usable RGBA frame. */
export function assertRgbaFrame(frame: unknown, label = "frame"): asserts frame is RgbaFrame {
  const parsed = frameShapeSchema.safeParse(frame);
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    const field = issue.path.length > 0 ? `${label}.${issue.path.join(".")}` : label;
    throw new FrameInputError(`${field}: ${issue.message}`);
  }
  const { width, height, data } = parsed.data;
  if (data.length !== width * height * 4) {
    throw new FrameInputError(
      `${label}.data: expected ${width * height * 4} bytes for ${width}x${height} RGBA, got ${data.length}`,
    );
  }
}

/** Luma weights of ITU-R BT.601, the usual choice for grey conversion of camera video. */
export const LUMA_R = 0.299;
export const LUMA_G = 0.587;
export const LUMA_B = 0.114;

/** Grey value of one pixel, bilinearly interpolated; coordinates are clamped to the frame. */
export function sampleLuma(frame: RgbaFrame, x: number, y: number): number {
  const { width, height, data } = frame;
  const cx = Math.min(Math.max(x, 0), width - 1);
  const cy = Math.min(Math.max(y, 0), height - 1);
  const x0 = Math.min(Math.floor(cx), width - 2 < 0 ? 0 : width - 2);
  const y0 = Math.min(Math.floor(cy), height - 2 < 0 ? 0 : height - 2);
  const x1 = Math.min(x0 + 1, width - 1);
  const y1 = Math.min(y0 + 1, height - 1);
  const fx = cx - x0;
  const fy = cy - y0;
  const i00 = (y0 * width + x0) * 4;
  const i10 = (y0 * width + x1) * 4;
  const i01 = (y1 * width + x0) * 4;
  const i11 = (y1 * width + x1) * 4;
  const l00 = LUMA_R * data[i00] + LUMA_G * data[i00 + 1] + LUMA_B * data[i00 + 2];
  const l10 = LUMA_R * data[i10] + LUMA_G * data[i10 + 1] + LUMA_B * data[i10 + 2];
  const l01 = LUMA_R * data[i01] + LUMA_G * data[i01 + 1] + LUMA_B * data[i01 + 2];
  const l11 = LUMA_R * data[i11] + LUMA_G * data[i11 + 1] + LUMA_B * data[i11 + 2];
  const top = l00 * (1 - fx) + l10 * fx;
  const bottom = l01 * (1 - fx) + l11 * fx;
  return top * (1 - fy) + bottom * fy;
}
