// Request schemas for reviews: the summary with cues, comments pinned to moments, the share toggle and the desk's query.
import { z } from "zod";
import { LIFTS, userIdSchema, uuidSchema } from "./common";

/** What the desk shows; "waiting" is a set with an analysis and no review row yet. */
export const REVIEW_STATUSES = ["waiting", "in_review", "answered", "seen"] as const;
export type ReviewStatus = (typeof REVIEW_STATUSES)[number];

/** The statuses a review row can hold. */
export const STORED_REVIEW_STATUSES = ["in_review", "answered", "seen"] as const;
export type StoredReviewStatus = (typeof STORED_REVIEW_STATUSES)[number];

export const CUE_PRIORITIES = ["high", "medium", "low"] as const;
export type CuePriority = (typeof CUE_PRIORITIES)[number];

export const reviewCueSchema = z.object({
  change: z
    .string({ error: "Say what to change." })
    .trim()
    .min(1, { error: "Say what to change." })
    .max(300, { error: "Use at most 300 characters." }),
  drill: z.string().trim().max(300, { error: "Use at most 300 characters." }).default(""),
  priority: z.enum(CUE_PRIORITIES, { error: "Choose high, medium or low." }),
});
export type ReviewCue = z.output<typeof reviewCueSchema>;

/** PUT /api/sets/[setId]/review: the draft summary and cues. */
export const reviewDraftSchema = z.object({
  summary: z.string({ error: "The summary must be text." }).max(8000, { error: "Use at most 8000 characters." }),
  cues: z.array(reviewCueSchema).max(12, { error: "At most 12 cues." }),
});
export type ReviewDraftInput = z.input<typeof reviewDraftSchema>;
export type ReviewDraft = z.output<typeof reviewDraftSchema>;

/** POST /api/sets/[setId]/review: one of the status actions. */
export const reviewActionSchema = z.object({
  action: z.enum(["start", "send", "seen"], { error: "Unknown review action." }),
});
export type ReviewAction = z.output<typeof reviewActionSchema>["action"];

const commentBodySchema = z
  .string({ error: "Write a comment." })
  .trim()
  .min(1, { error: "Write a comment." })
  .max(4000, { error: "Use at most 4000 characters." });

export const createCommentSchema = z.object({
  body: commentBodySchema,
  parentId: uuidSchema.nullable().default(null),
  timeS: z.number({ error: "The comment needs a time." }).min(0).max(3600),
  frameIndex: z.number({ error: "The comment needs a frame." }).int().min(0).max(1_000_000),
  repNumber: z.number().int().min(1).max(100).nullable().default(null),
});
export type CreateCommentInput = z.input<typeof createCommentSchema>;
export type CreateCommentData = z.output<typeof createCommentSchema>;

export const updateCommentSchema = z.object({ body: commentBodySchema });

export const shareSchema = z.object({ shared: z.boolean({ error: "Say whether the set is shared." }) });

const emptyAsUndefined = (value: unknown) => (value === "" ? undefined : value);

export const DESK_SORTS = ["oldest", "newest", "athlete", "velocityLoss", "flags"] as const;
export type DeskSort = (typeof DESK_SORTS)[number];

/** "open" (the default) is what still needs the coach: waiting or in review; "all" includes answered and seen. */
export const DESK_STATUS_FILTERS = ["open", "all", ...REVIEW_STATUSES] as const;
export type DeskStatusFilter = (typeof DESK_STATUS_FILTERS)[number];

/** The desk's URL search params (also GET /api/desk): every filter optional, bad values fall back to the default. */
export const deskQuerySchema = z.object({
  athlete: z.preprocess(emptyAsUndefined, userIdSchema.optional()).catch(undefined),
  lift: z.preprocess(emptyAsUndefined, z.enum(LIFTS).optional()).catch(undefined),
  status: z.preprocess(emptyAsUndefined, z.enum(DESK_STATUS_FILTERS).default("open")).catch("open"),
  sort: z.preprocess(emptyAsUndefined, z.enum(DESK_SORTS).default("oldest")).catch("oldest"),
});
export type DeskQuery = z.output<typeof deskQuerySchema>;
