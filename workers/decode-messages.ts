// Messages between the analysis worker and the decode worker it starts (workers/decode-worker.ts),
// checked with zod on arrival like the page's messages.
import { z } from "zod";

/** Decoded frames the decode worker may have handed over and not yet seen released. */
export const DECODE_AHEAD_FRAMES = 12;

export const decodeRequestSchema = z.discriminatedUnion("type", [
  z.object({ type: z.literal("decode"), clip: z.instanceof(Blob) }),
  /** The analysis worker released this many frames in all. */
  z.object({ type: z.literal("released"), framesReleased: z.number().int().min(0) }),
]);
export type DecodeRequest = z.infer<typeof decodeRequestSchema>;

export const decodeResponseSchema = z.discriminatedUnion("type", [
  z.object({
    type: z.literal("frame"),
    /** Presentation time, seconds. */
    tS: z.number().finite(),
    rotation: z.union([z.literal(0), z.literal(90), z.literal(180), z.literal(270)]),
    flip: z.boolean(),
    frame: z.custom<VideoFrame>((value) => typeof VideoFrame !== "undefined" && value instanceof VideoFrame, { message: "expected a VideoFrame" }),
  }),
  z.object({ type: z.literal("end") }),
  z.object({ type: z.literal("error"), message: z.string() }),
]);
export type DecodeResponse = z.infer<typeof decodeResponseSchema>;
