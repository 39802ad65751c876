// One planned demo set, turned into what the browser would have sent: the synthetic track of its scripted
// motion and the real engine's analysis of that track, noted as demo data. Runs in the seed's worker
// threads (dev/demo/demo-analysis-worker.ts) and, for the sets that get a clip, in the seed itself.
import { analyseParsedTrack } from "@/lib/analysis/analyse";
import type { AnalysisResult } from "@/lib/analysis/result";
import { parseTrack, type Track } from "@/lib/analysis/track";
import { generateSyntheticScene, type SyntheticOptions, type SyntheticScene } from "@/lib/synthetic";
import type { DemoSetPlan } from "./demo-training";

export const DEMO_ANALYSIS_NOTE = "Demo data: scripted motion, not a real lifter.";

export function demoSyntheticOptions(plan: DemoSetPlan): SyntheticOptions {
  return {
    lift: plan.lift,
    seed: plan.motion.seed,
    view: "side",
    fps: 30,
    reps: plan.reps,
    // MoveNet's 17 keypoints, as the app's default pose model gives them.
    keypointSet: "coco",
    noise: "realistic",
    paused: plan.motion.paused,
    shallowRep: plan.motion.shallowRep,
    kneeValgusM: { left: 0.005, right: 0.005 },
    calibration: "plate",
    barTracked: true,
    statureM: plan.motion.statureM,
    frameWidthPx: 640,
    velocitiesMps: plan.motion.velocitiesMps,
    barDriftM: plan.motion.barDriftM,
    hipsRiseEarlyReps: plan.motion.hipsRiseEarlyReps,
    // Phone clips of a set start shortly before the first rep: the walk-out and re-rack are not filmed.
    marginAroundRepsS: 2,
  };
}

/** What the database needs of an analysed set (the track itself is stored only beside a clip). */
export interface AnalysedDemoSet {
  calibration: Record<string, unknown>;
  result: AnalysisResult;
}

export function analyseDemoScene(plan: DemoSetPlan, scene: SyntheticScene): AnalysedDemoSet & { track: Track } {
  const track = parseTrack(scene.set.track);
  const result = analyseParsedTrack(track, { loadKg: plan.loadKg, includeFrames: true });
  return { track, calibration: scene.set.track.calibration, result: { ...result, notes: [DEMO_ANALYSIS_NOTE, ...result.notes] } };
}

/** The analysis alone, small enough to pass back from a worker thread cheaply. */
export function analyseDemoSet(plan: DemoSetPlan): AnalysedDemoSet {
  const { calibration, result } = analyseDemoScene(plan, generateSyntheticScene(demoSyntheticOptions(plan)));
  return { calibration, result };
}
