"use client";
// The clip with its layers: the video element underneath, then a react-konva stage in video pixels with
// a static layer (plumb line, bar trace by phase, rep marks), a pose layer (this frame's skeleton) and the
// markup layer. Zoom and pan move the video and the stage together, so markup stays where it was drawn.
import type Konva from "konva";
import { useEffect, useMemo, useRef, useState, type RefObject } from "react";
import { Circle, Group, Layer, Line, Stage, Text } from "react-konva";
import type { Point } from "@/lib/markup/geometry";
import { draggedGeometry } from "@/lib/markup/tools/select";
import { skeletonSegments, type Keypoint } from "@/lib/player/readouts";
import { plumbPoint, traceRuns, type Phase, type TraceFrame, type TraceRep } from "@/lib/player/trace";
import { clampView, zoomAt, type View } from "@/lib/player/view";
import { ShapeNode } from "@/components/markup/shape-node";
import { readPalette, type Palette } from "@/components/markup/style";
import type { MarkupInteraction } from "@/components/markup/use-markup-interaction";

/** HTMLMediaElement.HAVE_CURRENT_DATA: the frame at the current position is decoded. */
const HAVE_CURRENT_DATA = 2;

const PHASE_COLOUR: Record<Phase, keyof Palette> = {
  eccentric: "eccentric",
  concentric: "phase-concentric",
  pause: "phase-pause",
  between: "phase-pause",
};

export interface PlayerCanvasProps {
  videoRef: RefObject<HTMLVideoElement | null>;
  videoUrl: string | null;
  widthPx: number;
  heightPx: number;
  frames: TraceFrame[];
  reps: TraceRep[];
  keypoints: Keypoint[] | null;
  view: View;
  onViewChange: (view: View) => void;
  interaction: MarkupInteraction;
  selectedId: string | null;
  metresPerPixel: number | null;
  showOverlays: boolean;
  /** The width of the stage on screen, reported so screen-sized things (strokes, pick distance) scale. */
  onScreenScale: (pxPerScreenPx: number) => void;
  onVideoReady: () => void;
  onVideoError: () => void;
}

function useWidth(): [RefObject<HTMLDivElement | null>, number] {
  const ref = useRef<HTMLDivElement>(null);
  const [width, setWidth] = useState(0);
  useEffect(() => {
    const element = ref.current;
    if (!element) return;
    const observer = new ResizeObserver(([entry]) => setWidth(entry.contentRect.width));
    observer.observe(element);
    return () => observer.disconnect();
  }, []);
  return [ref, width];
}

