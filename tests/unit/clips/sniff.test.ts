// Content sniffing of clips: containers told by their first bytes, whatever the file is called.
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { sniffVideo, SNIFF_BYTES } from "@/lib/clips/sniff";
import { ensureClip } from "@/tests/fixtures/clips/generate-clip";

const ascii = (text: string) => [...text].map((c) => c.charCodeAt(0));
/** An ISO-BMFF file starts with a box: 4-byte size, 4-byte type; `ftyp` then carries the major brand (ISO/IEC 14496-12, File Type Box; from memory). */
const ftyp = (brand: string) => new Uint8Array([0, 0, 0, 24, ...ascii("ftyp"), ...ascii(brand), 0, 0, 2, 0, ...ascii("isom"), ...ascii("iso2")]);
/** EBML magic 1A 45 DF A3, then a DocType element (RFC 8794, EBML; from memory). */
const ebml = (docType: string) => new Uint8Array([0x1a, 0x45, 0xdf, 0xa3, 0x9f, 0x42, 0x86, 0x81, 0x01, 0x42, 0x82, 0x84, ...ascii(docType), 0, 0, 0, 0]);

describe("sniffVideo", () => {
  it("reads mp4 and QuickTime brands from the ftyp box", () => {
    expect(sniffVideo(ftyp("isom"))).toEqual({ kind: "video", container: "mp4" });
    expect(sniffVideo(ftyp("mp42"))).toEqual({ kind: "video", container: "mp4" });
    expect(sniffVideo(ftyp("qt  "))).toEqual({ kind: "video", container: "mov" });
  });

  it("takes an old QuickTime file that starts with a moov or wide atom as mov", () => {
    expect(sniffVideo(new Uint8Array([0, 0, 0, 8, ...ascii("wide"), 0, 0, 0, 0]))).toEqual({ kind: "video", container: "mov" });
  });

  it("tells WebM from Matroska by the EBML DocType", () => {
    expect(sniffVideo(ebml("webm"))).toEqual({ kind: "video", container: "webm" });
    expect(sniffVideo(ebml("matroska").subarray(0, SNIFF_BYTES))).toEqual({ kind: "video", container: "mkv" });
  });

  it("refuses still images, text and short files with a reason", () => {
    expect(sniffVideo(ftyp("heic"))).toMatchObject({ kind: "not-video", reason: expect.stringMatching(/still image/) });
    expect(sniffVideo(new TextEncoder().encode("my squat notes, saved as squat.mp4"))).toMatchObject({
      kind: "not-video",
      reason: expect.stringMatching(/checked by its content, not its name/),
    });
    expect(sniffVideo(new Uint8Array([0, 0, 0]))).toMatchObject({ kind: "not-video", reason: "The file is too short to be a video." });
  });

  it("recognises real clips written by ffmpeg", async () => {
    const mp4 = readFileSync((await ensureClip({ width: 640, height: 360, durationS: 12 })).videoPath);
    const webm = readFileSync((await ensureClip({ width: 640, height: 360, durationS: 12, codec: "vp9", seed: 2 })).videoPath);
    expect(sniffVideo(mp4.subarray(0, SNIFF_BYTES))).toEqual({ kind: "video", container: "mp4" });
    expect(sniffVideo(webm.subarray(0, SNIFF_BYTES))).toEqual({ kind: "video", container: "webm" });
  });
});
