// Limits of a clip upload, shared by the form and the server so both refuse the same files.

const MIB = 1024 * 1024;

/** Largest clip accepted: a few minutes of 1080p phone video (common practice for upload limits). */
export const MAX_CLIP_BYTES = 500 * MIB;
/** Longest clip accepted: one set with set-up and rack fits well inside 3 minutes (common practice). */
export const MAX_CLIP_DURATION_S = 180;
/**
 * Size of each multipart part. S3 needs at least 5 MiB for every part but the last and at most
 * 10 000 parts (Amazon S3 multipart upload limits); 8 MiB keeps a 500 MiB clip under 64 parts.
 */
export const CLIP_PART_BYTES = 8 * MIB;
export const MAX_CLIP_PARTS = Math.ceil(MAX_CLIP_BYTES / CLIP_PART_BYTES);

export function partCountFor(sizeBytes: number): number {
  return Math.max(1, Math.ceil(sizeBytes / CLIP_PART_BYTES));
}

export function formatMegabytes(bytes: number): string {
  return `${Math.round(bytes / MIB)} MB`;
}