export default function PlayerCanvas(props: PlayerCanvasProps) {
  const { videoRef, videoUrl, widthPx, heightPx, frames, reps, keypoints, view, onViewChange, interaction, selectedId, metresPerPixel } = props;
  const [containerRef, containerWidth] = useWidth();
  const stageRef = useRef<Konva.Stage>(null);
  const [palette, setPalette] = useState<Palette | null>(null);
  const baseScale = containerWidth > 0 ? containerWidth / widthPx : 0;
  const scale = baseScale * view.zoom;
  const pxPerScreenPx = scale > 0 ? 1 / scale : 1;
  const screenHeight = heightPx * baseScale;
  const pan = useRef<{ from: Point; view: View } | null>(null);
  const touches = useRef(new Map<number, Point>());
  const pinch = useRef<{ distance: number; view: View; centre: Point } | null>(null);
  const { onScreenScale } = props;

  useEffect(() => {
    setPalette(readPalette());
    const scheme = window.matchMedia("(prefers-color-scheme: dark)");
    const update = () => setPalette(readPalette());
    scheme.addEventListener("change", update);
    return () => scheme.removeEventListener("change", update);
  }, []);

  useEffect(() => {
    if (scale > 0) onScreenScale(pxPerScreenPx);
  }, [scale, pxPerScreenPx, onScreenScale]);

  const runs = useMemo(() => traceRuns(frames, reps), [frames, reps]);
  const plumb = useMemo(() => plumbPoint(frames, reps), [frames, reps]);
  const repMarks = useMemo(
    () =>
      reps.flatMap((rep) => {
        const at = frames.find((f) => f.bar && f.t >= rep.startS)?.bar;
        return at ? [{ rep: rep.repIndex, at }] : [];
      }),
    [frames, reps],
  );
  const bones = useMemo(() => (keypoints ? skeletonSegments(keypoints) : []), [keypoints]);

  const videoPoint = (): Point | null => stageRef.current?.getRelativePointerPosition() ?? null;
  const screenPoint = (): Point | null => stageRef.current?.getPointerPosition() ?? null;

  const onDown = (event: Konva.KonvaEventObject<PointerEvent>) => {
    const e = event.evt;
    const screen = screenPoint();
    if (!screen) return;
    if (e.pointerType === "touch") {
      touches.current.set(e.pointerId, screen);
      if (touches.current.size === 2) {
        // A second finger turns the gesture into a pinch: drop whatever the first finger started.
        interaction.cancel();
        pan.current = null;
        const [a, b] = [...touches.current.values()];
        pinch.current = { distance: Math.hypot(a.x - b.x, a.y - b.y), view, centre: { x: (a.x + b.x) / 2, y: (a.y + b.y) / 2 } };
        return;
      }
    }
    const p = videoPoint();
    if (p && interaction.down(p)) return;
    if (view.zoom > 1) pan.current = { from: screen, view };
  };

  const onMove = (event: Konva.KonvaEventObject<PointerEvent>) => {
    const e = event.evt;
    const screen = screenPoint();
    if (!screen) return;
    if (e.pointerType === "touch" && touches.current.has(e.pointerId)) {
      touches.current.set(e.pointerId, screen);
      if (pinch.current && touches.current.size === 2) {
        const [a, b] = [...touches.current.values()];
        const start = pinch.current;
        const zoomed = zoomAt(start.view, start.centre, Math.hypot(a.x - b.x, a.y - b.y) / start.distance, containerWidth, screenHeight);
        const centre = { x: (a.x + b.x) / 2, y: (a.y + b.y) / 2 };
        onViewChange(clampView({ ...zoomed, panX: zoomed.panX + centre.x - start.centre.x, panY: zoomed.panY + centre.y - start.centre.y }, containerWidth, screenHeight));
        return;
      }
    }
    if (pan.current) {
      const { from, view: start } = pan.current;
      onViewChange(clampView({ ...start, panX: start.panX + screen.x - from.x, panY: start.panY + screen.y - from.y }, containerWidth, screenHeight));
      return;
    }
    const p = videoPoint();
    if (p) interaction.move(p);
  };

  const onUp = (event: Konva.KonvaEventObject<PointerEvent>) => {
    const e = event.evt;
    if (e.pointerType === "touch") {
      touches.current.delete(e.pointerId);
      if (pinch.current) {
        if (touches.current.size === 0) pinch.current = null;
        return;
      }
    }
    if (pan.current) {
      pan.current = null;
      return;
    }
    const p = videoPoint();
    if (p) interaction.up(p);
  };

  const onWheel = (event: Konva.KonvaEventObject<WheelEvent>) => {
    event.evt.preventDefault();
    const screen = screenPoint();
    if (!screen) return;
    // One wheel notch (about 100 px of delta) zooms by about 20 % (common practice for canvas editors).
    const factor = Math.exp(-event.evt.deltaY / 500);
    onViewChange(zoomAt(view, screen, factor, containerWidth, screenHeight));
  };

  const videoStyle = {
    width: widthPx * baseScale,
    height: screenHeight,
    transform: `translate(${view.panX}px, ${view.panY}px) scale(${view.zoom})`,
    transformOrigin: "0 0",
  };
  const stroke = 2.5 * pxPerScreenPx;
  const { onVideoReady } = props;
  useEffect(() => {
    // A clip the browser had already loaded before the element's listener existed fires no further
    // `loadeddata`: ask the element itself once the URL is set.
    if ((videoRef.current?.readyState ?? 0) >= HAVE_CURRENT_DATA) onVideoReady();
    // Only a new URL can make a new clip ready; the callback's identity changes on every render.
  }, [videoUrl, videoRef]);

  return (
    <div ref={containerRef} className="relative w-full touch-none select-none overflow-hidden rounded-lg bg-sunken" style={{ aspectRatio: `${widthPx} / ${heightPx}` }}>
      {videoUrl ? (
        <video
          ref={videoRef}
          src={videoUrl}
          className="absolute left-0 top-0 max-w-none"
          style={videoStyle}
          muted
          playsInline
          preload="auto"
          onLoadedData={props.onVideoReady}
          onError={props.onVideoError}
          data-testid="player-video"
        />
      ) : null}
      {baseScale > 0 && palette ? (
        <Stage
          ref={stageRef}
          className="absolute inset-0"
          width={containerWidth}
          height={screenHeight}
          scaleX={scale}
          scaleY={scale}
          x={view.panX}
          y={view.panY}
          onPointerDown={onDown}
          onPointerMove={onMove}
          onPointerUp={onUp}
          onPointerCancel={onUp}
          onWheel={onWheel}
        >
          <Layer listening={false} visible={props.showOverlays}>
            {plumb ? <Line points={[plumb.x, 0, plumb.x, heightPx]} stroke={palette["ink-faint"]} strokeWidth={stroke / 2} dash={[6 * pxPerScreenPx, 4 * pxPerScreenPx]} /> : null}
            {runs.map((run, i) => (
              <Line key={i} points={run.points} stroke={palette[PHASE_COLOUR[run.phase]]} strokeWidth={stroke} lineCap="round" lineJoin="round" opacity={run.phase === "between" ? 0.5 : 0.95} />
            ))}
            {repMarks.map(({ rep, at }) => (
              <Group key={rep} x={at.x} y={at.y}>
                <Circle radius={4 * pxPerScreenPx} fill={palette.canvas} stroke={palette.ink} strokeWidth={stroke / 2} />
                <Text text={String(rep)} x={6 * pxPerScreenPx} y={-16 * pxPerScreenPx} fontSize={12 * pxPerScreenPx} fill={palette.ink} fontStyle="600" />
              </Group>
            ))}
          </Layer>
          <Layer listening={false} visible={props.showOverlays}>
            {bones.map((points, i) => (
              <Line key={i} points={points} stroke={palette.surface} strokeWidth={stroke} opacity={0.85} lineCap="round" />
            ))}
          </Layer>
          <Layer>
            {interaction.visible.map((shape) => (
              <ShapeNode
                key={shape.id}
                geometry={draggedGeometry(interaction.selectState, shape)}
                style={shape.style}
                palette={palette}
                pxPerScreenPx={pxPerScreenPx}
                metresPerPixel={metresPerPixel}
                selected={shape.id === selectedId}
              />
            ))}
            {interaction.preview ? (
              <ShapeNode geometry={interaction.preview} style={{ colour: "action", stroke: "medium" }} palette={palette} pxPerScreenPx={pxPerScreenPx} metresPerPixel={metresPerPixel} />
            ) : null}
          </Layer>
        </Stage>
      ) : null}
    </div>
  );
}
