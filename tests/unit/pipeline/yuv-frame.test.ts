// YUV 4:2:0 to shrunk, upright RGBA, checked against Debian's ffmpeg (libswscale) converting the
// same frame: a smooth colour gradient from ffmpeg's own `gradients` source.
import { execFile } from "node:child_process";
import { beforeAll, describe, expect, it } from "vitest";
import {
  planesAsIfWhole,
  shrinkFactor,
  shrunkSize,
  sourceCrop,
  yuvToRgba,
  type QuarterTurn,
  type YuvFrame,
  type YuvMatrix,
} from "@/lib/pipeline/yuv-frame";
import type { PixelRect } from "@/lib/tracking";

async function ffmpegBytes(args: string[], input?: Uint8Array): Promise<Uint8Array> {
  const child = execFile("ffmpeg", ["-hide_banner", "-loglevel", "error", ...args, "pipe:1"], { encoding: "buffer", maxBuffer: 64 << 20 });
  const output = new Promise<Buffer>((resolve, reject) => {
    const chunks: Buffer[] = [];
    child.stdout!.on("data", (c: Buffer) => chunks.push(c));
    child.on("close", (code) => (code === 0 ? resolve(Buffer.concat(chunks)) : reject(new Error(`ffmpeg exited with ${code}`))));
  });
  if (input) child.stdin!.end(input);
  return new Uint8Array(await output);
}

const W = 330;
const H = 180;

/** Four fixed colours and a fixed seed (the source is random by default) along a fixed diagonal. */
const GRADIENT = `gradients=s=${W}x${H}:n=4:c0=0x1f3fbf:c1=0xe0a020:c2=0x30c060:c3=0xc03070:x0=0:y0=0:x1=${W}:y1=${H}:seed=3`;

/** One frame of ffmpeg's gradient source as planar yuv420p in studio range. */
function gradientYuv(): Promise<Uint8Array> {
  return ffmpegBytes(["-f", "lavfi", "-i", GRADIENT, "-frames:v", "1", "-pix_fmt", "yuv420p", "-f", "rawvideo"]);
}

/** ffmpeg's RGBA for the same YUV bytes, area-scaled, read with the given matrix and range. */
function ffmpegRgba(yuv: Uint8Array, factor: number, matrix: YuvMatrix, fullRange: boolean, transpose?: string): Promise<Uint8Array> {
  const range = fullRange ? "pc" : "tv";
  const turn = transpose ? `,${transpose}` : "";
  const filter = `scale=${W / factor}:${H / factor}:flags=area:in_color_matrix=${matrix}:in_range=${range}:out_range=pc,format=rgba${turn}`;
  return ffmpegBytes(["-f", "rawvideo", "-pix_fmt", "yuv420p", "-s", `${W}x${H}`, "-i", "pipe:0", "-vf", filter, "-f", "rawvideo"], yuv);
}

function i420(data: Uint8Array): YuvFrame {
  return {
    format: "I420",
    width: W,
    height: H,
    data,
    planes: [
      { offset: 0, stride: W },
      { offset: W * H, stride: W / 2 },
      { offset: W * H * 1.25, stride: W / 2 },
    ],
  };
}

/** The same frame as NV12 (interleaved UV) with padded rows, as hardware decoders lay it out. */
function nv12(data: Uint8Array, paddingPx: number): YuvFrame {
  const stride = W + paddingPx;
  const out = new Uint8Array(stride * H * 1.5);
  for (let y = 0; y < H; y++) out.set(data.subarray(y * W, (y + 1) * W), y * stride);
  const uvOffset = stride * H;
  for (let y = 0; y < H / 2; y++) {
    for (let x = 0; x < W / 2; x++) {
      out[uvOffset + y * stride + 2 * x] = data[W * H + y * (W / 2) + x];
      out[uvOffset + y * stride + 2 * x + 1] = data[W * H * 1.25 + y * (W / 2) + x];
    }
  }
  return { format: "NV12", width: W, height: H, data: out, planes: [{ offset: 0, stride }, { offset: uvOffset, stride }] };
}

