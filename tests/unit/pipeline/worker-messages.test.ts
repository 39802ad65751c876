// The worker's message protocol: what the page may send, what the worker may answer, and the
// clear errors for malformed messages.
import { describe, expect, it } from "vitest";
import { parseTrack } from "@/lib/analysis/track";
import { parseWorkerResponse, workerRequestSchema } from "@/workers/analyse-messages";

const clip = new Blob([new Uint8Array(16)], { type: "video/mp4" });

describe("worker requests", () => {
  it("accepts an analyse request and fills in the defaults", () => {
    const request = workerRequestSchema.parse({ type: "analyse", jobId: "set-1", clip, lift: "deadlift", view: "side", bar: { kind: "tap", x: 120, y: 300 } });
    expect(request).toMatchObject({ type: "analyse", precise: false, maxFrameWidthPx: 640, bar: { kind: "tap", x: 120, y: 300 } });
  });

  it("accepts a plate circle instead of a tap, or no mark at all", () => {
    const base = { type: "analyse", jobId: "set-2", clip, lift: "bench", view: "front" };
    expect(workerRequestSchema.parse({ ...base, bar: { kind: "plate", cx: 400, cy: 220, radiusPx: 80 } }).type).toBe("analyse");
    expect(workerRequestSchema.parse(base)).toMatchObject({ bar: null });
  });

  it("accepts frames decoded on the page, and refuses pixels that do not fill the frame", () => {
    const base = { type: "analyse-frames", jobId: "set-3", lift: "squat", view: "side", source: { width: 1280, height: 720, fps: 30, durationS: 12 } };
    expect(workerRequestSchema.parse(base)).toMatchObject({ type: "analyse-frames", precise: false, bar: null });
    const frame = { type: "frame", jobId: "set-3", tS: 0.5, width: 4, height: 2, data: new Uint8ClampedArray(32) };
    expect(workerRequestSchema.parse(frame).type).toBe("frame");
    expect(workerRequestSchema.safeParse({ ...frame, data: new Uint8ClampedArray(31) }).success).toBe(false);
    expect(workerRequestSchema.safeParse({ ...frame, data: [0, 0, 0, 0] }).success).toBe(false);
    expect(workerRequestSchema.parse({ type: "frames-end", jobId: "set-3" }).type).toBe("frames-end");
    expect(parseWorkerResponse({ type: "frame-taken", jobId: "set-3", framesTaken: 3 }).type).toBe("frame-taken");
  });

  it("accepts a cancel", () => {
    expect(workerRequestSchema.parse({ type: "cancel", jobId: "set-1" })).toEqual({ type: "cancel", jobId: "set-1" });
  });

  it.each([
    [{ type: "analyse", jobId: "a", lift: "squat", view: "side" }, /clip/],
    [{ type: "analyse", jobId: "a", clip: "video.mp4", lift: "squat", view: "side" }, /File or Blob/],
    [{ type: "analyse", jobId: "a", clip, lift: "snatch", view: "side" }, /lift/],
    [{ type: "analyse", jobId: "a", clip, lift: "squat", view: "side", bar: { kind: "tap", x: -4, y: 2 } }, /bar/],
    [{ type: "analyse", jobId: "a", clip, lift: "squat", view: "side", maxFrameWidthPx: 10 }, /maxFrameWidthPx/],
    [{ type: "shutdown", jobId: "a" }, /type/],
  ])("rejects %j", (message, field) => {
    const parsed = workerRequestSchema.safeParse(message);
    expect(parsed.success).toBe(false);
    expect(JSON.stringify(parsed.error?.issues)).toMatch(field);
  });
});

describe("worker responses", () => {
  it("accepts progress and errors", () => {
    expect(
      parseWorkerResponse({ type: "progress", jobId: "j", stage: "tracking", fraction: 0.5, framesDone: 450, clipTimeS: 15, elapsedS: 12 }).type,
    ).toBe("progress");
    expect(parseWorkerResponse({ type: "error", jobId: null, code: "bad-request", message: "clip: expected a File" }).type).toBe("error");
  });

  it("rejects a result without an analysis, and unknown error codes", () => {
    const track = parseTrack({
      version: 1,
      lift: "squat",
      view: "side",
      fps: 30,
      width: 640,
      height: 360,
      calibration: { metresPerPixel: 0.005 },
      frames: [{ t: 0, keypoints: [], bar: { x: 1, y: 2, score: 1 } }],
    });
    expect(() => parseWorkerResponse({ type: "result", jobId: "j", track, barSource: "tracked", plate: null })).toThrow();
    expect(() => parseWorkerResponse({ type: "error", jobId: "j", code: "oops", message: "?" })).toThrow();
    expect(() => parseWorkerResponse({ type: "progress", jobId: "j", stage: "tracking", fraction: 2, framesDone: 1, clipTimeS: 0, elapsedS: 0 })).toThrow();
  });
});
