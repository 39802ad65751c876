// Property tests (fast-check) for the analysis input: every generated valid track parses, and agrees with
// the declarative schema; every corruption of one is refused with a TrackInputError naming a field — never
// another kind of error; arbitrary JSON never makes the parsers throw anything else.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { CAMERA_VIEWS, LIFTS, MAX_IMAGE_SIDE_PX, parseTrack, trackSchema, TrackInputError } from "@/lib/analysis/track";
import { JOINT_NAMES } from "@/lib/analysis/joints";
import { saveAnalysisSchema } from "@/lib/validation/analysis";

type Json = Record<string, unknown>;
interface TrackShape extends Json {
  frames: Json[];
}

const coordinate = fc.double({ min: -1e6, max: 1e6, noNaN: true, noDefaultInfinity: true });
const score = fc.double({ min: 0, max: 1, noNaN: true });
const keypoint = fc.record({ name: fc.oneof(fc.constantFrom(...JOINT_NAMES), fc.string({ maxLength: 12 })), x: coordinate, y: coordinate, score });
const bar = fc.record({ x: coordinate, y: coordinate, score });

const calibration = fc.oneof(
  fc.record({ plate: fc.record({ cx: coordinate, cy: coordinate, radiusPx: fc.double({ min: 0.5, max: 5000, noNaN: true }), diameterM: fc.double({ min: 0.05, max: 1, noNaN: true }) }) }),
  fc.record({ metresPerPixel: fc.double({ min: 1e-6, max: 1, noNaN: true }) }),
  fc.record({ athleteHeightM: fc.double({ min: 1, max: 2.5, noNaN: true }) }),
);

/** A valid track: frames at strictly increasing times, the first with a bar so something is seen. */
const validTrack: fc.Arbitrary<TrackShape> = fc
  .record({
    lift: fc.constantFrom(...LIFTS),
    view: fc.constantFrom(...CAMERA_VIEWS),
    fps: fc.double({ min: 1, max: 1000, noNaN: true }),
    width: fc.integer({ min: 1, max: MAX_IMAGE_SIDE_PX }),
    height: fc.integer({ min: 1, max: MAX_IMAGE_SIDE_PX }),
    calibration,
    steps: fc.array(fc.double({ min: 1e-3, max: 1, noNaN: true }), { minLength: 1, maxLength: 40 }),
    start: fc.double({ min: 0, max: 100, noNaN: true }),
    contents: fc.array(fc.record({ keypoints: fc.array(keypoint, { maxLength: 20 }), bar: fc.option(bar, { nil: null }) }), { minLength: 40, maxLength: 40 }),
    firstBar: bar,
  })
  .map(({ steps, start, contents, firstBar, ...envelope }) => {
    let t = start;
    const frames = steps.map((step, i) => {
      const frame = { t, keypoints: contents[i].keypoints, bar: i === 0 ? firstBar : contents[i].bar };
      t += step;
      return frame;
    });
    return { version: 1, ...envelope, frames };
  });

const notFinite = fc.constantFrom<unknown>(Number.NaN, Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY, "1", null, undefined, {}, [], true);

