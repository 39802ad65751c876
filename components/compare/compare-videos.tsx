"use client";
// The synced player: the first rep's clip leads (it has the controls); every other clip follows it, phase-
// aligned between rep start, bottom and lockout (lib/compare/sync.ts). Followers run at the rate the
// mapping needs at that moment and are re-seeked when they drift more than a frame or two.
import { useCallback, useEffect, useRef, useState } from "react";
import { syncedTime, type RepEvents } from "@/lib/compare/sync";
import { Button } from "@/components/ui/button";
import type { CompareRepView } from "@/lib/compare/types";

/** Seek a follower back into line past this drift (about two frames at 30 fps). */
const MAX_DRIFT_S = 0.07;
const RATE_STEP_S = 0.05;

function followerRate(lead: RepEvents, follow: RepEvents, t: number): number {
  const slope = (syncedTime(lead, follow, t + RATE_STEP_S) - syncedTime(lead, follow, t)) / RATE_STEP_S;
  return Math.min(4, Math.max(0.25, slope));
}

export function CompareVideos({ reps }: { reps: CompareRepView[] }) {
  const videos = useRef<(HTMLVideoElement | null)[]>([]);
  const [slow, setSlow] = useState(false);
  const frame = useRef<number | null>(null);

  const align = useCallback(
    (seek: boolean) => {
      const lead = videos.current[0];
      if (!lead) return;
      const t = lead.currentTime;
      reps.slice(1).forEach((rep, i) => {
        const follower = videos.current[i + 1];
        if (!follower || follower.readyState < 1) return;
        const target = Math.max(0, syncedTime(reps[0].events, rep.events, t));
        if (seek || Math.abs(follower.currentTime - target) > MAX_DRIFT_S) follower.currentTime = target;
        follower.playbackRate = lead.playbackRate * followerRate(reps[0].events, rep.events, t);
      });
    },
    [reps],
  );

  useEffect(() => {
    const lead = videos.current[0];
    if (!lead) return;
    const followers = () => videos.current.slice(1).filter((v): v is HTMLVideoElement => v !== null);
    const tick = () => {
      align(false);
      frame.current = requestAnimationFrame(tick);
    };
    const onPlay = () => {
      align(true);
      for (const f of followers()) void f.play().catch(() => undefined);
      frame.current ??= requestAnimationFrame(tick);
    };
    const onPause = () => {
      for (const f of followers()) f.pause();
      if (frame.current !== null) cancelAnimationFrame(frame.current);
      frame.current = null;
      align(true);
    };
    const onSeeked = () => align(true);
    lead.addEventListener("play", onPlay);
    lead.addEventListener("pause", onPause);
    lead.addEventListener("seeked", onSeeked);
    return () => {
      lead.removeEventListener("play", onPlay);
      lead.removeEventListener("pause", onPause);
      lead.removeEventListener("seeked", onSeeked);
      if (frame.current !== null) cancelAnimationFrame(frame.current);
      frame.current = null;
    };
  }, [align]);

  const jump = (which: "start" | "bottom" | "lockout") => {
    const lead = videos.current[0];
    if (!lead) return;
    const e = reps[0].events;
    lead.pause();
    // Half a second of lead-in before the start shows the set-up.
    lead.currentTime = which === "start" ? Math.max(0, e.startS - 0.5) : which === "bottom" ? (e.bottomS ?? e.startS) : e.lockoutS;
  };

  const toggleSlow = () => {
    const next = !slow;
    setSlow(next);
    const lead = videos.current[0];
    if (lead) lead.playbackRate = next ? 0.5 : 1;
    align(false);
  };

  const shown = reps.filter((r) => r.videoUrl);
  if (shown.length === 0) return <p className="text-sm text-ink-muted">None of these sets has a clip to play.</p>;

  return (
    <div className="grid gap-3">
      <div className="grid gap-3 sm:grid-cols-2">
        {reps.map((rep, i) => (
          <figure key={rep.repId} className="grid gap-1">
            {rep.videoUrl ? (
              <video
                ref={(el) => {
                  videos.current[i] = el;
                }}
                src={rep.videoUrl}
                controls={i === 0 || !reps[0].videoUrl}
                muted
                playsInline
                preload="metadata"
                onLoadedMetadata={(event) => {
                  if (i === 0) event.currentTarget.currentTime = Math.max(0, rep.events.startS - 0.5);
                  else align(true);
                }}
                className="aspect-video w-full rounded bg-sunken object-contain"
              />
            ) : (
              <div className="grid aspect-video place-items-center rounded bg-sunken text-sm text-ink-muted">No clip</div>
            )}
            <figcaption className="text-xs text-ink-muted">
              {rep.label}
              {i === 0 ? " · leads" : " · follows, phase-aligned"}
            </figcaption>
          </figure>
        ))}
      </div>
      <div className="flex flex-wrap gap-2">
        <Button variant="secondary" size="sm" onClick={() => jump("start")}>
          Rep start
        </Button>
        <Button variant="secondary" size="sm" onClick={() => jump("bottom")}>
          Bottom
        </Button>
        <Button variant="secondary" size="sm" onClick={() => jump("lockout")}>
          Lockout
        </Button>
        <Button variant="quiet" size="sm" aria-pressed={slow} onClick={toggleSlow}>
          {slow ? "Normal speed" : "Half speed"}
        </Button>
      </div>
    </div>
  );
}
