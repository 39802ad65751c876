// The player's overlays and read-outs from a stored analysis: phase runs of the trace, the plumb point,
// rep jump targets, per-frame angles and bar speed.
import { describe, expect, it } from "vitest";
import { neighbourRep, phaseAt, plumbPoint, repAt, repMarkTimeS, traceRuns, type TraceRep } from "@/lib/player/trace";
import { barSpeedMps, frameAngles, skeletonSegments } from "@/lib/player/readouts";

const reps: TraceRep[] = [
  { repIndex: 1, startS: 1, endS: 3, eccentricStartS: 1, eccentricEndS: 1.8, concentricStartS: 2, concentricEndS: 3, bottomS: 1.9 },
  { repIndex: 2, startS: 4, endS: 6, eccentricStartS: 4, eccentricEndS: 5, concentricStartS: 5, concentricEndS: 6, bottomS: null },
];

describe("trace", () => {
  it("knows the phase at each time, with a pause between lowering and lifting", () => {
    expect([0.5, 1.2, 1.9, 2.5, 3.5, 5.5].map((t) => phaseAt(t, reps))).toEqual(["between", "eccentric", "pause", "concentric", "between", "concentric"]);
  });

  it("cuts the path into phase runs that join up and break at a missing bar position", () => {
    const frames = [0.5, 1, 1.5, 2, 2.5, 3.5, 4].map((t, i) => ({ t, bar: i === 5 ? null : { x: i, y: 10 * i } }));
    const runs = traceRuns(frames, reps);
    // The lone frames before rep 1 and after the gap make no line of their own.
    expect(runs.map((r) => r.phase)).toEqual(["eccentric", "concentric"]);
    // Each run starts where the previous one ended, so the line has no gaps.
    expect(runs[0].points).toEqual([0, 0, 1, 10, 2, 20]);
    expect(runs[1].points).toEqual([2, 20, 3, 30, 4, 40]);
  });

  it("hangs the plumb line from the bar at the start of rep 1", () => {
    expect(plumbPoint([{ t: 0.5, bar: { x: 1, y: 1 } }, { t: 1, bar: null }, { t: 1.1, bar: { x: 5, y: 6 } }], reps)).toEqual({ x: 5, y: 6 });
    expect(plumbPoint([{ t: 0.5, bar: null }], reps)).toBeNull();
  });

  it("finds jump targets: start, bottom (or the concentric start), lockout; and the rep before or after", () => {
    expect(["start", "bottom", "lockout"].map((m) => repMarkTimeS(reps[0], m as "start"))).toEqual([1, 1.9, 3]);
    expect(repMarkTimeS(reps[1], "bottom")).toBe(5);
    expect(repAt(2, reps)?.repIndex).toBe(1);
    expect(repAt(3.5, reps)).toBeNull();
    expect(neighbourRep(2, reps, 1)?.repIndex).toBe(2);
    expect(neighbourRep(2, reps, -1)?.repIndex).toBe(1);
    expect(neighbourRep(1, reps, -1)).toBeNull();
    expect(neighbourRep(4, reps, -1)?.repIndex).toBe(1);
    expect(neighbourRep(6, reps, 1)).toBeNull();
  });
});

describe("read-outs", () => {
  const kp = (name: string, x: number, y: number, score = 0.9) => ({ name, x, y, score });

  it("measures knee, hip and torso on the better-seen side (3-4-5 geometry, common practice)", () => {
    // Image coordinates (y down). Hip at (100, 300), shoulder 3 forward and 4 up: torso 36.87° from vertical.
    const angles = frameAngles([
      kp("left_shoulder", 130, 260),
      kp("left_hip", 100, 300),
      kp("left_knee", 100, 400),
      kp("left_ankle", 200, 400),
      kp("right_knee", 0, 0, 0.1),
    ]);
    expect(angles?.side).toBe("left");
    expect(angles?.kneeDeg).toBeCloseTo(90, 10);
    expect(angles?.torsoDeg).toBeCloseTo(36.869897646, 8);
    // Hip: between the shoulder ray (30, -40) and the knee ray (0, 100): 180° − 36.87° = 143.13°.
    expect(angles?.hipDeg).toBeCloseTo(143.130102354, 8);
  });

  it("leaves out joints seen with low confidence", () => {
    expect(frameAngles([kp("left_hip", 0, 0, 0.1), kp("left_knee", 0, 0, 0.1)])).toBeNull();
    expect(skeletonSegments([kp("left_hip", 0, 0), kp("left_knee", 0, 10), kp("left_ankle", 5, 20, 0.1)])).toEqual([[0, 0, 0, 10]]);
  });

  it("computes bar speed by central difference: 30 px in 0.1 s at 1 mm/px is 0.3 m/s", () => {
    const frames = [0, 0.025, 0.05, 0.075, 0.1].map((t, i) => ({ t, bar: { x: 0, y: 400 - 7.5 * i } }));
    expect(barSpeedMps(frames, 2, 0.001)).toBeCloseTo(0.3, 10);
    expect(barSpeedMps([{ t: 0, bar: null }, { t: 0.1, bar: { x: 0, y: 0 } }], 0, 0.001)).toBeNull();
  });
});
