// Synthetic lift tracks with known ground truth: a kinematic model of the set seen by a still
// camera, with keypoint noise, outliers, dropped frames, irregular timing and tracker drop-outs.
import type { CameraView, Lift } from "@/lib/analysis/track";
import { JOINT_NAMES, type JointName } from "@/lib/analysis/joints";
import { segmentsFor, type Vec3 } from "./body";
import { buildLiftModel, type LiftModel, type LiftState } from "./lifts";
import { Prng } from "./prng";
import { truthForReps, type RepTruth } from "./truth";

export type { RepTruth } from "./truth";

export interface SyntheticOptions {
  lift: Lift;
  seed: number;
  view?: CameraView;
  fps?: number;
  reps?: number;
  keypointSet?: "coco" | "blazepose";
  noise?: "none" | "realistic";
  paused?: boolean;
  shallowRep?: number | null;
  kneeValgusM?: { left: number; right: number };
  calibration?: "plate" | "metresPerPixel" | "athleteHeight";
  /** false: no bar position in any frame (no tap on the plate). */
  barTracked?: boolean;
  /** The athlete's stature; drawn between 1.60 and 1.92 m when absent. */
  statureM?: number;
  /** Frame width in pixels (16:9); 1920 or 1280 drawn at random when absent. */
  frameWidthPx?: 1920 | 1280 | 640;
  /** Scripted mean concentric velocity per rep (one per rep). */
  velocitiesMps?: number[];
  /** Extra forward bar travel in squat and deadlift reps (a bar-drift fault). */
  barDriftM?: number;
  /** 1-based squat reps whose hips rise ahead of the shoulders early in the drive. */
  hipsRiseEarlyReps?: number[];
  /**
   * Film only this long before the first rep and after the last (the walk-out and re-rack are cut);
   * times in the track and the truth start at the first filmed instant. The whole set when absent.
   */
  marginAroundRepsS?: number;
}

/** Plain JSON in the track v1 format (what a file on disk holds). */
export interface TrackJson {
  version: 1;
  lift: Lift;
  view: CameraView;
  fps: number;
  width: number;
  height: number;
  calibration: Record<string, unknown>;
  frames: { t: number; keypoints: { name: string; x: number; y: number; score: number }[]; bar: { x: number; y: number; score: number } | null }[];
}

export interface SyntheticSet {
  track: TrackJson;
  truth: {
    lift: Lift;
    view: CameraView;
    metresPerPixel: number;
    /** Side view: +1 when the athlete's toes (feet, on the bench) point to image right. */
    facing: 1 | -1;
    nearSide: "left" | "right";
    statureM: number;
    paused: boolean;
    reps: RepTruth[];
  };
}

const COCO: readonly JointName[] = JOINT_NAMES.filter((j) => !j.endsWith("heel") && !j.endsWith("foot_index"));
const BLAZEPOSE_EXTRA = ["left_pinky", "right_pinky", "mouth_left"]; // present in BlazePose, ignored by the engine

interface Camera {
  width: number;
  height: number;
  pxPerM: number;
  originX: number;
  groundY: number;
  facing: 1 | -1;
  view: CameraView;
}

function project(c: Camera, p: Vec3): { x: number; y: number } {
  const horizontal = c.view === "side" ? c.facing * p.x : p.z;
  return { x: c.originX + horizontal * c.pxPerM, y: c.groundY - p.y * c.pxPerM };
}

interface Noise {
  keypointSdPx: number;
  barSdPx: number;
  keypointOutlierRate: number;
  barOutlierRate: number;
  lowScoreRate: number;
  barMissingRate: number;
  dropRate: number;
  jitterFrac: number;
}

/**
 * Per-frame bar position noise: SD in pixels at 1920×1080, scaled with the image size. The
 * project's bar tracker measured 0.08 px RMS at 640×360 and 0.16 px at 1280×720 on its rendered
 * clips with motion blur, sensor noise and H.264/VP9 compression (tests/unit/tracking/
 * clip-tracking.test.ts): an error that grows with the resolution, about 0.23 px at 1080p. Real
 * footage adds lighting changes, plate wobble and heavier compression, so the range runs from
 * about that measurement to 2.5 times it (0.5–1.8 mm at the generator's scales). Outliers, lost
 * stretches and dropped frames come on top (below).
 */
const BAR_SD_AT_1080P_PX = { min: 0.2, max: 0.6 };

function noiseFor(level: "none" | "realistic", rng: Prng, k: number): Noise {
  if (level === "none") {
    return { keypointSdPx: 0, barSdPx: 0, keypointOutlierRate: 0, barOutlierRate: 0, lowScoreRate: 0, barMissingRate: 0, dropRate: 0, jitterFrac: 0 };
  }
  return {
    keypointSdPx: rng.uniform(1.5, 4) * k,
    barSdPx: rng.uniform(BAR_SD_AT_1080P_PX.min, BAR_SD_AT_1080P_PX.max) * k,
    keypointOutlierRate: 0.004,
    barOutlierRate: 0.003,
    lowScoreRate: 0.01,
    barMissingRate: 0.01,
    dropRate: 0.02,
    jitterFrac: 0.2,
  };
}

