// Public surface of the analysis pipeline: what the worker and the command line import.
export { PipelineError, PIPELINE_ERROR_CODES, type PipelineErrorCode } from "./errors";
export {
  barMarkSchema,
  parsePipelineOptions,
  pipelineOptionsSchema,
  posePlanFor,
  poseScheduleSchema,
  type BarMark,
  type PipelineOptions,
  type PoseSchedule,
} from "./options";
export type { PlateRim } from "./bar-start";
export { createPoseScheduler, MAX_POSE_INTERVAL_S, type PoseScheduler } from "./pose-scheduler";
export {
  checkPipelineOptions,
  runPipeline,
  type ClipFrame,
  type PendingFrame,
  type PipelineFrame,
  type PipelineProgress,
  type PipelineResult,
  type PipelineRuntime,
  type PipelineStats,
} from "./run-pipeline";
