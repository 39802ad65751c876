// Request schema of POST /api/sets/[setId]/analysis: the engine's result as the worker produced it,
// the model that saw the clip, the settings and calibration used, and the full per-frame track.
import { z } from "zod";
import { analysisResultSchema } from "@/lib/analysis/result";

export const analysisModelSchema = z.object({
  id: z.string().min(1, { error: "The model id is missing." }).max(100),
  version: z.string().min(1, { error: "The model version is missing." }).max(100),
});

export const saveAnalysisSchema = z
  .object({
    model: analysisModelSchema,
    /** Pipeline settings on the browser's side (pose schedule, bar mark, plate diameter …). */
    settings: z.record(z.string(), z.unknown()).default({}),
    /** How pixels were turned into metres, as given to the engine (plate circle, scale or athlete height). */
    calibration: z.record(z.string(), z.unknown()),
    result: analysisResultSchema,
    track: z.unknown(),
  })
  .superRefine((body, ctx) => {
    const indexes = body.result.reps.map((r) => r.index);
    const expected = indexes.map((_, i) => i + 1);
    if (indexes.some((index, i) => index !== expected[i])) {
      ctx.addIssue({ code: "custom", path: ["result", "reps"], message: "Reps must be numbered 1, 2, 3 … in order." });
    }
    if (body.result.set.repCount !== body.result.reps.length) {
      ctx.addIssue({ code: "custom", path: ["result", "set", "repCount"], message: "The rep count does not match the reps listed." });
    }
  });
export type SaveAnalysisBody = z.output<typeof saveAnalysisSchema>;
