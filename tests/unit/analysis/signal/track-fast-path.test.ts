// parseTrack checks the frames by hand for speed; trackSchema states the same rules with zod.
// Both must accept the same tracks, return the same data and name the same problems.
import { describe, expect, it } from "vitest";
import { parseTrack, TrackInputError, formatPath, trackSchema } from "@/lib/analysis/track";
import { Prng } from "@/tests/fixtures/synthetic/prng";

type Json = Record<string, unknown>;

function validTrack(): Json & { frames: Json[] } {
  return {
    version: 1,
    lift: "bench",
    view: "side",
    fps: 30,
    width: 1280,
    height: 720,
    calibration: { metresPerPixel: 0.002 },
    frames: Array.from({ length: 4 }, (_, i) => ({
      t: i / 30,
      keypoints: [
        { name: "left_wrist", x: 100 + i, y: 200, score: 0.9 },
        { name: "leftKnee", x: 300, y: 400 + i, score: 0.5, extra: "dropped" },
      ],
      ...(i === 2 ? {} : { bar: i === 1 ? null : { x: 600, y: 300 - i, score: 1 } }),
    })),
  };
}

const BAD_VALUES: unknown[] = [undefined, null, Number.NaN, Number.POSITIVE_INFINITY, -1, 2, "1", [], {}, true];

/** A copy of the valid track with one to three random defects in its frames. */
function broken(rng: Prng): unknown {
  const track = structuredClone(validTrack());
  for (let n = rng.int(1, 3); n > 0; n--) {
    const isObject = (v: unknown): v is Json => typeof v === "object" && v !== null && !Array.isArray(v);
    const frame = rng.pick(track.frames) as Json & { keypoints: Json[] };
    const bad = rng.pick(BAD_VALUES);
    // An earlier defect may have replaced the frame or the keypoint list itself.
    if (!isObject(frame)) continue;
    switch (rng.int(0, 6)) {
      case 0:
        frame.t = bad;
        break;
      case 1:
        frame.keypoints = bad as Json[];
        break;
      case 2:
        if (Array.isArray(frame.keypoints) && frame.keypoints.length > 0) {
          const keypoint = rng.pick(frame.keypoints);
          if (isObject(keypoint)) keypoint[rng.pick(["name", "x", "y", "score"])] = bad;
        }
        break;
      case 3:
        frame.bar = rng.chance(0.5) ? bad : { x: 1, y: bad, score: rng.pick([bad, 0.5]) };
        break;
      case 4:
        track.frames[rng.int(0, track.frames.length - 1)] = bad as Json;
        break;
      case 5:
        frame.t = rng.pick([0, 1 / 30, -0.5]);
        break;
      default:
        if (Array.isArray(frame.keypoints)) frame.keypoints[rng.int(0, frame.keypoints.length)] = bad as Json;
    }
  }
  return track;
}

/** What the schema says: its data, or its problems as parseTrack words them. */
function bySchema(input: unknown) {
  const result = trackSchema.safeParse(input);
  if (result.success) return { data: result.data };
  const issues = result.error.issues.map((i) => ({ path: formatPath(i.path), message: i.message, custom: i.code === "custom" }));
  // parseTrack checks time order and "something seen" only once every field is valid.
  const fieldIssues = issues.filter((i) => !(i.custom && i.path.startsWith("frames")));
  return { issues: (fieldIssues.length > 0 ? fieldIssues : issues).map(({ path, message }) => ({ path, message })) };
}

function byParseTrack(input: unknown) {
  try {
    return { data: parseTrack(input) };
  } catch (error) {
    if (!(error instanceof TrackInputError)) throw error;
    return { issues: error.issues };
  }
}

describe("parseTrack's hand-written frame checks", () => {
  it("return the same data as the schema for a valid track", () => {
    const track = validTrack();
    expect(byParseTrack(track)).toEqual(bySchema(track));
    expect(JSON.stringify(parseTrack(track))).toBe(JSON.stringify(trackSchema.parse(track)));
  });

  it("name the same problems as the schema, in the same order, over many broken tracks", () => {
    const rng = new Prng(11);
    let rejected = 0;
    for (let k = 0; k < 400; k++) {
      const input = broken(rng);
      const expected = bySchema(input);
      expect(byParseTrack(input)).toEqual(expected);
      if (expected.issues) rejected++;
    }
    expect(rejected).toBeGreaterThan(300);
  });

  it("report a keypoint list that is too long without looking into it, as the schema does", () => {
    const track = validTrack();
    track.frames[1].keypoints = Array.from({ length: 201 }, () => ({ name: "nose", x: "bad" }));
    expect(byParseTrack(track)).toEqual(bySchema(track));
    expect(byParseTrack(track).issues).toEqual([{ path: "frames[1].keypoints", message: "too many keypoints (more than 200)" }]);
  });
});
