"use client";
// Draws one markup shape on the canvas, by kind, with its measure (length, angle) as a label. Coordinates
// are video pixels; `pxPerScreenPx` turns screen sizes (strokes, text) into the stage's units.
import { Arrow, Ellipse, Group, Label, Line, Tag, Text } from "react-konva";
import { anchorOf, measureOf } from "@/lib/markup/kinds";
import { NOTE_FONT_PX, NOTE_PADDING_PX } from "@/lib/markup/kinds/note";
import type { MarkupGeometry, MarkupStyle } from "@/lib/validation/markup";
import { STROKE_SCREEN_PX, type Palette } from "./style";

export interface ShapeNodeProps {
  id?: string;
  geometry: MarkupGeometry;
  style: MarkupStyle;
  palette: Palette;
  pxPerScreenPx: number;
  metresPerPixel: number | null;
  selected?: boolean;
}

function MeasureLabel({ geometry, palette, pxPerScreenPx, metresPerPixel, colour }: ShapeNodeProps & { colour: string }) {
  const measure = measureOf(geometry, { metresPerPixel });
  if (!measure) return null;
  const at = anchorOf(geometry);
  const fontSize = 13 * pxPerScreenPx;
  return (
    <Label x={at.x + 8 * pxPerScreenPx} y={at.y - 24 * pxPerScreenPx} listening={false}>
      <Tag fill={palette.canvas} opacity={0.85} cornerRadius={3 * pxPerScreenPx} />
      <Text text={measure.label} fontSize={fontSize} fill={colour} padding={3 * pxPerScreenPx} fontStyle="600" />
    </Label>
  );
}

export function ShapeNode(props: ShapeNodeProps) {
  const { geometry, style, palette, pxPerScreenPx, selected } = props;
  const colour = palette[style.colour];
  const strokeWidth = STROKE_SCREEN_PX[style.stroke] * pxPerScreenPx;
  const common = {
    stroke: colour,
    strokeWidth,
    lineCap: "round" as const,
    lineJoin: "round" as const,
    shadowColor: selected ? palette.action : palette.canvas,
    shadowBlur: (selected ? 8 : 2) * pxPerScreenPx,
    shadowOpacity: selected ? 1 : 0.6,
    listening: false,
  };
  let body: React.ReactNode;
  switch (geometry.kind) {
    case "ruler": {
      const { a, b } = geometry;
      const len = Math.hypot(b.x - a.x, b.y - a.y) || 1;
      // End ticks square to the line.
      const tx = (-(b.y - a.y) / len) * 6 * pxPerScreenPx;
      const ty = ((b.x - a.x) / len) * 6 * pxPerScreenPx;
      body = (
        <>
          <Line points={[a.x, a.y, b.x, b.y]} {...common} />
          <Line points={[a.x - tx, a.y - ty, a.x + tx, a.y + ty]} {...common} />
          <Line points={[b.x - tx, b.y - ty, b.x + tx, b.y + ty]} {...common} />
        </>
      );
      break;
    }
    case "protractor": {
      const { vertex, a } = geometry;
      if (geometry.mode === "three-point") {
        const { b } = geometry;
        body = <Line points={[a.x, a.y, vertex.x, vertex.y, b.x, b.y]} {...common} />;
        break;
      }
      // The dashed plumb line the angle is measured against, as long as the drawn leg.
      const top = vertex.y - Math.hypot(a.x - vertex.x, a.y - vertex.y);
      body = (
        <>
          <Line points={[vertex.x, vertex.y, a.x, a.y]} {...common} />
          <Line points={[vertex.x, vertex.y, vertex.x, top]} {...common} strokeWidth={strokeWidth / 2} dash={[4 * pxPerScreenPx, 4 * pxPerScreenPx]} />
        </>
      );
      break;
    }
    case "arrow":
      body = (
        <Arrow
          points={[geometry.from.x, geometry.from.y, geometry.to.x, geometry.to.y]}
          {...common}
          fill={colour}
          pointerLength={12 * pxPerScreenPx}
          pointerWidth={10 * pxPerScreenPx}
        />
      );
      break;
    case "ring":
      body = <Ellipse x={geometry.center.x} y={geometry.center.y} radiusX={geometry.radiusXPx} radiusY={geometry.radiusYPx} {...common} />;
      break;
    case "pen":
      body = <Line points={geometry.points.flatMap((p) => [p.x, p.y])} {...common} tension={0.3} />;
      break;
    case "note":
      body = (
        <Label x={geometry.at.x} y={geometry.at.y} listening={false}>
          <Tag fill={palette.canvas} opacity={0.9} stroke={colour} strokeWidth={strokeWidth / 2} cornerRadius={4} />
          <Text text={geometry.text || " "} fontSize={NOTE_FONT_PX} lineHeight={1.25} padding={NOTE_PADDING_PX} fill={colour} />
        </Label>
      );
      break;
  }
  return (
    <Group listening={false}>
      {body}
      <MeasureLabel {...props} colour={colour} />
    </Group>
  );
}
