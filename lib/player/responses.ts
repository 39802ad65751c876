// zod schemas of what the player reads from the API (the set's analysis and its clip), as the browser
// receives them. Only the fields the player uses are checked; the rest pass through untouched.
import { z } from "zod";

const nullableNumber = z.number().nullable();

export const playerFlagSchema = z.object({
  code: z.string(),
  rep: z.number().nullable(),
  message: z.string(),
});

export const playerRepSchema = z.object({
  repIndex: z.number().int(),
  startS: z.number(),
  endS: z.number(),
  eccentricStartS: nullableNumber,
  eccentricEndS: nullableNumber,
  concentricStartS: nullableNumber,
  concentricEndS: nullableNumber,
  bottomS: nullableNumber,
  flags: z.array(playerFlagSchema),
});
export type PlayerRep = z.infer<typeof playerRepSchema>;

export const playerFrameSchema = z.object({
  t: z.number(),
  bar: z.object({ x: z.number(), y: z.number() }).nullable(),
});
export type PlayerFrame = z.infer<typeof playerFrameSchema>;

export const playerAnalysisResponseSchema = z.object({
  analysis: z.object({
    id: z.string(),
    scale: z.object({ metresPerPixel: z.number(), method: z.string(), uncertaintyPct: z.number() }),
    frames: z.array(playerFrameSchema).nullable(),
    reps: z.array(playerRepSchema),
    set: z.object({ flags: z.array(playerFlagSchema) }).passthrough().nullable(),
    cautions: z.array(z.string()),
  }),
  trackUrl: z.string().nullable(),
});
export type PlayerAnalysis = z.infer<typeof playerAnalysisResponseSchema>["analysis"];

export const playerClipResponseSchema = z.object({
  clip: z.object({
    status: z.string(),
    widthPx: z.number().nullable(),
    heightPx: z.number().nullable(),
    durationS: z.number().nullable(),
    url: z.string().nullable(),
    convertedUrl: z.string().nullable(),
  }),
});
export type PlayerClip = z.infer<typeof playerClipResponseSchema>["clip"];

const keypointSchema = z.object({ name: z.string(), x: z.number(), y: z.number(), score: z.number() });

/** The stored per-frame track (version 1): pose keypoints and bar for every analysed frame. */
export const playerTrackSchema = z.object({
  frames: z.array(
    z.object({
      t: z.number(),
      keypoints: z.array(keypointSchema),
      bar: z.object({ x: z.number(), y: z.number() }).nullable().optional(),
    }),
  ),
});
export type PlayerTrack = z.infer<typeof playerTrackSchema>;
export type PlayerKeypoint = z.infer<typeof keypointSchema>;
