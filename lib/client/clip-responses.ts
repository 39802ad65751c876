// zod schemas of the clip and analysis routes' answers, as the browser receives them.
import { z } from "zod";
import { CLIP_STATUSES } from "@/lib/validation/set";

export const clipViewSchema = z.object({
  status: z.enum(CLIP_STATUSES),
  sizeBytes: z.number().nullable(),
  container: z.string().nullable(),
  codec: z.string().nullable(),
  durationS: z.number().nullable(),
  widthPx: z.number().nullable(),
  heightPx: z.number().nullable(),
  error: z.string().nullable(),
  upload: z.object({ uploadId: z.string(), partSizeBytes: z.number(), partCount: z.number() }).nullable(),
  url: z.string().nullable(),
  convertedUrl: z.string().nullable(),
});
export type ClipViewData = z.infer<typeof clipViewSchema>;
export const clipResponseSchema = z.object({ clip: clipViewSchema });

export const uploadStartedSchema = z.object({
  upload: z.object({ uploadId: z.string(), partSizeBytes: z.number().int().positive(), partCount: z.number().int().positive() }),
});
export const partUrlsSchema = z.object({ parts: z.array(z.object({ partNumber: z.number().int(), url: z.string() })) });
export const uploadedPartsSchema = z.object({
  parts: z.array(z.object({ partNumber: z.number().int(), etag: z.string(), sizeBytes: z.number() })),
});
export const createdSetSchema = z.object({ set: z.object({ id: z.string() }).loose() });
export const savedAnalysisSchema = z.object({ analysis: z.object({ id: z.string() }).loose() });
