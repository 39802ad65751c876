// Phase edges refined from the unsmoothed bar height: a short stop between two moves, estimates
// that arrive crossed, and a lost stretch of track next to an edge.
import { describe, expect, it } from "vitest";
import { refineEdges, type EdgeEstimate } from "@/lib/analysis/edges";
import { bridgeGaps } from "@/lib/analysis/gaps";

const RATE_HZ = 60;

/** A bar path of scripted moves (half-sine speed, so zero speed at both ends) and holds. */
function path(steps: ({ hold: number } | { move: number; by: number })[]): { times: number[]; y: number[]; edges: number[] } {
  const segments: { start: number; end: number; from: number; by: number }[] = [];
  const edges: number[] = [];
  let t = 0;
  let level = 0;
  for (const step of steps) {
    if ("hold" in step) {
      t += step.hold;
      continue;
    }
    segments.push({ start: t, end: t + step.move, from: level, by: step.by });
    edges.push(t, t + step.move);
    t += step.move;
    level += step.by;
  }
  const times = Array.from({ length: Math.floor(t * RATE_HZ) + 1 }, (_, i) => i / RATE_HZ);
  const y = times.map((s) => {
    let height = 0;
    for (const g of segments) {
      if (s >= g.end) height = g.from + g.by;
      else if (s > g.start) return g.from + (g.by * (1 - Math.cos((Math.PI * (s - g.start)) / (g.end - g.start)))) / 2;
      else return g.from;
    }
    return height;
  });
  return { times, y, edges };
}

describe("refineEdges", () => {
  // Tolerances of a third of a 60 Hz sample: noise-free data should pin an edge well inside one frame.
  it("finds both ends of a brief stop at the bottom even when the estimates arrive crossed", () => {
    const { times, y, edges } = path([{ hold: 1 }, { move: 1.2, by: -0.5 }, { hold: 0.06 }, { move: 0.7, by: 0.5 }, { hold: 1 }]);
    const [, lowered, driveStart, driveEnd] = edges;
    const estimates: EdgeEstimate[] = [
      { t: edges[0] + 0.03, kind: "start" },
      { t: lowered + 0.05, kind: "end" },
      { t: driveStart - 0.05, kind: "start" },
      { t: driveEnd - 0.04, kind: "end" },
    ];
    const fitted = refineEdges(times, y, estimates);
    fitted.forEach((f, i) => expect(Math.abs(f - edges[i])).toBeLessThan(0.006));
  });

  it("keeps an edge inside a lost stretch close when the bridged samples are marked", () => {
    const { times, y, edges } = path([{ hold: 1 }, { move: 0.6, by: 0.4 }, { hold: 1 }]);
    // The track lost the bar for 0.2 s up to just before the end of the move; the engine's cubic bridge stands in for it.
    const seen = times.map((t) => !(t > edges[1] - 0.22 && t < edges[1] - 0.02));
    const bridged = bridgeGaps({ x: y.map(() => 0), y: y.map((v, i) => (seen[i] ? v : 0)), valid: seen }, times, 0.25).y;
    const estimates: EdgeEstimate[] = [
      { t: edges[0] - 0.03, kind: "start" },
      { t: edges[1] + 0.04, kind: "end" },
    ];
    const fitted = refineEdges(times, bridged, estimates, seen);
    expect(Math.abs(fitted[0] - edges[0])).toBeLessThan(0.006);
    expect(Math.abs(fitted[1] - edges[1])).toBeLessThan(0.005);
  });

  it("leaves estimates alone when there are too few samples to fit", () => {
    expect(refineEdges([0, 0.1, 0.2], [0, 0, 0], [{ t: 0.1, kind: "start" }])).toEqual([0.1]);
  });
});
