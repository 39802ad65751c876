"use client";
// The first frame of the clip on a canvas (react-konva): a tap marks the plate, the suggested rim is
// drawn as a circle, and a handle on the rim drags it wider or narrower; the centre drags too.
// Coordinates go in and out in clip pixels; the stage scales the frame to the width available.
import type Konva from "konva";
import { useEffect, useMemo, useRef, useState } from "react";
import { Circle, Image as KonvaImage, Layer, Line, Stage } from "react-konva";

export interface PlateCircleValue {
  cx: number;
  cy: number;
  radiusPx: number;
}

/** Resolves a design token (a CSS variable) to a colour the canvas can paint with. */
function token(name: string): string {
  return getComputedStyle(document.documentElement).getPropertyValue(`--pl-${name}`).trim();
}

function useContainerWidth(): [React.RefObject<HTMLDivElement | null>, number] {
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

export default function PlateMarker({
  frame,
  circle,
  onTap,
  onChange,
}: {
  frame: ImageData;
  circle: PlateCircleValue | null;
  onTap: (x: number, y: number) => void;
  onChange: (circle: PlateCircleValue) => void;
}) {
  const [containerRef, containerWidth] = useContainerWidth();
  const image = useMemo(() => {
    const canvas = document.createElement("canvas");
    canvas.width = frame.width;
    canvas.height = frame.height;
    canvas.getContext("2d")?.putImageData(frame, 0, 0);
    return canvas;
  }, [frame]);
  const colours = useMemo(() => ({ action: token("action"), onAction: token("on-action"), surface: token("surface") }), []);
  const scale = containerWidth > 0 ? containerWidth / frame.width : 0;

  const tap = (event: Konva.KonvaEventObject<MouseEvent | TouchEvent>) => {
    const point = event.target.getStage()?.getPointerPosition();
    if (point && scale > 0) onTap(point.x / scale, point.y / scale);
  };

  const dragRim = (event: Konva.KonvaEventObject<DragEvent>) => {
    if (!circle) return;
    const dx = event.target.x() / scale - circle.cx;
    const dy = event.target.y() / scale - circle.cy;
    onChange({ ...circle, radiusPx: Math.max(4, Math.hypot(dx, dy)) });
  };

  const dragCentre = (event: Konva.KonvaEventObject<DragEvent>) => {
    if (!circle) return;
    onChange({ ...circle, cx: event.target.x() / scale, cy: event.target.y() / scale });
  };

  return (
    <div ref={containerRef} className="w-full touch-none select-none" data-testid="plate-marker">
      {scale > 0 ? (
        <Stage width={frame.width * scale} height={frame.height * scale} onClick={tap} onTap={tap} className="cursor-crosshair">
          <Layer listening={false}>
            <KonvaImage image={image} width={frame.width * scale} height={frame.height * scale} />
          </Layer>
          {circle ? (
            <Layer>
              <Circle x={circle.cx * scale} y={circle.cy * scale} radius={circle.radiusPx * scale} stroke={colours.action} strokeWidth={2} listening={false} />
              <Line
                points={[circle.cx * scale, circle.cy * scale, (circle.cx + circle.radiusPx) * scale, circle.cy * scale]}
                stroke={colours.action}
                strokeWidth={1}
                dash={[4, 4]}
                listening={false}
              />
              <Circle
                name="centre"
                x={circle.cx * scale}
                y={circle.cy * scale}
                radius={7}
                fill={colours.action}
                stroke={colours.surface}
                strokeWidth={2}
                draggable
                onDragMove={dragCentre}
                onClick={(e) => (e.cancelBubble = true)}
                onTap={(e) => (e.cancelBubble = true)}
              />
              <Circle
                name="rim"
                x={(circle.cx + circle.radiusPx) * scale}
                y={circle.cy * scale}
                radius={11}
                fill={colours.onAction}
                stroke={colours.action}
                strokeWidth={3}
                hitStrokeWidth={16}
                draggable
                onDragMove={dragRim}
                onClick={(e) => (e.cancelBubble = true)}
                onTap={(e) => (e.cancelBubble = true)}
              />
            </Layer>
          ) : null}
        </Stage>
      ) : null}
    </div>
  );
}
