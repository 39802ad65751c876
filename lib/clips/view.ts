// What the API tells a viewer about a set's clip: its state and facts, and short-lived read URLs
// (only ever built after the caller checked the viewer's access to the set).
import "server-only";
import type { ClipState } from "@/db/queries/clips";
import { CLIP_PART_BYTES, partCountFor } from "./limits";
import { presignRead } from "./storage";

export interface ClipView {
  status: ClipState["status"];
  sizeBytes: number | null;
  container: string | null;
  codec: string | null;
  durationS: number | null;
  widthPx: number | null;
  heightPx: number | null;
  error: string | null;
  /** The upload in progress, so the browser can resume it. */
  upload: { uploadId: string; partSizeBytes: number; partCount: number } | null;
  /** The original clip. */
  url: string | null;
  /** The H.264 copy when one was made (status "ready"). */
  convertedUrl: string | null;
}

const STORED = new Set<ClipState["status"]>(["uploaded", "converting", "ready", "failed"]);

export async function clipView(clip: ClipState): Promise<ClipView> {
  const stored = STORED.has(clip.status) && clip.storageKey !== null;
  const uploading = clip.status === "uploading" && clip.uploadId !== null;
  return {
    status: clip.status,
    sizeBytes: clip.sizeBytes,
    container: clip.container,
    codec: clip.codec,
    durationS: clip.durationS,
    widthPx: clip.widthPx,
    heightPx: clip.heightPx,
    error: clip.error,
    upload:
      uploading && clip.uploadId
        ? { uploadId: clip.uploadId, partSizeBytes: CLIP_PART_BYTES, partCount: partCountFor(clip.sizeBytes ?? 0) }
        : null,
    url: stored && clip.storageKey ? await presignRead(clip.storageKey) : null,
    convertedUrl: clip.status === "ready" && clip.convertedKey ? await presignRead(clip.convertedKey) : null,
  };
}
