"use client";
// Key frames of each rep (start, bottom, lockout) drawn from the clip onto canvases in the browser, for
// the printable report. Frames are drawn one seek at a time from a single hidden video element.
import { useEffect, useRef, useState } from "react";

export interface KeyFrameRep {
  repIndex: number;
  startS: number;
  bottomS: number | null;
  lockoutS: number;
}

const THUMB_WIDTH_PX = 240;
const LABELS = ["Start", "Bottom", "Lockout"] as const;

function seek(video: HTMLVideoElement, timeS: number): Promise<void> {
  return new Promise((resolve, reject) => {
    const done = () => {
      video.removeEventListener("seeked", done);
      video.removeEventListener("error", fail);
      resolve();
    };
    const fail = () => {
      video.removeEventListener("seeked", done);
      reject(new Error("the clip could not be read"));
    };
    video.addEventListener("seeked", done);
    video.addEventListener("error", fail);
    video.currentTime = timeS;
  });
}

export function KeyFrames({ videoUrl, reps }: { videoUrl: string | null; reps: KeyFrameRep[] }) {
  const video = useRef<HTMLVideoElement>(null);
  const canvases = useRef<Map<string, HTMLCanvasElement>>(new Map());
  const [state, setState] = useState<"loading" | "done" | "failed">(videoUrl ? "loading" : "failed");

  useEffect(() => {
    const element = video.current;
    if (!element || !videoUrl) return;
    let cancelled = false;
    const draw = async () => {
      for (const rep of reps) {
        const times = [rep.startS, rep.bottomS ?? rep.startS, rep.lockoutS];
        for (const [k, t] of times.entries()) {
          if (cancelled) return;
          await seek(element, t);
          const canvas = canvases.current.get(`${rep.repIndex}-${k}`);
          if (!canvas || element.videoWidth === 0) continue;
          canvas.width = THUMB_WIDTH_PX;
          canvas.height = Math.round((THUMB_WIDTH_PX * element.videoHeight) / element.videoWidth);
          canvas.getContext("2d")?.drawImage(element, 0, 0, canvas.width, canvas.height);
        }
      }
      if (!cancelled) setState("done");
    };
    const start = () => void draw().catch(() => !cancelled && setState("failed"));
    if (element.readyState >= 1) start();
    else element.addEventListener("loadedmetadata", start, { once: true });
    return () => {
      cancelled = true;
      element.removeEventListener("loadedmetadata", start);
    };
  }, [videoUrl, reps]);

  if (!videoUrl) return <p className="text-sm text-ink-muted">No clip to take frames from.</p>;
  return (
    <div data-testid="key-frames" data-state={state} className="grid gap-3">
      <video ref={video} src={videoUrl} muted playsInline preload="auto" className="hidden" />
      {state === "failed" ? <p className="text-sm text-ink-muted">The clip could not be read for key frames.</p> : null}
      {reps.map((rep) => (
        <div key={rep.repIndex} className="grid grid-cols-3 gap-2 break-inside-avoid">
          {LABELS.map((label, k) => (
            <figure key={label} className="grid gap-0.5">
              <canvas
                ref={(el) => {
                  if (el) canvases.current.set(`${rep.repIndex}-${k}`, el);
                }}
                className="aspect-video w-full rounded-sm bg-sunken"
              />
              <figcaption className="text-2xs text-ink-muted">
                Rep {rep.repIndex} · {label}
              </figcaption>
            </figure>
          ))}
        </div>
      ))}
    </div>
  );
}
