import { describe, expect, it } from "vitest";
import { AnalysisOptionsError, analyseTrack } from "@/lib/analysis/analyse";
import { parseTrack, type Track, TrackInputError } from "@/lib/analysis/track";
import { generateSyntheticSet, type TrackJson } from "@/tests/fixtures/synthetic";

const base = () => generateSyntheticSet({ lift: "squat", seed: 11, reps: 3 }).track;
/** Input as it may arrive from outside: analyseTrack must check it even though its type says Track. */
const unchecked = (value: unknown) => analyseTrack(value as Track);

function expectTrackError(value: unknown, fragment: string) {
  try {
    unchecked(value);
  } catch (error) {
    expect(error).toBeInstanceOf(TrackInputError);
    expect((error as Error).message).toContain(fragment);
    return;
  }
  throw new Error("expected a TrackInputError");
}

describe("analyseTrack on bad input", () => {
  it("names the wrong field", () => {
    expectTrackError({ ...base(), version: 2 }, "version");
    expectTrackError({ ...base(), lift: "clean" }, "lift");
    const track: TrackJson = base();
    track.frames[3].bar = { x: Number.NaN, y: 1, score: 1 };
    expectTrackError(track, "frames[3].bar.x");
    expectTrackError("not a track", "track");
    expectTrackError({ ...base(), frames: [] }, "frames");
  });

  it("rejects frames out of time order", () => {
    const track = base();
    [track.frames[5], track.frames[6]] = [track.frames[6], track.frames[5]];
    expectTrackError(track, "frames[6].t");
  });

  it("rejects bad options with the option's name", () => {
    const track = parseTrack(base());
    expect(() => analyseTrack(track, { cutoffHz: -1 })).toThrow(AnalysisOptionsError);
    expect(() => analyseTrack(track, { cutoffHz: -1 })).toThrow(/options\.cutoffHz/);
    expect(() => analyseTrack(track, { loadKg: 0 })).toThrow(/options\.loadKg/);
    expect(() => analyseTrack(track, { thresholds: { "not-a-fault": 3 } } as never)).toThrow(AnalysisOptionsError);
    expect(() => analyseTrack(track, { colour: "teal" } as never)).toThrow(AnalysisOptionsError);
  });
});

describe("analyseTrack on thin input", () => {
  it("finds no reps in a bar that never moves, and says so", () => {
    const track = base();
    const still = { ...track, frames: track.frames.map((f) => ({ ...f, bar: f.bar && { ...f.bar, x: 500, y: 400 } })) };
    const result = unchecked(still);
    expect(result.reps).toEqual([]);
    expect(result.set.repCount).toBe(0);
    expect(result.set.bestMeanVelocityMps).toBeNull();
    expect(result.set.velocityLossPct).toBeNull();
    expect(result.cautions.join(" ")).toMatch(/No reps were found/);
  });

  it("survives a clip of three frames", () => {
    const track = base();
    const result = unchecked({ ...track, frames: track.frames.slice(0, 3) });
    expect(result.reps).toEqual([]);
  });

  it("estimates the bar from the pose when no bar was tracked, and labels it", () => {
    const { track, truth } = generateSyntheticSet({ lift: "bench", seed: 12, barTracked: false });
    const result = unchecked(track);
    expect(result.settings.barSource).toBe("pose-estimate");
    expect(result.cautions.join(" ")).toMatch(/estimated from the athlete's wrists/);
    expect(result.reps).toHaveLength(truth.reps.length);
  });

  it("warns about the wider error of a scale from the athlete's height", () => {
    const { track } = generateSyntheticSet({ lift: "deadlift", seed: 13, calibration: "athleteHeight" });
    const result = unchecked(track);
    expect(result.scale.method).toBe("athlete-height");
    expect(result.cautions.join(" ")).toMatch(/athlete's height/);
  });
});
