// What the player draws over the clip besides markup: the bar trace split into runs by phase, the plumb
// line's start point, rep marks and jump targets. Pure functions of the stored analysis.

export type Phase = "eccentric" | "concentric" | "pause" | "between";

export interface TraceRep {
  repIndex: number;
  startS: number;
  endS: number;
  eccentricStartS: number | null;
  eccentricEndS: number | null;
  concentricStartS: number | null;
  concentricEndS: number | null;
  bottomS: number | null;
}

export interface TraceFrame {
  t: number;
  bar: { x: number; y: number } | null;
}

function within(t: number, from: number | null, to: number | null): boolean {
  return from !== null && to !== null && t >= from - 1e-9 && t <= to + 1e-9;
}

/** The phase at time t: inside a rep, eccentric or concentric by the stored phase times, otherwise a pause. */
export function phaseAt(t: number, reps: readonly TraceRep[]): Phase {
  const rep = reps.find((r) => t >= r.startS && t <= r.endS);
  if (!rep) return "between";
  if (within(t, rep.eccentricStartS, rep.eccentricEndS)) return "eccentric";
  if (within(t, rep.concentricStartS, rep.concentricEndS)) return "concentric";
  return "pause";
}

export interface TraceRun {
  phase: Phase;
  /** Flat [x0, y0, x1, y1, …] in video pixels, as a canvas polyline wants them. */
  points: number[];
}

/**
 * The bar's path cut into runs of one phase. Neighbouring runs share their boundary point so the line
 * has no gaps; a frame without a bar position ends the run.
 */
export function traceRuns(frames: readonly TraceFrame[], reps: readonly TraceRep[]): TraceRun[] {
  const runs: TraceRun[] = [];
  let current: TraceRun | null = null;
  let last: { x: number; y: number } | null = null;
  for (const frame of frames) {
    if (!frame.bar) {
      current = null;
      last = null;
      continue;
    }
    const phase = phaseAt(frame.t, reps);
    if (!current || current.phase !== phase) {
      current = { phase, points: last ? [last.x, last.y] : [] };
      runs.push(current);
    }
    current.points.push(frame.bar.x, frame.bar.y);
    last = frame.bar;
  }
  return runs.filter((run) => run.points.length >= 4);
}

/** The bar's start point, where the plumb line hangs: its position at the start of rep 1 (or first seen). */
export function plumbPoint(frames: readonly TraceFrame[], reps: readonly TraceRep[]): { x: number; y: number } | null {
  const firstRepS = reps[0]?.startS ?? 0;
  return frames.find((f) => f.bar && f.t >= firstRepS)?.bar ?? frames.find((f) => f.bar)?.bar ?? null;
}

export type RepMark = "start" | "bottom" | "lockout";

/**
 * The time of a rep's start, bottom (the turn between lowering and lifting) or lockout (the end of the
 * concentric). A deadlift starts from the floor, so its "bottom" is its start.
 */
export function repMarkTimeS(rep: TraceRep, mark: RepMark): number {
  if (mark === "start") return rep.startS;
  if (mark === "bottom") return rep.bottomS ?? rep.concentricStartS ?? rep.startS;
  return rep.concentricEndS ?? rep.endS;
}

/** The rep containing t, or null between reps. */
export function repAt(t: number, reps: readonly TraceRep[]): TraceRep | null {
  return reps.find((r) => t >= r.startS - 1e-9 && t <= r.endS + 1e-9) ?? null;
}

/** The rep to jump to with [ or ]: the previous or next rep start relative to t. */
export function neighbourRep(t: number, reps: readonly TraceRep[], direction: -1 | 1): TraceRep | null {
  const slack = 1e-6;
  if (direction > 0) return reps.find((r) => r.startS > t + slack) ?? null;
  const current = repAt(t, reps);
  // Inside a rep but past its start, "previous" first goes back to this rep's start.
  if (current && t > current.startS + slack) return current;
  return [...reps].reverse().find((r) => r.startS < t - slack) ?? null;
}
