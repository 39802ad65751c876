"use client";
// Pointer input on the markup layer: runs the current tool's state machine (or the select tool), and turns
// finished gestures into markup edits pinned to the frame on screen. Points arrive in video pixels.
import { useCallback, useRef, useState } from "react";
import type { Point } from "@/lib/markup/geometry";
import { isShapeVisible, type Shape } from "@/lib/markup/shape";
import { DRAWING_TOOLS, type ToolName } from "@/lib/markup/tools";
import { IDLE, pointerDown, pointerMove, pointerUp, previewOf } from "@/lib/markup/tools/machine";
import { selectDown, selectMove, selectUp, type SelectState } from "@/lib/markup/tools/select";
import { DRAG_THRESHOLD_SCREEN_PX, type ToolState } from "@/lib/markup/tools/types";
import type { MarkupGeometry, MarkupStyle } from "@/lib/validation/markup";
import type { MarkupApi } from "./use-markup";

/** How close (screen pixels) the pointer must come to a shape to pick it; a fingertip needs more. */
const PICK_SCREEN_PX = 8;

export interface MarkupFrame {
  index: number;
  timeS: number;
}

export interface MarkupInteraction {
  visible: Shape[];
  preview: MarkupGeometry | null;
  selectState: SelectState;
  /** True when the press was taken by the tool; false leaves it to the canvas (panning). */
  down(p: Point): boolean;
  move(p: Point): void;
  up(p: Point): void;
  cancel(): void;
}

export function useMarkupInteraction({
  markup,
  tool,
  style,
  frame,
  spanEndS,
  pxPerScreenPx,
  selectedId,
  onSelect,
  onNotePlaced,
}: {
  markup: MarkupApi;
  tool: ToolName;
  style: MarkupStyle;
  frame: MarkupFrame;
  spanEndS: number | null;
  pxPerScreenPx: number;
  selectedId: string | null;
  onSelect: (shapeId: string | null) => void;
  onNotePlaced: (at: Point) => void;
}): MarkupInteraction {
  const [toolState, setToolState] = useState<ToolState<unknown>>(IDLE);
  const [selectState, setSelectState] = useState<SelectState>({ name: "idle" });
  // Refs mirror the states so several pointer events within one render see each other's effect.
  const toolRef = useRef(toolState);
  const selectRef = useRef(selectState);

  const visible = markup.shapes.filter((s) => isShapeVisible(s, frame.index, frame.timeS));
  const threshold = DRAG_THRESHOLD_SCREEN_PX * pxPerScreenPx;

  const commit = useCallback(
    (geometry: MarkupGeometry | undefined) => {
      if (!geometry) return;
      if (geometry.kind === "note" && geometry.text === "") {
        onNotePlaced(geometry.at);
        return;
      }
      const id = crypto.randomUUID();
      markup.create({ id, frameIndex: frame.index, frameTimeS: frame.timeS, spanEndS, geometry, style });
      onSelect(id);
    },
    [frame.index, frame.timeS, markup, onNotePlaced, onSelect, spanEndS, style],
  );

  const setTool = (next: ToolState<unknown>) => {
    toolRef.current = next;
    setToolState(next);
  };
  const setSelect = (next: SelectState) => {
    selectRef.current = next;
    setSelectState(next);
  };

  return {
    visible,
    preview: tool === "select" ? null : previewOf(DRAWING_TOOLS[tool], toolState),
    selectState,
    down(p) {
      if (tool === "select") {
        const result = selectDown(markup.canEdit ? visible : [], p, PICK_SCREEN_PX * pxPerScreenPx);
        if (result.select !== undefined && result.select !== selectedId) onSelect(result.select);
        if (!result.select) return false;
        setSelect(result.state);
        return true;
      }
      if (!markup.canEdit) return false;
      const result = pointerDown(DRAWING_TOOLS[tool], toolRef.current, p);
      setTool(result.state);
      commit(result.commit);
      return true;
    },
    move(p) {
      if (tool === "select") {
        if (selectRef.current.name !== "idle") setSelect(selectMove(selectRef.current, p, threshold).state);
        return;
      }
      if (toolRef.current.name !== "idle") setTool(pointerMove(DRAWING_TOOLS[tool], toolRef.current, p, threshold).state);
    },
    up(p) {
      if (tool === "select") {
        const result = selectUp(selectRef.current, markup.shapes, p);
        setSelect(result.state);
        if (result.move) markup.update(result.move.shapeId, { geometry: result.move.geometry });
        return;
      }
      const result = pointerUp(DRAWING_TOOLS[tool], toolRef.current, p);
      setTool(result.state);
      commit(result.commit);
    },
    cancel() {
      setTool(IDLE);
      setSelect({ name: "idle" });
    },
  };
}
