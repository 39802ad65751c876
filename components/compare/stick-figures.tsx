"use client";
// Start-position (or bottom / lockout) stick figures of every compared rep laid over each other, feet on
// the same point, scaled in metres so different camera distances compare. The thin vertical is the plumb
// line through the mid-point of the ankles.
import { useState } from "react";
import { BONES, COMPARE_PHASES, type ComparePhase, type StickFigure } from "@/lib/compare/stick-figure";
import type { CompareRepView } from "@/lib/compare/types";
import { repDash, repStroke } from "./colours";

const PHASE_LABELS: Record<ComparePhase, string> = { start: "Start", bottom: "Bottom", lockout: "Lockout" };
const PAD_M = 0.15;

function bounds(figures: StickFigure[]) {
  const points = figures.flatMap((f) => Object.values(f));
  const xs = [0, ...points.map((p) => p.xM)];
  const ys = [0, ...points.map((p) => p.yM)];
  return { minX: Math.min(...xs) - PAD_M, maxX: Math.max(...xs) + PAD_M, minY: Math.min(...ys) - PAD_M, maxY: Math.max(...ys) + PAD_M };
}

export function StickFigures({ reps }: { reps: CompareRepView[] }) {
  const [phase, setPhase] = useState<ComparePhase>("start");
  const drawn = reps.map((rep, i) => ({ rep, i, figure: rep.figures?.[phase] ?? null })).filter((d) => d.figure !== null);
  const figures = drawn.map((d) => d.figure as StickFigure);
  const b = bounds(figures);
  const width = b.maxX - b.minX;
  const height = b.maxY - b.minY;

  return (
    <div className="grid gap-3">
      <div role="radiogroup" aria-label="Phase" className="inline-flex w-fit rounded border border-line-strong bg-surface p-0.5">
        {COMPARE_PHASES.map((p) => (
          <button
            key={p}
            type="button"
            role="radio"
            aria-checked={p === phase}
            onClick={() => setPhase(p)}
            className="min-h-10 min-w-16 rounded-sm px-3 text-sm font-medium text-ink-muted aria-checked:bg-action aria-checked:text-on-action"
          >
            {PHASE_LABELS[p]}
          </button>
        ))}
      </div>
      {drawn.length === 0 ? (
        <p className="text-sm text-ink-muted">No stored pose for this phase: the track is missing or the feet were not seen.</p>
      ) : (
        <svg
          data-testid="stick-figures"
          role="img"
          aria-label={`Stick figures at ${PHASE_LABELS[phase].toLowerCase()}, feet aligned`}
          viewBox={`${b.minX} ${-b.maxY} ${width} ${height}`}
          className="h-72 w-full max-w-md rounded bg-sunken"
        >
          <line x1={0} x2={0} y1={-b.maxY} y2={-b.minY} className="stroke-line-strong" strokeWidth={0.004} />
          <line x1={b.minX} x2={b.maxX} y1={0} y2={0} className="stroke-line" strokeWidth={0.004} />
          {drawn.map(({ rep, i, figure }) => (
            <g key={rep.repId} stroke={repStroke(i)} strokeWidth={0.018} strokeLinecap="round" strokeDasharray={repDash(i) ? "0.04 0.03" : undefined}>
              {BONES.map(([from, to]) => {
                const a = figure?.[from];
                const c = figure?.[to];
                return a && c ? <line key={`${from}-${to}`} x1={a.xM} y1={-a.yM} x2={c.xM} y2={-c.yM} /> : null;
              })}
            </g>
          ))}
        </svg>
      )}
      <ul className="flex flex-wrap gap-x-4 gap-y-1 text-xs text-ink-muted">
        {reps.map((rep, i) => (
          <li key={rep.repId} className="flex items-center gap-1.5">
            <svg aria-hidden="true" width="20" height="6">
              <line x1="0" x2="20" y1="3" y2="3" stroke={repStroke(i)} strokeWidth="2" strokeDasharray={repDash(i)} />
            </svg>
            {rep.shortLabel}
          </li>
        ))}
      </ul>
    </div>
  );
}
