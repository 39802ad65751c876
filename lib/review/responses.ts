// zod schemas of the review API's answers as the browser receives them (dates arrive as ISO strings).
import { z } from "zod";
import { CUE_PRIORITIES, REVIEW_STATUSES } from "@/lib/validation/review";

const dateString = z.string();

export const cueViewSchema = z.object({ change: z.string(), drill: z.string(), priority: z.enum(CUE_PRIORITIES) });

export const shareViewSchema = z.object({ sharedAt: dateString, sharedByName: z.string().nullable() }).nullable();
export type ShareView = z.infer<typeof shareViewSchema>;

export const reviewPayloadSchema = z.object({
  review: z.object({
    status: z.enum(REVIEW_STATUSES),
    summary: z.string().nullable(),
    cues: z.array(cueViewSchema).nullable(),
    answeredAt: dateString.nullable(),
    seenAt: dateString.nullable(),
    updatedAt: dateString.nullable(),
  }),
  share: shareViewSchema,
  role: z.enum(["athlete", "coach", "admin", "teammate"]),
  canEdit: z.boolean(),
  mailed: z.boolean().optional(),
});
export type ReviewPayloadView = z.infer<typeof reviewPayloadSchema>;

export const commentViewSchema = z.object({
  id: z.string(),
  parentId: z.string().nullable(),
  authorId: z.string().nullable(),
  authorName: z.string().nullable(),
  body: z.string(),
  timeS: z.number(),
  frameIndex: z.number(),
  repNumber: z.number().nullable(),
  deleted: z.boolean(),
  edited: z.boolean(),
  createdAt: dateString,
});
export type CommentViewData = z.infer<typeof commentViewSchema>;

export const commentsResponseSchema = z.object({ comments: z.array(commentViewSchema) });
export const commentResponseSchema = z.object({ comment: commentViewSchema });
export const shareResponseSchema = z.object({ share: shareViewSchema });