/** Frame indices kept: random single drops plus one burst of consecutive dropped frames. */
function keptFrames(rng: Prng, count: number, noise: Noise): number[] {
  const burstAt = noise.dropRate > 0 ? rng.int(Math.floor(count * 0.2), Math.floor(count * 0.8)) : -1;
  const burstLen = rng.int(3, 6);
  const kept: number[] = [];
  for (let i = 0; i < count; i++) {
    const inBurst = i >= burstAt && i < burstAt + burstLen;
    if (i === 0 || !(inBurst || rng.chance(noise.dropRate))) kept.push(i);
  }
  return kept;
}

/** Noise-free keypoints and bar in image pixels at one instant, for drawing the scene. */
export interface ScenePose {
  keypoints: Record<JointName, { x: number; y: number }>;
  bar: { x: number; y: number };
}

/** A synthetic set plus the noise-free scene behind it, for rendering a clip that matches the track. */
export interface SyntheticScene {
  set: SyntheticSet;
  durationS: number;
  /** The camera's scale at the lifter. */
  pxPerM: number;
  /** Plate radius in pixels (a 450 mm plate at the camera's scale). */
  plateRadiusPx: number;
  poseAt(tS: number): ScenePose;
}

export function generateSyntheticSet(options: SyntheticOptions): SyntheticSet {
  return generateSyntheticScene(options).set;
}

export function generateSyntheticScene(options: SyntheticOptions): SyntheticScene {
  if (options.velocitiesMps && options.velocitiesMps.length !== options.reps) {
    throw new RangeError("velocitiesMps needs one velocity per rep (and reps set)");
  }
  const rng = new Prng(options.seed);
  const view = options.view ?? "side";
  const fps = options.fps ?? rng.pick([30, 60]);
  const reps = options.reps ?? rng.int(3, 6);
  const keypointSet = options.keypointSet ?? rng.pick(["coco", "blazepose"] as const);
  const paused = options.paused ?? rng.chance(0.25);
  const shallowRep = options.shallowRep !== undefined ? options.shallowRep : options.lift !== "deadlift" && rng.chance(0.3) ? rng.int(2, reps) : null;
  const valgusSide = rng.chance(0.3) ? rng.pick(["left", "right", "both"] as const) : null;
  const big = () => rng.uniform(0.05, 0.09);
  const small = () => rng.uniform(0, 0.01);
  const kneeValgusM = options.kneeValgusM ?? {
    left: valgusSide === "left" || valgusSide === "both" ? big() : small(),
    right: valgusSide === "right" || valgusSide === "both" ? big() : small(),
  };
  const drawnStatureM = rng.uniform(1.6, 1.92);
  const statureM = options.statureM ?? drawnStatureM;
  const segments = segmentsFor(statureM);
  const model = buildLiftModel(options.lift, rng, segments, {
    reps,
    paused,
    shallowRep,
    kneeValgusM,
    velocitiesMps: options.velocitiesMps,
    barDriftM: options.barDriftM,
    hipsRiseEarlyReps: options.hipsRiseEarlyReps,
  });

  const drawnK = rng.chance(0.5) ? 1 : 2 / 3;
  const k = options.frameWidthPx ? options.frameWidthPx / 1920 : drawnK;
  const width = Math.round(1920 * k);
  const height = Math.round(1080 * k);
  const camera: Camera = {
    width,
    height,
    pxPerM: rng.uniform(340, 420) * k,
    originX: width / 2 + rng.uniform(-150, 150) * k,
    groundY: height - rng.uniform(40, 90) * k,
    facing: rng.pick([1, -1] as const),
    view,
  };
  const nearSide = rng.pick(["left", "right"] as const);
  const noise = noiseFor(options.noise ?? "realistic", rng, k);
  const swayPhase = rng.uniform(0, 2 * Math.PI);
  const barSway = (t: number) => (view === "front" ? 0.01 * Math.sin((2 * Math.PI * t) / 3 + swayPhase) : 0);

  const margin = options.marginAroundRepsS;
  const firstRep = model.reps[0];
  const lastRep = model.reps[model.reps.length - 1];
  const offsetS = margin === undefined || !firstRep ? 0 : Math.max(0, firstRep.startS - margin);
  const endS = margin === undefined || !lastRep ? model.timeline.endS : Math.min(model.timeline.endS, lastRep.endS + margin);
  const stateAt = (tS: number) => model.timeline.stateAt(offsetS + tS);

  const frames = renderFrames(model, stateAt, endS - offsetS, camera, noise, rng, {
    fps,
    keypointNames: keypointSet === "coco" ? COCO : [...JOINT_NAMES],
    extraNames: keypointSet === "blazepose" ? BLAZEPOSE_EXTRA : [],
    nearSide,
    barTracked: options.barTracked ?? true,
    barSway,
  });
  const firstBar = project(camera, { ...model.posture(stateAt(0)).bar, z: barSway(0) });
  const calibrationKind = options.calibration ?? (view === "side" ? "plate" : "metresPerPixel");
  const scaleError = 1 + (noise.barSdPx > 0 ? rng.normal(0, 0.003) : 0);
  const calibration =
    calibrationKind === "plate"
      ? { plate: { cx: firstBar.x, cy: firstBar.y, radiusPx: 0.225 * camera.pxPerM * scaleError, diameterM: 0.45 } }
      : calibrationKind === "metresPerPixel"
        ? { metresPerPixel: scaleError / camera.pxPerM }
        : { athleteHeightM: statureM };

  const set: SyntheticSet = {
    track: { version: 1, lift: options.lift, view, fps, width, height, calibration, frames },
    truth: {
      lift: options.lift,
      view,
      metresPerPixel: 1 / camera.pxPerM,
      facing: camera.facing,
      nearSide,
      statureM,
      paused,
      reps: truthForReps(model, view, barSway).map((rep) => shiftRep(rep, offsetS)),
    },
  };
  const poseAt = (tS: number): ScenePose => {
    const { pose, bar } = model.posture(stateAt(tS));
    const keypoints = Object.fromEntries(JOINT_NAMES.map((name) => [name, project(camera, pose[name])])) as ScenePose["keypoints"];
    return { keypoints, bar: project(camera, { ...bar, z: barSway(tS) }) };
  };
  return { set, durationS: endS - offsetS, pxPerM: camera.pxPerM, plateRadiusPx: 0.225 * camera.pxPerM, poseAt };
}

