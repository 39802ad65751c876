// Pixel-to-metre scale for a track: from the plate's circle, from a scale the
// caller already knows, or (widest error) from the athlete's standing height.
import type { JointName } from "./joints";
import type { Channel, UniformTrack } from "./resample";
import { type Track, TrackInputError } from "./track";

/**
 * Diameter of a full-size plate: 450 mm for the largest discs in the IWF
 * Technical and Competition Rules & Regulations (sport equipment, discs) and
 * at most 45 cm in the IPF Technical Rules (discs). Bumper plates of 10 kg and
 * more share it; smaller iron plates do not, hence the editable diameterM.
 */
export const FULL_SIZE_PLATE_DIAMETER_M = 0.45;

/**
 * Eye height and ankle height as fractions of standing height H: 0.936 H and
 * 0.039 H, from Drillis & Contini (1966) segment proportions as drawn in
 * Winter, Biomechanics and Motor Control of Human Movement, 4th ed. (2009),
 * Fig. 4.1 (values from memory).
 */
export const EYE_HEIGHT_RATIO = 0.936;
export const ANKLE_HEIGHT_RATIO = 0.039;
/** Nose keypoint taken as 0.03 H below the eyes when no eye is visible (from memory). */
export const NOSE_BELOW_EYES_RATIO = 0.03;

/** Assumed error of a fitted plate radius, in pixels (common practice: about one pixel). */
const PLATE_RADIUS_ERROR_PX = 1;
/** IWF disc diameter tolerance of ±1 mm (from memory). */
const PLATE_DIAMETER_TOLERANCE_M = 0.001;
/** Stated error of the athlete-height scale: ratio spread between people, keypoint placement, posture (our estimate, from memory). */
export const ATHLETE_HEIGHT_UNCERTAINTY_PCT = 10;
/** A standing frame: knee at least this straight and head-to-ankle line within this angle of vertical (common practice). */
const STANDING_MIN_KNEE_DEG = 160;
const STANDING_MAX_LEAN_DEG = 15;
/** Need this many standing samples; the 90th percentile of their heights is the fully upright posture. */
const MIN_STANDING_SAMPLES = 3;
const STANDING_HEIGHT_PERCENTILE = 0.9;

export interface Scale {
  metresPerPixel: number;
  method: "plate" | "scale" | "athlete-height";
  uncertaintyPct: number;
  note: string;
}

export function resolveScale(calibration: Track["calibration"], uniform?: UniformTrack): Scale {
  if ("plate" in calibration) return plateScale(calibration.plate.radiusPx, calibration.plate.diameterM);
  if ("metresPerPixel" in calibration) {
    const given = calibration.uncertaintyPct;
    return {
      metresPerPixel: calibration.metresPerPixel,
      method: "scale",
      uncertaintyPct: given ?? 0,
      note:
        given === undefined
          ? "Scale given directly; its uncertainty was not stated, so 0 % here means unknown, not exact."
          : "Scale given directly with its stated uncertainty.",
    };
  }
  if (!uniform) throw new Error("resolveScale: athlete-height calibration needs the resampled track");
  return athleteHeightScale(calibration.athleteHeightM, uniform);
}

function plateScale(radiusPx: number, diameterM: number): Scale {
  const relative = Math.hypot(PLATE_RADIUS_ERROR_PX / radiusPx, PLATE_DIAMETER_TOLERANCE_M / diameterM);
  return {
    metresPerPixel: diameterM / (2 * radiusPx),
    method: "plate",
    uncertaintyPct: 100 * relative,
    note:
      `Plate of ${(diameterM * 1000).toFixed(0)} mm across ${(2 * radiusPx).toFixed(1)} px, ` +
      `assuming ±${PLATE_RADIUS_ERROR_PX} px on the radius. Valid in the plate's plane: film square to the plate ` +
      "(a tilted plate looks like an ellipse; its long axis is the true diameter).",
  };
}

