// Tells what a clip is from its first bytes (never from its name): ISO-BMFF (mp4, mov) by the `ftyp`
// box and its brand, Matroska/WebM by the EBML header. Shared by the upload form and the server.

export type VideoContainer = "mp4" | "mov" | "webm" | "mkv";

export type SniffResult =
  | { kind: "video"; container: VideoContainer }
  | { kind: "not-video"; reason: string };

/** How many leading bytes the checks need. */
export const SNIFF_BYTES = 64;

// ISO/IEC 14496-12 brands of still images: an `ftyp` box, but no clip to analyse.
const IMAGE_BRANDS = new Set(["heic", "heix", "heim", "heis", "hevc", "mif1", "msf1", "avif", "avis"]);
// Top-level QuickTime atoms an old .mov may start with instead of `ftyp` (Apple QuickTime File Format).
const QUICKTIME_ATOMS = new Set(["moov", "mdat", "wide", "free", "skip"]);

const EBML_MAGIC = [0x1a, 0x45, 0xdf, 0xa3];

function ascii(bytes: Uint8Array, start: number, length: number): string {
  return String.fromCharCode(...bytes.subarray(start, start + length));
}

function startsWith(bytes: Uint8Array, magic: number[]): boolean {
  return magic.every((b, i) => bytes[i] === b);
}

function sniffIsoBmff(bytes: Uint8Array): SniffResult | null {
  if (bytes.length < 12) return null;
  const box = ascii(bytes, 4, 4);
  if (box === "ftyp") {
    const brand = ascii(bytes, 8, 4);
    if (IMAGE_BRANDS.has(brand.trim())) return { kind: "not-video", reason: "This is a still image (HEIF/AVIF), not a video." };
    return { kind: "video", container: brand === "qt  " ? "mov" : "mp4" };
  }
  return QUICKTIME_ATOMS.has(box) ? { kind: "video", container: "mov" } : null;
}

function sniffEbml(bytes: Uint8Array): SniffResult | null {
  if (!startsWith(bytes, EBML_MAGIC)) return null;
  const header = ascii(bytes, 0, Math.min(bytes.length, SNIFF_BYTES));
  if (header.includes("webm")) return { kind: "video", container: "webm" };
  if (header.includes("matroska")) return { kind: "video", container: "mkv" };
  return { kind: "not-video", reason: "The file has an EBML header but is neither WebM nor Matroska." };
}

/** What the leading bytes of a file say it is. */
export function sniffVideo(bytes: Uint8Array): SniffResult {
  if (bytes.length < 12) return { kind: "not-video", reason: "The file is too short to be a video." };
  return (
    sniffIsoBmff(bytes) ??
    sniffEbml(bytes) ?? { kind: "not-video", reason: "The file is not an MP4, MOV, WebM or MKV video (checked by its content, not its name)." }
  );
}