interface RenderOptions {
  fps: number;
  keypointNames: readonly JointName[];
  extraNames: string[];
  nearSide: "left" | "right";
  barTracked: boolean;
  barSway: (t: number) => number;
}

/** A rep's truth with its instants moved `offsetS` earlier (durations stay). */
function shiftRep(rep: RepTruth, offsetS: number): RepTruth {
  if (offsetS === 0) return rep;
  return {
    ...rep,
    startS: rep.startS - offsetS,
    endS: rep.endS - offsetS,
    eccentricStartS: rep.eccentricStartS - offsetS,
    eccentricEndS: rep.eccentricEndS - offsetS,
    concentricStartS: rep.concentricStartS - offsetS,
    concentricEndS: rep.concentricEndS - offsetS,
    bottomS: rep.bottomS - offsetS,
    stickingPointS: rep.stickingPointS === null ? null : rep.stickingPointS - offsetS,
  };
}

function renderFrames(
  model: LiftModel,
  stateAt: (tS: number) => LiftState,
  durationS: number,
  camera: Camera,
  noise: Noise,
  rng: Prng,
  o: RenderOptions,
): TrackJson["frames"] {
  const count = Math.floor(durationS * o.fps);
  const barGapAt = rng.uniform(0.2, 0.8) * durationS;
  const barGapS = noise.barMissingRate > 0 ? rng.uniform(0.08, 0.18) : 0;
  const jitter = (px: number) => rng.normal(0, px);
  const round = (v: number) => Math.round(v * 100) / 100;
  return keptFrames(rng, count, noise).map((i) => {
    const t = i === 0 ? 0 : (i + rng.uniform(-noise.jitterFrac, noise.jitterFrac)) / o.fps;
    const { pose, bar } = model.posture(stateAt(t));
    const keypoints: TrackJson["frames"][number]["keypoints"] = o.keypointNames.map((name) => {
      const far = camera.view === "side" && !name.startsWith(o.nearSide) && name !== "nose";
      const p = project(camera, pose[name]);
      const sd = noise.keypointSdPx * (far ? 2 : 1);
      const outlier = rng.chance(noise.keypointOutlierRate) ? 40 : 0;
      const lowScore = rng.chance(noise.lowScoreRate);
      const score = lowScore ? rng.uniform(0.05, 0.25) : far ? rng.uniform(0.3, 0.6) : rng.uniform(0.75, 0.98);
      return { name, x: round(p.x + jitter(sd) + jitter(outlier)), y: round(p.y + jitter(sd) + jitter(outlier)), score: round(score) };
    });
    for (const name of o.extraNames) keypoints.push({ ...keypoints[0], name });
    const barVisible = o.barTracked && !(t >= barGapAt && t < barGapAt + barGapS) && !rng.chance(noise.barMissingRate);
    const b = project(camera, { ...bar, z: o.barSway(t) });
    const jump = rng.chance(noise.barOutlierRate) ? rng.uniform(15, 60) * (rng.chance(0.5) ? 1 : -1) : 0;
    return {
      t: Math.round(t * 1e6) / 1e6,
      keypoints,
      bar: barVisible ? { x: round(b.x + jitter(noise.barSdPx) + jump), y: round(b.y + jitter(noise.barSdPx) + jump * 0.5), score: round(rng.uniform(0.7, 0.99)) } : null,
    };
  });
}
