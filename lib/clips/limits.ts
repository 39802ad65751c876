// Limits of a clip upload, shared by the form and the server so both refuse the same files.

const MIB = 1024 * 1024;

/** Largest clip accepted: a few minutes of 1080p phone video (common practice for upload limits). */
export const MAX_CLIP_BYTES = 500 * MIB;
/** Longest clip accepted: one set with set-up and rack fits well inside 3 minutes (common practice). */
export const MAX_CLIP_DURATION_S = 180;
/** Shortest clip accepted: one rep takes more than a second on film (common practice). */
export const MIN_CLIP_DURATION_S = 1;
/** Smallest picture side accepted: below this pose detection finds no joints (its input is 192 px, MoveNet model card). */
export const MIN_CLIP_SIDE_PX = 120;
/** Largest picture side accepted: 8K UHD (7680 px, ITU-R BT.2020); phones record at most this, browsers decode no more. */
export const MAX_CLIP_SIDE_PX = 7680;
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
