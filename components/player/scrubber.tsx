"use client";
// The timeline under the clip: rep bands, fault-flag marks and markup marks along the clip's length, and
// the current frame. Press or drag anywhere to move there; it is a slider for keyboard and screen readers.
import { useRef } from "react";
import type { PlayerRep } from "@/lib/player/responses";

export interface ScrubberMark {
  timeS: number;
  label: string;
}

export function Scrubber({
  durationS,
  timeS,
  reps,
  flags,
  markup,
  onSeek,
}: {
  durationS: number;
  timeS: number;
  reps: PlayerRep[];
  flags: ScrubberMark[];
  markup: ScrubberMark[];
  onSeek: (timeS: number) => void;
}) {
  const ref = useRef<HTMLDivElement>(null);
  const dragging = useRef(false);
  const pct = (t: number) => `${(100 * Math.min(durationS, Math.max(0, t))) / (durationS || 1)}%`;

  const seekAt = (clientX: number) => {
    const box = ref.current?.getBoundingClientRect();
    if (!box || box.width === 0) return;
    onSeek((Math.min(box.width, Math.max(0, clientX - box.left)) / box.width) * durationS);
  };

  return (
    <div
      ref={ref}
      role="slider"
      aria-label="Position in the clip"
      aria-valuemin={0}
      aria-valuemax={Number(durationS.toFixed(3))}
      aria-valuenow={Number(timeS.toFixed(3))}
      aria-valuetext={`${timeS.toFixed(2)} seconds`}
      className="relative h-10 w-full cursor-pointer touch-none rounded bg-sunken"
      data-testid="player-scrubber"
      onPointerDown={(event) => {
        dragging.current = true;
        event.currentTarget.setPointerCapture(event.pointerId);
        seekAt(event.clientX);
      }}
      onPointerMove={(event) => {
        if (dragging.current) seekAt(event.clientX);
      }}
      onPointerUp={() => {
        dragging.current = false;
      }}
    >
      {reps.map((rep) => (
        <div
          key={rep.repIndex}
          className="absolute inset-y-1 rounded-sm bg-action-soft ring-1 ring-line-strong"
          style={{ left: pct(rep.startS), width: `calc(${pct(rep.endS)} - ${pct(rep.startS)})` }}
          title={`Rep ${rep.repIndex}`}
        >
          <span className="nums absolute left-1 top-0.5 text-2xs font-medium text-ink-muted">{rep.repIndex}</span>
        </div>
      ))}
      {flags.map((flag, i) => (
        <span key={`f${i}`} className="absolute bottom-0.5 size-2 -translate-x-1/2 rotate-45 bg-fault" style={{ left: pct(flag.timeS) }} title={flag.label} />
      ))}
      {markup.map((mark, i) => (
        <span key={`m${i}`} className="absolute top-0 h-2 w-0.5 -translate-x-1/2 bg-caution" style={{ left: pct(mark.timeS) }} title={mark.label} />
      ))}
      <span aria-hidden="true" className="absolute inset-y-0 w-0.5 -translate-x-1/2 bg-ink" style={{ left: pct(timeS) }} />
    </div>
  );
}
