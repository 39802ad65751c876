"use client";
// The trace: the bar's path drawn over the clip, coloured by phase (eccentric, pause, concentric), with
// the plumb line — a thin vertical through the bar's start point — so drift reads as distance from it.
import { useMemo } from "react";

export interface TraceFrame {
  t: number;
  bar: { x: number; y: number } | null;
}

export interface TraceRep {
  repIndex: number;
  startS: number;
  eccentricStartS: number | null;
  eccentricEndS: number | null;
  concentricStartS: number | null;
  concentricEndS: number | null;
}

type Phase = "eccentric" | "pause" | "concentric";

const PHASE_CLASSES: Record<Phase, string> = {
  eccentric: "stroke-phase-eccentric",
  pause: "stroke-phase-pause",
  concentric: "stroke-phase-concentric",
};

function phaseSpans(reps: TraceRep[]): { phase: Phase; from: number; to: number }[] {
  return reps.flatMap((rep) => {
    const spans: { phase: Phase; from: number; to: number }[] = [];
    if (rep.eccentricStartS !== null && rep.eccentricEndS !== null) spans.push({ phase: "eccentric", from: rep.eccentricStartS, to: rep.eccentricEndS });
    if (rep.concentricStartS !== null && rep.concentricEndS !== null) spans.push({ phase: "concentric", from: rep.concentricStartS, to: rep.concentricEndS });
    // A pause is the time between the phases, whichever comes first (deadlifts start concentric).
    const ends = spans.map((s) => s.to).sort((a, b) => a - b);
    const starts = spans.map((s) => s.from).sort((a, b) => b - a);
    if (spans.length === 2 && starts[0] > ends[0]) spans.push({ phase: "pause", from: ends[0], to: starts[0] });
    return spans;
  });
}

function pointsBetween(frames: TraceFrame[], from: number, to: number): string {
  return frames
    .filter((f) => f.bar && f.t >= from - 1e-6 && f.t <= to + 1e-6)
    .map((f) => `${f.bar!.x.toFixed(1)},${f.bar!.y.toFixed(1)}`)
    .join(" ");
}

export function BarTrace({
  videoUrl,
  widthPx,
  heightPx,
  frames,
  reps,
}: {
  videoUrl: string | null;
  widthPx: number;
  heightPx: number;
  frames: TraceFrame[];
  reps: TraceRep[];
}) {
  const spans = useMemo(() => phaseSpans(reps), [reps]);
  const whole = useMemo(() => frames.filter((f) => f.bar).map((f) => `${f.bar!.x.toFixed(1)},${f.bar!.y.toFixed(1)}`).join(" "), [frames]);
  const start = useMemo(() => {
    const firstRepS = reps[0]?.startS ?? 0;
    return frames.find((f) => f.bar && f.t >= firstRepS)?.bar ?? frames.find((f) => f.bar)?.bar ?? null;
  }, [frames, reps]);
  const stroke = Math.max(2, widthPx / 320);

  return (
    <figure className="grid gap-2">
      <div className="relative w-full overflow-hidden rounded-lg bg-sunken" style={{ aspectRatio: `${widthPx} / ${heightPx}` }}>
        {videoUrl ? (
          // #t=0.001 makes the browser paint the first frame before playback.
          <video src={`${videoUrl}#t=0.001`} className="absolute inset-0 size-full object-contain" controls muted playsInline preload="auto" />
        ) : null}
        <svg
          viewBox={`0 0 ${widthPx} ${heightPx}`}
          preserveAspectRatio="xMidYMid meet"
          className="pointer-events-none absolute inset-0 size-full"
          role="img"
          aria-label="Bar path over the clip, coloured by phase, with a vertical line through the start point"
          data-testid="bar-trace"
        >
          {start ? <line x1={start.x} y1={0} x2={start.x} y2={heightPx} className="stroke-ink-faint" strokeWidth={stroke / 2} /> : null}
          <polyline points={whole} fill="none" className="stroke-phase-pause" strokeOpacity={0.5} strokeWidth={stroke / 2} />
          {spans.map((span, i) => (
            <polyline
              key={i}
              points={pointsBetween(frames, span.from, span.to)}
              fill="none"
              className={PHASE_CLASSES[span.phase]}
              strokeWidth={stroke}
              strokeLinecap="round"
              strokeLinejoin="round"
            />
          ))}
          {start ? <circle cx={start.x} cy={start.y} r={stroke * 2} className="fill-surface stroke-ink" strokeWidth={stroke / 2} /> : null}
        </svg>
      </div>
      <figcaption className="flex flex-wrap gap-x-4 gap-y-1 text-xs text-ink-muted">
        <Legend className="bg-phase-eccentric" label="Eccentric (lowering)" />
        <Legend className="bg-phase-concentric" label="Concentric (lifting)" />
        <Legend className="bg-phase-pause" label="Pause" />
        <Legend className="bg-ink-faint" label="Plumb line through the start point" />
      </figcaption>
    </figure>
  );
}

function Legend({ className, label }: { className: string; label: string }) {
  return (
    <span className="inline-flex items-center gap-1.5">
      <span aria-hidden="true" className={`inline-block h-1 w-4 rounded-full ${className}`} />
      {label}
    </span>
  );
}
