"use client";
// The review player: the set's clip with the trace, skeleton and markup drawn over it, stepped frame by
// frame on the analysis's own timestamps. It loads the analysis, clip, track and markup itself, so a page
// only passes the set, whether the viewer may draw, and optionally where to seek.
// Keys (when the player has focus): ←/→ one frame (Shift: ten), Space play/pause, [ ] previous/next rep,
// 1–4 speed 0.25×/0.5×/1×/2×, L loop the rep, + − 0 zoom, Delete removes the selected shape,
// Ctrl+Z / Ctrl+Shift+Z undo/redo, Escape drops the drawing in progress, letters pick tools (see toolbar).
import dynamic from "next/dynamic";
import { useCallback, useEffect, useMemo, useRef, useState, type KeyboardEvent } from "react";
import { clsx } from "clsx";
import type { Point } from "@/lib/markup/geometry";
import type { ToolName } from "@/lib/markup/tools";
import { frameAt } from "@/lib/player/frames";
import { barSpeedMps, frameAngles } from "@/lib/player/readouts";
import { neighbourRep, repAt, repMarkTimeS, type RepMark } from "@/lib/player/trace";
import { FIT, zoomAt, type View } from "@/lib/player/view";
import type { MarkupStyle } from "@/lib/validation/markup";
import { MarkupList } from "@/components/markup/markup-list";
import { MarkupToolbar, TOOL_LABELS, type SpanChoice } from "@/components/markup/markup-toolbar";
import { NoteEditor } from "@/components/markup/note-editor";
import { useMarkup } from "@/components/markup/use-markup";
import { useMarkupInteraction } from "@/components/markup/use-markup-interaction";
import { Readouts } from "./readouts";
import { Scrubber } from "./scrubber";
import { useFrameClock } from "./use-frame-clock";
import { usePlayerData } from "./use-player-data";

const PlayerCanvas = dynamic(() => import("./player-canvas"), { ssr: false });

export interface PlayerFrameInfo {
  index: number;
  timeS: number;
  repNumber: number | null;
}

export interface ReviewPlayerProps {
  setId: string;
  canEditMarkup: boolean;
  seekRequest?: { timeS: number } | null;
  onFrameChange?: (frame: PlayerFrameInfo) => void;
}

export const SPEEDS = [0.25, 0.5, 0.75, 1, 1.5, 2] as const;
/** A broken clip must not turn into a loop of fresh URLs: at most one refresh a minute. */
const CLIP_REFRESH_MIN_MS = 60_000;
const KEY_SPEEDS: Record<string, number> = { "1": 0.25, "2": 0.5, "3": 1, "4": 2 };
const TOOL_KEYS = Object.fromEntries(Object.entries(TOOL_LABELS).map(([tool, { key }]) => [key.toLowerCase(), tool as ToolName]));

const transportButton =
  "inline-flex h-9 min-w-9 items-center justify-center rounded border border-line-strong bg-surface px-2.5 text-sm font-medium text-ink hover:bg-sunken disabled:opacity-50";

function isTyping(target: EventTarget): boolean {
  return target instanceof HTMLElement && (target.isContentEditable || ["INPUT", "TEXTAREA", "SELECT"].includes(target.tagName));
}

