// Frame index <-> media time on the analysis's own timestamps, including the uneven spacing phones record.
import { describe, expect, it } from "vitest";
import { clampIndex, frameAt, seekTargetFor, stepFrame } from "@/lib/player/frames";

// 30 fps frame times as a decoder reports them (1/30 s apart), with one late frame at index 3.
const TIMES = [0, 1 / 30, 2 / 30, 0.11, 4 / 30, 5 / 30];

describe("frameAt", () => {
  it("maps each timestamp to its own frame and times between frames to the earlier one", () => {
    TIMES.forEach((t, i) => expect(frameAt(t, TIMES)).toBe(i));
    expect(frameAt(0.05, TIMES)).toBe(1);
    expect(frameAt(0.1099, TIMES)).toBe(2);
  });

  it("clamps before the first and after the last frame, and tolerates float rounding on a boundary", () => {
    expect(frameAt(-1, TIMES)).toBe(0);
    expect(frameAt(99, TIMES)).toBe(5);
    expect(frameAt(2 / 30 - 1e-9, TIMES)).toBe(2);
    expect(frameAt(1, [])).toBe(-1);
  });
});

describe("seekTargetFor", () => {
  it("aims at the middle of the frame's interval, which maps back to the same frame", () => {
    expect(seekTargetFor(0, TIMES)).toBeCloseTo(1 / 60, 12);
    expect(seekTargetFor(2, TIMES)).toBeCloseTo((2 / 30 + 0.11) / 2, 12);
    TIMES.forEach((_, i) => expect(frameAt(seekTargetFor(i, TIMES), TIMES)).toBe(i));
  });

  it("gives the last frame the length of the one before it, and clamps out-of-range indexes", () => {
    expect(seekTargetFor(5, TIMES)).toBeCloseTo(5 / 30 + 1 / 60, 12);
    expect(seekTargetFor(50, TIMES)).toBe(seekTargetFor(5, TIMES));
    expect(seekTargetFor(0, [2])).toBeCloseTo(2 + 1 / 60, 12);
  });
});

describe("stepping", () => {
  it("steps and stays inside the clip", () => {
    expect(stepFrame(2, 1, 6)).toBe(3);
    expect(stepFrame(0, -1, 6)).toBe(0);
    expect(stepFrame(5, 10, 6)).toBe(5);
    expect(clampIndex(2.6, 6)).toBe(3);
    expect(clampIndex(4, 0)).toBe(0);
  });
});

describe("zoom and pan", () => {
  it("keeps the point under the pointer fixed while zooming and never leaves an empty margin", async () => {
    const { FIT, MAX_ZOOM, clampView, zoomAt } = await import("@/lib/player/view");
    const zoomed = zoomAt(FIT, { x: 200, y: 100 }, 2, 800, 400);
    expect(zoomed).toEqual({ zoom: 2, panX: -200, panY: -100 });
    // The clip point under (200, 100) is (200 - panX) / zoom = 200 before and after.
    expect((200 - zoomed.panX) / zoomed.zoom).toBe(200);
    expect(zoomAt(zoomed, { x: 0, y: 0 }, 100, 800, 400).zoom).toBe(MAX_ZOOM);
    expect(clampView({ zoom: 2, panX: 50, panY: -1000 }, 800, 400)).toEqual({ zoom: 2, panX: 0, panY: -400 });
    expect(clampView({ zoom: 0.5, panX: -10, panY: 0 }, 800, 400)).toEqual(FIT);
  });
});