/** One change that makes a valid track invalid, whatever else it holds. */
type Corruption = (track: TrackShape, pick: number, bad: unknown) => void;
const frameAt = (track: TrackShape, pick: number) => track.frames[pick % track.frames.length];
const CORRUPTIONS: Record<string, Corruption> = {
  "time not a finite number": (track, pick, bad) => void (frameAt(track, pick).t = bad),
  "negative time": (track) => void (track.frames[0].t = -0.5),
  "time going backwards": (track) => {
    if (track.frames.length < 2) track.frames.push({ ...track.frames[0] });
    track.frames[1].t = (track.frames[0].t as number) - 0.01;
  },
  "keypoint coordinate not a finite number": (track, pick, bad) => {
    const frame = frameAt(track, pick);
    frame.keypoints = [{ name: "left_knee", x: bad, y: 1, score: 0.5 }];
  },
  "keypoint score out of range": (track, pick) => {
    frameAt(track, pick).keypoints = [{ name: "left_hip", x: 1, y: 1, score: pick % 2 ? 1.5 : -0.1 }];
  },
  "keypoint name not a string": (track, pick) => {
    frameAt(track, pick).keypoints = [{ name: 7, x: 1, y: 1, score: 0.5 }];
  },
  "bar coordinate not a finite number": (track, pick, bad) => void (frameAt(track, pick).bar = { x: 1, y: bad, score: 1 }),
  "bar not an object": (track, pick) => void (frameAt(track, pick).bar = pick % 2 ? "left" : [1, 2]),
  "frame not an object": (track, pick) => void (track.frames[pick % track.frames.length] = (pick % 2 ? null : 42) as never),
  "keypoints not an array": (track, pick) => void (frameAt(track, pick).keypoints = { 0: 1 }),
  "too many keypoints": (track, pick) => void (frameAt(track, pick).keypoints = Array.from({ length: 201 }, () => ({ name: "nose", x: 1, y: 1, score: 1 }))),
  "wrong version": (track, pick) => void (track.version = pick % 2 ? 2 : "1"),
  "unknown lift": (track) => void (track.lift = "snatch"),
  "unknown view": (track) => void (track.view = "overhead"),
  "frame rate not positive or absurd": (track, pick, bad) => void (track.fps = pick % 3 === 0 ? 0 : pick % 3 === 1 ? 1001 : bad),
  "image size absurd": (track, pick) => void (track[pick % 2 ? "width" : "height"] = pick % 3 ? MAX_IMAGE_SIDE_PX + 1 : 0),
  "two calibrations": (track) => void (track.calibration = { metresPerPixel: 0.001, athleteHeightM: 1.8 }),
  "no calibration": (track) => void (track.calibration = {}),
  "plate radius not positive": (track) => void (track.calibration = { plate: { cx: 1, cy: 1, radiusPx: 0 } }),
  "no frames": (track) => void (track.frames = []),
  "frames not an array": (track) => void (track.frames = "many" as never),
  "nothing seen": (track) => void (track.frames = track.frames.map((f) => ({ ...f, bar: null, keypoints: [] }))),
};

function rejection(input: unknown): TrackInputError | "accepted" | Error {
  try {
    parseTrack(input);
    return "accepted";
  } catch (error) {
    return error as Error;
  }
}

describe("parseTrack properties", () => {
  it("accepts every valid track, as an object and as JSON text, agreeing with the declarative schema", () => {
    fc.assert(
      fc.property(validTrack, (track) => {
        const parsed = parseTrack(track);
        expect(parsed.frames).toHaveLength(track.frames.length);
        expect(parseTrack(JSON.stringify(track)).frames).toHaveLength(track.frames.length);
        expect(trackSchema.safeParse(track).success).toBe(true);
      }),
      { numRuns: 300 },
    );
  });

  it("refuses every corruption with a TrackInputError naming where, and the schema refuses it too", () => {
    fc.assert(
      fc.property(validTrack, fc.constantFrom(...Object.keys(CORRUPTIONS)), fc.nat(), notFinite, (track, name, pick, bad) => {
        const corrupted = structuredClone(track);
        CORRUPTIONS[name](corrupted, pick, bad);
        const outcome = rejection(corrupted);
        expect(outcome, name).toBeInstanceOf(TrackInputError);
        expect((outcome as TrackInputError).issues.length).toBeGreaterThan(0);
        expect((outcome as TrackInputError).message).toMatch(/^(track|version|lift|view|fps|width|height|calibration|frames)/);
        expect(trackSchema.safeParse(corrupted).success, name).toBe(false);
      }),
      { numRuns: 1000 },
    );
  });

  it("never throws anything but a TrackInputError on arbitrary values or text", () => {
    fc.assert(
      fc.property(fc.oneof(fc.anything(), fc.jsonValue(), fc.string(), fc.json()), (input) => {
        const outcome = rejection(input);
        if (outcome !== "accepted") expect(outcome).toBeInstanceOf(TrackInputError);
      }),
      { numRuns: 1000 },
    );
  });

  it("refuses more than 200 000 frames before looking at any of them", () => {
    const outcome = rejection({ version: 1, lift: "squat", view: "side", fps: 30, width: 640, height: 360, calibration: { metresPerPixel: 0.001 }, frames: new Array(200_001) });
    expect(outcome).toBeInstanceOf(TrackInputError);
    expect((outcome as Error).message).toMatch(/^frames: too many frames/);
  });
});

describe("saveAnalysisSchema properties", () => {
  it("reports arbitrary JSON as issues, never by throwing", () => {
    fc.assert(
      fc.property(fc.oneof(fc.jsonValue(), fc.record({ model: fc.jsonValue(), result: fc.jsonValue(), track: fc.jsonValue(), calibration: fc.jsonValue() })), (input) => {
        expect(saveAnalysisSchema.safeParse(input).success).toBe(false);
      }),
      { numRuns: 500 },
    );
  });
});