export function ReviewPlayer({ setId, canEditMarkup, seekRequest, onFrameChange }: ReviewPlayerProps) {
  const data = usePlayerData(setId);
  const { analysis, clip, barFrames, barTimes, timestamps } = data;
  const reps = useMemo(() => analysis?.reps ?? [], [analysis]);
  const videoRef = useRef<HTMLVideoElement>(null);
  const lastClipRefresh = useRef(0);
  const [loopRep, setLoopRep] = useState<{ startS: number; endS: number } | null>(null);
  const [videoReady, setVideoReady] = useState(false);
  const clock = useFrameClock(videoRef, videoReady, timestamps, loopRep);
  const { frameIndex, seekFrame } = clock;
  const timeS = timestamps[frameIndex] ?? 0;
  const currentRep = repAt(timeS, reps);
  const [speed, setSpeed] = useState(1);
  const [view, setView] = useState<View>(FIT);
  const [showOverlays, setShowOverlays] = useState(true);
  const [pxPerScreenPx, setPxPerScreenPx] = useState(1);
  const [tool, setTool] = useState<ToolName>("select");
  const [style, setStyle] = useState<MarkupStyle>({ colour: "action", stroke: "medium" });
  const [span, setSpan] = useState<SpanChoice>("frame");
  const [selectedId, setSelectedId] = useState<string | null>(null);
  const [noteAt, setNoteAt] = useState<Point | null>(null);
  const markup = useMarkup(setId, canEditMarkup);
  const metresPerPixel = analysis?.scale.metresPerPixel ?? null;
  const lastS = timestamps[timestamps.length - 1] ?? 0;

  const spanEndFor = useCallback(
    (choice: SpanChoice, fromS: number): number | null => {
      if (choice === "clip") return Math.max(lastS, fromS);
      if (choice === "rep") return repAt(fromS, reps)?.endS ?? null;
      return null;
    },
    [lastS, reps],
  );

  const interaction = useMarkupInteraction({
    markup,
    tool,
    style,
    frame: { index: frameIndex, timeS },
    spanEndS: spanEndFor(span, timeS),
    pxPerScreenPx,
    selectedId,
    onSelect: setSelectedId,
    onNotePlaced: setNoteAt,
  });

  useEffect(() => {
    if (videoRef.current) videoRef.current.playbackRate = speed;
  }, [speed, videoReady]);

  const frameChange = useRef(onFrameChange);
  useEffect(() => {
    frameChange.current = onFrameChange;
  }, [onFrameChange]);
  const repNumber = currentRep?.repIndex ?? null;
  useEffect(() => {
    if (timestamps.length > 0) frameChange.current?.({ index: frameIndex, timeS, repNumber });
  }, [frameIndex, timeS, repNumber, timestamps.length]);

  // A new request object means "seek there"; one that arrives before the analysis waits for it.
  const handledSeek = useRef<{ timeS: number } | null>(null);
  useEffect(() => {
    if (!seekRequest || seekRequest === handledSeek.current || timestamps.length === 0 || !videoReady) return;
    handledSeek.current = seekRequest;
    seekFrame(frameAt(seekRequest.timeS, timestamps));
  }, [seekRequest, seekFrame, timestamps, videoReady]);

  const jump = (mark: RepMark) => {
    const rep = currentRep ?? neighbourRep(timeS, reps, 1) ?? reps[reps.length - 1];
    if (rep) seekFrame(frameAt(repMarkTimeS(rep, mark), timestamps));
  };
  const jumpRep = (direction: -1 | 1) => {
    const rep = neighbourRep(timeS, reps, direction);
    if (rep) seekFrame(frameAt(rep.startS, timestamps));
  };
  const toggleLoop = () => {
    const rep = currentRep ?? neighbourRep(timeS, reps, 1);
    setLoopRep((current) => (current || !rep ? null : { startS: rep.startS, endS: rep.endS }));
  };
  const chooseTool = (next: ToolName) => {
    interaction.cancel();
    setTool(next);
  };
  const chooseStyle = (next: MarkupStyle) => {
    setStyle(next);
    if (selectedId) markup.update(selectedId, { style: next });
  };
  const chooseSpan = (next: SpanChoice) => {
    setSpan(next);
    const selected = markup.shapes.find((s) => s.id === selectedId);
    if (selected) markup.update(selected.id, { spanEndS: spanEndFor(next, selected.frameTimeS) });
  };
  const deleteSelected = () => {
    if (!selectedId) return;
    markup.remove(selectedId);
    setSelectedId(null);
  };
  const zoomBy = (factor: number) => {
    const box = videoRef.current?.parentElement?.getBoundingClientRect();
    if (box) setView((v) => zoomAt(v, { x: box.width / 2, y: box.height / 2 }, factor, box.width, box.height));
  };

  const onKeyDown = (event: KeyboardEvent<HTMLDivElement>) => {
    if (isTyping(event.target) || timestamps.length === 0) return;
    const key = event.key;
    const mod = event.ctrlKey || event.metaKey;
    let handled = true;
    if (key === "ArrowRight") seekFrame(frameIndex + (event.shiftKey ? 10 : 1));
    else if (key === "ArrowLeft") seekFrame(frameIndex - (event.shiftKey ? 10 : 1));
    else if (key === " ") (clock.playing ? clock.pause() : clock.play());
    else if (key === "[") jumpRep(-1);
    else if (key === "]") jumpRep(1);
    else if (KEY_SPEEDS[key] && !mod) setSpeed(KEY_SPEEDS[key]);
    else if (mod && key.toLowerCase() === "z") (event.shiftKey ? markup.redo() : markup.undo());
    else if (mod && key.toLowerCase() === "y") markup.redo();
    else if (key === "Delete" || key === "Backspace") deleteSelected();
    else if (key === "Escape") {
      interaction.cancel();
      setSelectedId(null);
    } else if (key === "+" || key === "=") zoomBy(1.25);
    else if (key === "-") zoomBy(0.8);
    else if (key === "0") setView(FIT);
    else if (key.toLowerCase() === "l" && !mod) toggleLoop();
    else if (!mod && markup.canEdit && TOOL_KEYS[key.toLowerCase()]) chooseTool(TOOL_KEYS[key.toLowerCase()]);
    else handled = false;
    if (handled) event.preventDefault();
  };

  if (data.error) {
    return (
      <p role="alert" className="rounded border border-fault-line bg-fault-soft p-3 text-sm text-fault">
        The clip or its analysis could not be loaded. Reload the page to try again.
      </p>
    );
  }

  const widthPx = clip?.widthPx ?? 0;
  const heightPx = clip?.heightPx ?? 0;
  const videoUrl = clip?.convertedUrl ?? clip?.url ?? null;
  const keypoints = data.keypointsByFrame?.[frameIndex] ?? null;
  const angles = keypoints ? frameAngles(keypoints) : null;
  const speedMps = metresPerPixel !== null && barFrames.length > 0 ? barSpeedMps(barFrames, frameAt(timeS, barTimes), metresPerPixel) : null;
  const flagMarks = [...reps.flatMap((r) => r.flags), ...(analysis?.set?.flags ?? [])].flatMap((flag) => {
    const rep = reps.find((r) => r.repIndex === flag.rep);
    return rep ? [{ timeS: repMarkTimeS(rep, "bottom"), label: flag.message }] : [];
  });
  const markupMarks = markup.shapes.map((s) => ({ timeS: s.frameTimeS, label: `Markup on frame ${s.frameIndex + 1}` }));
  const ready = videoReady && timestamps.length > 0 && markup.loaded;

  return (
    <section
      className="grid gap-3 outline-none focus-visible:ring-2 focus-visible:ring-focus"
      tabIndex={0}
      onKeyDown={onKeyDown}
      aria-label="Clip player. Arrow keys step one frame; space plays and pauses."
      data-testid="review-player"
      data-ready={ready}
      data-video-ready={videoReady}
      data-frame-count={timestamps.length}
      data-markup-loaded={markup.loaded}
      data-can-edit={markup.canEdit}
    >
      {widthPx > 0 && heightPx > 0 ? (
        <PlayerCanvas
          videoRef={videoRef}
          videoUrl={videoUrl}
          widthPx={widthPx}
          heightPx={heightPx}
          frames={barFrames}
          reps={reps}
          keypoints={keypoints}
          view={view}
          onViewChange={setView}
          interaction={interaction}
          selectedId={selectedId}
          metresPerPixel={metresPerPixel}
          showOverlays={showOverlays}
          onScreenScale={setPxPerScreenPx}
          onVideoReady={() => {
            setVideoReady(true);
            // After a fresh clip URL the video starts over: put it back on the frame being reviewed.
            if (timestamps.length > 0) seekFrame(frameIndex);
          }}
          onVideoError={() => {
            if (Date.now() - lastClipRefresh.current < CLIP_REFRESH_MIN_MS) return;
            lastClipRefresh.current = Date.now();
            data.refreshClip();
          }}
        />
      ) : (
        <div className="aspect-video w-full animate-pulse rounded-lg bg-sunken" aria-busy="true" />
      )}
      <Scrubber durationS={lastS} timeS={timeS} reps={reps} flags={flagMarks} markup={markupMarks} onSeek={(t) => seekFrame(frameAt(t, timestamps))} />
      <div className="flex flex-wrap items-center gap-1.5">
        <button type="button" className={transportButton} onClick={() => seekFrame(frameIndex - 1)} aria-label="Previous frame" title="Previous frame (←)">
          ◀︎|
        </button>
        <button type="button" className={clsx(transportButton, "min-w-16")} onClick={() => (clock.playing ? clock.pause() : clock.play())} title="Play or pause (Space)">
          {clock.playing ? "Pause" : "Play"}
        </button>
        <button type="button" className={transportButton} onClick={() => seekFrame(frameIndex + 1)} aria-label="Next frame" title="Next frame (→)">
          |▶︎
        </button>
        <label className="inline-flex items-center gap-1 text-sm text-ink-muted">
          <span className="sr-only">Speed</span>
          <select className="h-9 rounded border border-line-strong bg-surface px-1.5 text-sm text-ink" value={speed} onChange={(e) => setSpeed(Number(e.target.value))}>
            {SPEEDS.map((s) => (
              <option key={s} value={s}>
                {s}×
              </option>
            ))}
          </select>
        </label>
        <button type="button" className={transportButton} onClick={() => jumpRep(-1)} title="Previous rep ([)">
          ‹ Rep
        </button>
        <button type="button" className={transportButton} onClick={() => jumpRep(1)} title="Next rep (])">
          Rep ›
        </button>
        <button type="button" className={transportButton} onClick={() => jump("start")}>
          Start
        </button>
        <button type="button" className={transportButton} onClick={() => jump("bottom")}>
          Bottom
        </button>
        <button type="button" className={transportButton} onClick={() => jump("lockout")}>
          Lockout
        </button>
        <button type="button" className={transportButton} aria-pressed={loopRep !== null} onClick={toggleLoop} title="Loop the rep (L)">
          {loopRep ? "Looping rep" : "Loop rep"}
        </button>
        <button type="button" className={transportButton} onClick={() => zoomBy(0.8)} aria-label="Zoom out" title="Zoom out (−)">
          −
        </button>
        <button type="button" className={transportButton} onClick={() => setView(FIT)} title="Fit the clip (0)">
          {Math.round(view.zoom * 100)} %
        </button>
        <button type="button" className={transportButton} onClick={() => zoomBy(1.25)} aria-label="Zoom in" title="Zoom in (+)">
          +
        </button>
        <label className="ml-auto inline-flex items-center gap-1.5 text-sm text-ink-muted">
          <input type="checkbox" checked={showOverlays} onChange={(e) => setShowOverlays(e.target.checked)} />
          Trace and skeleton
        </label>
      </div>
      <p
        data-testid="player-frame"
        data-frame-index={frameIndex}
        data-time-s={timeS.toFixed(4)}
        data-presented-index={clock.presentedIndex ?? undefined}
        className="nums text-xs text-ink-muted"
        aria-live="off"
      >
        Frame {timestamps.length > 0 ? frameIndex + 1 : 0} of {timestamps.length} · {timeS.toFixed(3)} s{currentRep ? ` · rep ${currentRep.repIndex}` : " · between reps"}
      </p>
      <Readouts angles={angles} barSpeedMps={speedMps} />
      {markup.canEdit ? (
        <>
          <MarkupToolbar
            tool={tool}
            onTool={chooseTool}
            style={style}
            onStyle={chooseStyle}
            span={span}
            onSpan={chooseSpan}
            canUndo={markup.canUndo}
            canRedo={markup.canRedo}
            onUndo={markup.undo}
            onRedo={markup.redo}
            hasSelection={selectedId !== null}
            onDelete={deleteSelected}
            pendingCount={markup.pendingCount}
          />
          {noteAt ? (
            <NoteEditor
              onCancel={() => setNoteAt(null)}
              onSave={(text) => {
                const id = crypto.randomUUID();
                markup.create({ id, frameIndex, frameTimeS: timeS, spanEndS: spanEndFor(span, timeS), geometry: { kind: "note", at: noteAt, text }, style });
                setSelectedId(id);
                setNoteAt(null);
              }}
            />
          ) : null}
        </>
      ) : null}
      {data.trackFailed ? (
        <p className="text-xs text-caution">The pose track could not be loaded: no skeleton or angle read-outs, and steps follow the analysis's frame times.</p>
      ) : null}
      {markup.problem ? (
        <p role="alert" className="text-sm text-fault">
          {markup.problem}
        </p>
      ) : null}
      <MarkupList shapes={interaction.visible} metresPerPixel={metresPerPixel} selectedId={selectedId} onSelect={markup.canEdit ? setSelectedId : undefined} />
    </section>
  );
}
