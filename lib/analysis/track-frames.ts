// The frames of a track checked by hand: a minute of video holds about 100 000 keypoints, where a
// zod schema takes tens of milliseconds. The checks and messages are the ones of track.ts's
// frameSchema (which states them declaratively); a unit test feeds both the same broken input.
import { normaliseJointName } from "./joints";

export const MAX_KEYPOINTS_PER_FRAME = 200;

/** Wording shared by the zod schema and the hand-written checks, so both report the same thing. */
export const FRAME_MESSAGES = {
  frame: "expected a frame object { t, keypoints, bar }",
  time: "a time in seconds (finite number)",
  negativeTime: "expected a time of 0 s or later",
  keypoints: "expected an array of keypoints",
  tooManyKeypoints: `too many keypoints (more than ${MAX_KEYPOINTS_PER_FRAME})`,
  keypoint: "expected a keypoint object { name, x, y, score }",
  name: "expected a keypoint name (string)",
  bar: "expected null or a bar object { x, y, score }",
  coordinate: "a finite number",
  score: "a score from 0 to 1",
} as const;

/** The message for a value that is not a finite number; `what` names what was expected. */
export function numberMessage(input: unknown, what: string): string {
  return input === undefined ? `required: ${what}` : `expected ${what}`;
}

export interface Keypoint {
  name: string;
  x: number;
  y: number;
  score: number;
}

export interface BarPoint {
  x: number;
  y: number;
  score: number;
}

export interface Frame {
  t: number;
  keypoints: Keypoint[];
  bar: BarPoint | null;
}

export interface TrackIssue {
  path: string;
  message: string;
}

/** Formats a path as `frames[12].bar.x`; the root is `track`. */
export function formatPath(path: readonly PropertyKey[]): string {
  let out = "";
  for (const key of path) {
    out += typeof key === "number" ? `[${key}]` : `${out ? "." : ""}${String(key)}`;
  }
  return out || "track";
}

const isObject = (v: unknown): v is Record<string, unknown> => typeof v === "object" && v !== null && !Array.isArray(v);
const isFiniteNumber = (v: unknown): v is number => typeof v === "number" && Number.isFinite(v);

/** Collects the problems of one frame; the paths are built only when something is wrong. */
class FrameChecker {
  constructor(
    readonly issues: TrackIssue[],
    private readonly index: number,
  ) {}

  report(where: string, message: string): void {
    this.issues.push({ path: `frames[${this.index}]${where}`, message });
  }

  number(v: unknown, where: string, what: string = FRAME_MESSAGES.coordinate): number {
    if (!isFiniteNumber(v)) this.report(where, numberMessage(v, what));
    return v as number;
  }

  score(v: unknown, where: string): number {
    if (!isFiniteNumber(v)) this.report(where, numberMessage(v, FRAME_MESSAGES.score));
    else if (v < 0 || v > 1) this.report(where, `expected ${FRAME_MESSAGES.score}`);
    return v as number;
  }

  keypoint(k: unknown, j: number): Keypoint {
    if (!isObject(k)) {
      this.report(`.keypoints[${j}]`, FRAME_MESSAGES.keypoint);
      return k as Keypoint;
    }
    const { name, x, y, score } = k;
    // Paths are only built for a keypoint with a problem: a long track has ~100 000 good ones.
    if (typeof name === "string" && isFiniteNumber(x) && isFiniteNumber(y) && isFiniteNumber(score) && score >= 0 && score <= 1) return { name, x, y, score };
    const where = `.keypoints[${j}]`;
    if (typeof name !== "string") this.report(`${where}.name`, FRAME_MESSAGES.name);
    return { name: name as string, x: this.number(x, `${where}.x`), y: this.number(y, `${where}.y`), score: this.score(score, `${where}.score`) };
  }

  bar(b: unknown): BarPoint | null {
    if (b === undefined || b === null) return null;
    if (!isObject(b)) {
      this.report(".bar", FRAME_MESSAGES.bar);
      return null;
    }
    return { x: this.number(b.x, ".bar.x"), y: this.number(b.y, ".bar.y"), score: this.score(b.score, ".bar.score") };
  }

  frame(f: unknown): Frame {
    if (!isObject(f)) {
      this.report("", FRAME_MESSAGES.frame);
      return f as Frame;
    }
    const t = this.number(f.t, ".t", FRAME_MESSAGES.time);
    if (isFiniteNumber(t) && t < 0) this.report(".t", FRAME_MESSAGES.negativeTime);
    return { t, keypoints: this.keypoints(f.keypoints), bar: this.bar(f.bar) };
  }

  keypoints(list: unknown): Keypoint[] {
    if (!Array.isArray(list)) {
      this.report(".keypoints", FRAME_MESSAGES.keypoints);
      return [];
    }
    // Like zod, a list that is too long is reported without looking at its entries.
    if (list.length > MAX_KEYPOINTS_PER_FRAME) {
      this.report(".keypoints", FRAME_MESSAGES.tooManyKeypoints);
      return [];
    }
    const out = new Array<Keypoint>(list.length);
    for (let j = 0; j < list.length; j++) out[j] = this.keypoint(list[j], j);
    return out;
  }
}

/**
 * Checks every frame and copies it with only the known fields (a missing bar becomes null),
 * adding each problem to `issues` in the order zod would report it. The copy is meaningful only
 * when no issue was added.
 */
export function parseFrames(frames: readonly unknown[], issues: TrackIssue[]): Frame[] {
  const out = new Array<Frame>(frames.length);
  for (let i = 0; i < frames.length; i++) out[i] = new FrameChecker(issues, i).frame(frames[i]);
  return out;
}

/** A problem with the frames as a whole, with its path as zod wants it. */
export interface FramesIssue {
  path: (string | number)[];
  message: string;
}

/**
 * Times must strictly increase. Unsorted frames are rejected rather than
 * sorted: out-of-order frames mean the decoder handed over frames in decode
 * order, and re-sorting would hide that bug upstream.
 */
export function timeOrderIssue(frames: readonly Frame[]): FramesIssue | null {
  for (let i = 1; i < frames.length; i++) {
    if (!(frames[i].t > frames[i - 1].t)) {
      const kind = frames[i].t === frames[i - 1].t ? "duplicate time" : "time goes backwards";
      return {
        path: ["frames", i, "t"],
        message: `${kind}: ${frames[i].t} s is not after frames[${i - 1}].t = ${frames[i - 1].t} s (frames must be in increasing time order)`,
      };
    }
  }
  return null;
}

export function nothingSeenIssue(frames: readonly Frame[]): FramesIssue | null {
  const seen = frames.some((f) => f.bar !== null || f.keypoints.some((k) => normaliseJointName(k.name) !== null));
  return seen ? null : { path: ["frames"], message: "no frame has a bar position or a recognised keypoint: there is nothing to analyse" };
}