function differences(a: Uint8Array | Uint8ClampedArray, b: Uint8Array | Uint8ClampedArray): { mean: number; max: number } {
  expect(a.length).toBe(b.length);
  let sum = 0;
  let max = 0;
  let count = 0;
  for (let i = 0; i < a.length; i++) {
    if (i % 4 === 3) continue;
    const d = Math.abs(a[i] - b[i]);
    sum += d;
    max = Math.max(max, d);
    count++;
  }
  return { mean: sum / count, max };
}

describe("yuvToRgba", () => {
  let yuv: Uint8Array;

  beforeAll(async () => {
    yuv = await gradientYuv();
    expect(yuv.length).toBe(W * H * 1.5);
  });

  // Even factors put one chroma sample per output pixel, as libswscale does: equal but for rounding.
  // For a factor of 3 libswscale resamples chroma by 1.5 and rounds differently (about one level
  // of green throughout, measured), where this code takes the nearest chroma sample.
  it.each([
    { factor: 2, matrix: "bt709" as const, fullRange: false, meanLevels: 0.1, maxLevels: 1 },
    { factor: 2, matrix: "bt601" as const, fullRange: false, meanLevels: 0.1, maxLevels: 1 },
    { factor: 2, matrix: "bt601" as const, fullRange: true, meanLevels: 0.1, maxLevels: 1 },
    { factor: 3, matrix: "bt709" as const, fullRange: false, meanLevels: 2.5, maxLevels: 16 },
  ])("matches ffmpeg: factor $factor, $matrix, full range $fullRange", async ({ factor, matrix, fullRange, meanLevels, maxLevels }) => {
    const reference = await ffmpegRgba(yuv, factor, matrix, fullRange);
    const frame = yuvToRgba(i420(yuv), { factor, rotationDeg: 0, matrix, fullRange });
    expect([frame.width, frame.height]).toEqual([W / factor, H / factor]);
    const { mean, max } = differences(frame.data, reference);
    expect(mean).toBeLessThan(meanLevels);
    expect(max).toBeLessThanOrEqual(maxLevels);
  });

  it("tells the two colour matrices apart", async () => {
    const reference = await ffmpegRgba(yuv, 2, "bt709", false);
    const wrong = yuvToRgba(i420(yuv), { factor: 2, rotationDeg: 0, matrix: "bt601", fullRange: false });
    expect(differences(wrong.data, reference).mean).toBeGreaterThan(4);
  });

  it.each([
    { rotationDeg: 90 as const, transpose: "transpose=clock" },
    { rotationDeg: 270 as const, transpose: "transpose=cclock" },
    { rotationDeg: 180 as const, transpose: "hflip,vflip" },
  ])("turns the frame upright like ffmpeg's $transpose for a $rotationDeg° rotation", async ({ rotationDeg, transpose }) => {
    const reference = await ffmpegRgba(yuv, 2, "bt709", false, transpose);
    const frame = yuvToRgba(i420(yuv), { factor: 2, rotationDeg, matrix: "bt709", fullRange: false });
    const upright = rotationDeg === 180 ? { width: W / 2, height: H / 2 } : { width: H / 2, height: W / 2 };
    expect({ width: frame.width, height: frame.height }).toEqual(upright);
    expect(shrunkSize(W, H, 2, rotationDeg)).toEqual(upright);
    expect(differences(frame.data, reference).mean).toBeLessThan(0.1);
  });

  it("reads NV12 with padded rows exactly as the same frame in I420", () => {
    const options = { factor: 2, rotationDeg: 0 as const, matrix: "bt709" as const, fullRange: false };
    expect(yuvToRgba(nv12(yuv, 14), options).data).toEqual(yuvToRgba(i420(yuv), options).data);
  });

  /** What WebCodecs' copyTo with a rect gives: the crop's planes, tightly packed. */
  function copyCrop(frame: YuvFrame, crop: PixelRect): YuvFrame {
    const rows: { plane: number; y: number; x: number; bytes: number }[] = [];
    for (let y = 0; y < crop.height; y++) rows.push({ plane: 0, y: crop.y + y, x: crop.x, bytes: crop.width });
    const chromaPlanes = frame.format === "I420" ? [1, 2] : [1];
    const chromaBytes = frame.format === "I420" ? crop.width / 2 : crop.width;
    const chromaX = frame.format === "I420" ? crop.x / 2 : crop.x;
    for (const plane of chromaPlanes) {
      for (let y = 0; y < crop.height / 2; y++) rows.push({ plane, y: crop.y / 2 + y, x: chromaX, bytes: chromaBytes });
    }
    const data = new Uint8Array(rows.reduce((n, r) => n + r.bytes, 0));
    const planes: { offset: number; stride: number }[] = [];
    let at = 0;
    for (const row of rows) {
      if (!planes[row.plane]) planes[row.plane] = { offset: at, stride: row.bytes };
      const source = frame.planes[row.plane];
      const start = source.offset + row.y * source.stride + row.x;
      data.set(frame.data.subarray(start, start + row.bytes), at);
      at += row.bytes;
    }
    return { ...frame, data, planes };
  }

  it.each([
    { format: "I420" as const, factor: 2, rotationDeg: 0 as QuarterTurn },
    { format: "I420" as const, factor: 3, rotationDeg: 90 as QuarterTurn },
    { format: "NV12" as const, factor: 3, rotationDeg: 180 as QuarterTurn },
    { format: "NV12" as const, factor: 1, rotationDeg: 270 as QuarterTurn },
    { format: "I420" as const, factor: 5, rotationDeg: 0 as QuarterTurn },
  ])(
    "converts only a region, from a cropped copy, exactly as the whole frame ($format, factor $factor, $rotationDeg°)",
    ({ format, factor, rotationDeg }) => {
      const whole = format === "I420" ? i420(yuv) : nv12(yuv, 6);
      const options = { factor, rotationDeg, matrix: "bt709" as const, fullRange: false };
      const reference = yuvToRgba(whole, options);
      // An odd-placed window reaching past the right edge, as the tracker's may near a border.
      const region = { x: Math.floor(reference.width * 0.55) + 1, y: Math.floor(reference.height * 0.3) + 1, width: reference.width, height: 13 };
      const crop = sourceCrop(W, H, region, factor, rotationDeg);
      expect(crop.x % 2).toBe(0);
      expect(crop.y % 2).toBe(0);
      expect(crop.width * crop.height).toBeLessThan((W * H) / 2);
      const copy = copyCrop(whole, crop);
      const into = new Uint8ClampedArray(reference.data.length).fill(7);
      const partial = yuvToRgba({ ...copy, planes: planesAsIfWhole(format, copy.planes, crop) }, { ...options, region, into });
      expect(partial.data).toBe(into);
      let inside = 0;
      let wrongInside = 0;
      let touchedOutside = 0;
      for (let y = 0; y < reference.height; y++) {
        for (let x = 0; x < reference.width; x++) {
          const isInside = x >= region.x && x < region.x + region.width && y >= region.y && y < region.y + region.height;
          if (isInside) inside++;
          for (let c = 0, i = (y * reference.width + x) * 4; c < 4; c++, i++) {
            if (isInside && partial.data[i] !== reference.data[i]) wrongInside++;
            if (!isInside && partial.data[i] !== 7) touchedOutside++;
          }
        }
      }
      expect({ wrongInside, touchedOutside }).toEqual({ wrongInside: 0, touchedOutside: 0 });
      expect(inside).toBeGreaterThan(0);
    },
  );

  it("rejects a factor that is not a whole number", () => {
    expect(() => yuvToRgba(i420(yuv), { factor: 1.5, rotationDeg: 0, matrix: "bt709", fullRange: false })).toThrow(/whole number/);
  });
});

describe("shrink factor", () => {
  it("keeps frames at most the given width with a whole factor", () => {
    expect(shrinkFactor(1280, 640)).toBe(2);
    expect(shrinkFactor(1920, 640)).toBe(3);
    expect(shrinkFactor(640, 640)).toBe(1);
    expect(shrinkFactor(3840, 640)).toBe(6);
    expect(shrunkSize(1080, 1920, 2, 90)).toEqual({ width: 960, height: 540 });
  });
});