function athleteHeightScale(athleteHeightM: number, uniform: UniformTrack): Scale {
  const heightsPx = standingHeightsPx(uniform);
  if (heightsPx.length < MIN_STANDING_SAMPLES) {
    throw new TrackInputError([
      {
        path: "calibration.athleteHeightM",
        message:
          "cannot calibrate from the athlete's height: no frames show the athlete standing upright with eyes (or nose), hips, knees and ankles visible; give a plate or a scale instead",
      },
    ]);
  }
  const sorted = [...heightsPx].sort((a, b) => a - b);
  const pixelHeight = sorted[Math.min(sorted.length - 1, Math.floor(STANDING_HEIGHT_PERCENTILE * sorted.length))];
  const eyeToAnkleM = athleteHeightM * (EYE_HEIGHT_RATIO - ANKLE_HEIGHT_RATIO);
  return {
    metresPerPixel: eyeToAnkleM / pixelHeight,
    method: "athlete-height",
    uncertaintyPct: ATHLETE_HEIGHT_UNCERTAINTY_PCT,
    note:
      `Estimated from the athlete's height (${athleteHeightM.toFixed(2)} m): eye-to-ankle distance taken as ` +
      `${(EYE_HEIGHT_RATIO - ANKLE_HEIGHT_RATIO).toFixed(3)} of height (Drillis & Contini proportions in Winter 2009), ` +
      `measured as ${pixelHeight.toFixed(0)} px in standing frames. Allow ±${ATHLETE_HEIGHT_UNCERTAINTY_PCT} % or more: ` +
      "people differ from the average proportions, and the near plate is closer to the camera than the athlete's body, " +
      "so bar distances and speeds read high by roughly the ratio of the two camera distances. Use a plate for measurement.",
  };
}

type Point = { x: number; y: number };

function pointAt(channel: Channel | undefined, i: number): Point | null {
  return channel && channel.valid[i] ? { x: channel.x[i], y: channel.y[i] } : null;
}

function mean(points: (Point | null)[]): Point | null {
  const seen = points.filter((p): p is Point => p !== null);
  if (seen.length === 0) return null;
  return { x: seen.reduce((s, p) => s + p.x, 0) / seen.length, y: seen.reduce((s, p) => s + p.y, 0) / seen.length };
}

function interiorAngleDeg(a: Point, vertex: Point, c: Point): number {
  const u = { x: a.x - vertex.x, y: a.y - vertex.y };
  const v = { x: c.x - vertex.x, y: c.y - vertex.y };
  const cos = (u.x * v.x + u.y * v.y) / (Math.hypot(u.x, u.y) * Math.hypot(v.x, v.y));
  return (Math.acos(Math.max(-1, Math.min(1, cos))) * 180) / Math.PI;
}

/** Eye-level-to-ankle pixel distance in every sample where the athlete stands upright, expressed at eye level. */
function standingHeightsPx(uniform: UniformTrack): number[] {
  const joint = (name: JointName, i: number) => pointAt(uniform.joints[name], i);
  const heights: number[] = [];
  for (let i = 0; i < uniform.times.length; i++) {
    const ankle = mean([joint("left_ankle", i), joint("right_ankle", i)]);
    const eyes = mean([joint("left_eye", i), joint("right_eye", i)]);
    const head = eyes ?? joint("nose", i);
    if (!ankle || !head || !legStraight(joint, i)) continue;
    const lengthPx = Math.hypot(head.x - ankle.x, head.y - ankle.y);
    const leanDeg = (Math.atan2(Math.abs(head.x - ankle.x), ankle.y - head.y) * 180) / Math.PI;
    if (head.y >= ankle.y || leanDeg > STANDING_MAX_LEAN_DEG) continue;
    // Nose sits below eye level: scale its distance up to the eye-to-ankle span.
    const span = EYE_HEIGHT_RATIO - ANKLE_HEIGHT_RATIO;
    heights.push(eyes ? lengthPx : (lengthPx * span) / (span - NOSE_BELOW_EYES_RATIO));
  }
  return heights;
}

function legStraight(joint: (name: JointName, i: number) => Point | null, i: number): boolean {
  return (["left", "right"] as const).some((side) => {
    const hip = joint(`${side}_hip`, i);
    const knee = joint(`${side}_knee`, i);
    const ankle = joint(`${side}_ankle`, i);
    return hip !== null && knee !== null && ankle !== null && interiorAngleDeg(hip, knee, ankle) >= STANDING_MIN_KNEE_DEG;
  });
}
