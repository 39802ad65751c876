// Request schemas for a set's clip: starting a multipart upload, presigning its parts, listing what
// arrived (to resume), completing and aborting it.
import { z } from "zod";
import { MAX_CLIP_BYTES, MAX_CLIP_PARTS, formatMegabytes } from "@/lib/clips/limits";

const uploadIdSchema = z
  .string({ error: "The upload id is missing." })
  .min(1, { error: "The upload id is missing." })
  .max(1024, { error: "Not a valid upload id." });

const partNumberSchema = z
  .number({ error: "A part number is a whole number." })
  .int({ error: "A part number is a whole number." })
  .min(1, { error: "Part numbers start at 1." })
  .max(MAX_CLIP_PARTS, { error: `A clip has at most ${MAX_CLIP_PARTS} parts.` });

export const startClipUploadSchema = z.object({
  sizeBytes: z
    .number({ error: "The clip's size in bytes is required." })
    .int({ error: "The clip's size is a whole number of bytes." })
    .positive({ error: "The clip is empty." })
    .max(MAX_CLIP_BYTES, { error: `The clip is larger than ${formatMegabytes(MAX_CLIP_BYTES)}. Trim it to the set and try again.` }),
  /** What the browser calls the file; informational only, the server checks the content itself. */
  contentType: z.string().max(200).default("application/octet-stream"),
  fileName: z.string().max(255).nullable().default(null),
});
export type StartClipUploadData = z.output<typeof startClipUploadSchema>;

export const presignPartsSchema = z.object({
  uploadId: uploadIdSchema,
  partNumbers: z
    .array(partNumberSchema, { error: "List the part numbers to upload." })
    .min(1, { error: "List at least one part number." })
    .max(MAX_CLIP_PARTS, { error: `A clip has at most ${MAX_CLIP_PARTS} parts.` }),
});

export const uploadIdQuerySchema = z.object({ uploadId: uploadIdSchema });

export const completeClipUploadSchema = z.object({
  uploadId: uploadIdSchema,
  parts: z
    .array(
      z.object({
        partNumber: partNumberSchema,
        etag: z.string({ error: "Each part needs its ETag." }).min(1, { error: "Each part needs its ETag." }).max(200),
      }),
      { error: "List the uploaded parts." },
    )
    .min(1, { error: "List at least one uploaded part." })
    .max(MAX_CLIP_PARTS, { error: `A clip has at most ${MAX_CLIP_PARTS} parts.` })
    .refine((parts) => new Set(parts.map((p) => p.partNumber)).size === parts.length, { error: "A part is listed twice." }),
});
export type CompleteClipUploadData = z.output<typeof completeClipUploadSchema>;
