// Errors the analysis pipeline raises for input the user can fix (no scale, no person, a tap off the
// plate); each carries a code the worker and the command line turn into a clear message.

export const PIPELINE_ERROR_CODES = ["bad-options", "bad-tap", "no-scale", "no-frames", "no-person"] as const;
export type PipelineErrorCode = (typeof PIPELINE_ERROR_CODES)[number];

export class PipelineError extends Error {
  constructor(
    readonly code: PipelineErrorCode,
    message: string,
  ) {
    super(message);
    this.name = "PipelineError";
  }
}
