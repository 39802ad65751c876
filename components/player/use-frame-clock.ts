"use client";
// Which analysed frame the video shows, kept frame-accurate: a seek aims at the middle of the frame's
// interval (from the analysis's own timestamps), and every frame the browser presents is read back
// through requestVideoFrameCallback's mediaTime. While paused, a presented frame that is not the one
// asked for (decoder rounding) gets a small nudge; while playing, the presented frame is the current one.
import { useCallback, useEffect, useRef, useState, type RefObject } from "react";
import { frameAt, seekTargetFor, stepFrame } from "@/lib/player/frames";

type FrameCallbackVideo = HTMLVideoElement & {
  requestVideoFrameCallback?: (callback: (now: number, metadata: { mediaTime: number }) => void) => number;
  cancelVideoFrameCallback?: (handle: number) => void;
};

/** Nudges tried, as fractions of the frame's interval, when the presented frame is not the one asked for. */
const NUDGES = [0.2, 0.8];

export interface FrameClock {
  frameIndex: number;
  /** The frame the browser last reported presenting (null until it has, or without requestVideoFrameCallback). */
  presentedIndex: number | null;
  playing: boolean;
  seekFrame(index: number): void;
  play(): void;
  pause(): void;
}

export function useFrameClock(
  videoRef: RefObject<HTMLVideoElement | null>,
  videoReady: boolean,
  timestamps: readonly number[],
  loop: { startS: number; endS: number } | null,
): FrameClock {
  const [frameIndex, setFrameIndex] = useState(0);
  const [presentedIndex, setPresentedIndex] = useState<number | null>(null);
  const [playing, setPlaying] = useState(false);
  const target = useRef(0);
  const nudges = useRef(0);
  const loopRef = useRef(loop);
  useEffect(() => {
    loopRef.current = loop;
  }, [loop]);

  // One callback loop for the video's lifetime, so no presented frame goes unseen between seeks.
  useEffect(() => {
    const video = videoRef.current as FrameCallbackVideo | null;
    if (!video || !videoReady || timestamps.length === 0) return;
    let cancelled = false;
    const onPresented = (mediaTime: number) => {
      const shown = frameAt(mediaTime, timestamps);
      setPresentedIndex(shown);
      if (!video.paused) {
        const range = loopRef.current;
        if (range && mediaTime >= range.endS) {
          video.currentTime = range.startS;
          return;
        }
        target.current = shown;
        setFrameIndex(shown);
        return;
      }
      const wanted = target.current;
      if (shown === wanted || nudges.current >= NUDGES.length) return;
      const start = timestamps[wanted];
      const end = seekTargetFor(wanted, timestamps) * 2 - start;
      video.currentTime = start + (end - start) * NUDGES[nudges.current];
      nudges.current += 1;
    };
    if (video.requestVideoFrameCallback) {
      let handle = 0;
      const tick = (_now: number, metadata: { mediaTime: number }) => {
        if (cancelled) return;
        onPresented(metadata.mediaTime);
        handle = video.requestVideoFrameCallback!(tick);
      };
      handle = video.requestVideoFrameCallback(tick);
      return () => {
        cancelled = true;
        video.cancelVideoFrameCallback?.(handle);
      };
    }
    // Without the callback, follow playback on animation frames (currentTime, less exact).
    let handle = 0;
    const tick = () => {
      if (cancelled) return;
      if (!video.paused) onPresented(video.currentTime);
      handle = requestAnimationFrame(tick);
    };
    handle = requestAnimationFrame(tick);
    return () => {
      cancelled = true;
      cancelAnimationFrame(handle);
    };
  }, [videoRef, videoReady, timestamps]);

  const seekFrame = useCallback(
    (index: number) => {
      const next = stepFrame(index, 0, timestamps.length);
      target.current = next;
      nudges.current = 0;
      setFrameIndex(next);
      const video = videoRef.current;
      if (!video || timestamps.length === 0) return;
      if (!video.paused) video.pause();
      video.currentTime = seekTargetFor(next, timestamps);
    },
    [timestamps, videoRef],
  );

  useEffect(() => {
    const video = videoRef.current;
    if (!video || !videoReady) return;
    const onPlay = () => setPlaying(true);
    const onPause = () => setPlaying(false);
    video.addEventListener("play", onPlay);
    video.addEventListener("pause", onPause);
    video.addEventListener("ended", onPause);
    return () => {
      video.removeEventListener("play", onPlay);
      video.removeEventListener("pause", onPause);
      video.removeEventListener("ended", onPause);
    };
  }, [videoRef, videoReady]);

  return {
    frameIndex,
    presentedIndex,
    playing,
    seekFrame,
    play: () => {
      const video = videoRef.current;
      if (!video) return;
      const range = loopRef.current;
      if (range && (video.currentTime < range.startS || video.currentTime >= range.endS)) video.currentTime = range.startS;
      void video.play().catch(() => setPlaying(false));
    },
    pause: () => {
      const video = videoRef.current;
      video?.pause();
      // Settle on a whole frame, so stepping and markup continue from exactly the frame on screen.
      if (video) seekFrame(frameAt(video.currentTime, timestamps));
    },
  };
}
