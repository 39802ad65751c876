// The per-frame bar positions of an analysis ({ t, bar: { x, y } | null } for every frame, the trace the
// player draws) packed as little-endian float64 triplets (t, x, y; NaN x and y where the bar was not
// found) for a bytea column. As jsonb they were most of an analysis row's bytes and most of the time
// spent saving and reading it; float64 keeps every number exactly as JavaScript had it.

export interface BarFrame {
  t: number;
  bar: { x: number; y: number } | null;
}

const VALUES_PER_FRAME = 3;
const BYTES_PER_FRAME = VALUES_PER_FRAME * Float64Array.BYTES_PER_ELEMENT;

export function packBarFrames(frames: readonly BarFrame[]): Uint8Array {
  const bytes = new Uint8Array(frames.length * BYTES_PER_FRAME);
  const view = new DataView(bytes.buffer);
  frames.forEach((frame, i) => {
    const offset = i * BYTES_PER_FRAME;
    view.setFloat64(offset, frame.t, true);
    view.setFloat64(offset + 8, frame.bar ? frame.bar.x : Number.NaN, true);
    view.setFloat64(offset + 16, frame.bar ? frame.bar.y : Number.NaN, true);
  });
  return bytes;
}

export function unpackBarFrames(bytes: Uint8Array): BarFrame[] {
  if (bytes.byteLength % BYTES_PER_FRAME !== 0) throw new RangeError(`packed bar frames must be a multiple of ${BYTES_PER_FRAME} bytes, got ${bytes.byteLength}`);
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const frames: BarFrame[] = new Array(bytes.byteLength / BYTES_PER_FRAME);
  for (let i = 0; i < frames.length; i++) {
    const offset = i * BYTES_PER_FRAME;
    const x = view.getFloat64(offset + 8, true);
    const y = view.getFloat64(offset + 16, true);
    frames[i] = { t: view.getFloat64(offset, true), bar: Number.isNaN(x) || Number.isNaN(y) ? null : { x, y } };
  }
  return frames;
}
