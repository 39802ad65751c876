// The drawing tools' state machines (idle -> pointing -> dragging -> idle, or -> placing for the
// protractor's third point), driven with plain points as the canvas would.
import { describe, expect, it } from "vitest";
import { IDLE, cancel, pointerDown, pointerMove, pointerUp, previewOf } from "@/lib/markup/tools/machine";
import { DRAWING_TOOLS } from "@/lib/markup/tools";
import { PEN_MIN_SPACING_PX } from "@/lib/markup/tools/pen";
import type { ToolDefinition, ToolState } from "@/lib/markup/tools/types";
import { selectDown, selectMove, selectUp, draggedGeometry, shapeAt } from "@/lib/markup/tools/select";
import type { Shape } from "@/lib/markup/shape";
import type { Point } from "@/lib/markup/geometry";

const THRESHOLD = 4;

function drag(tool: ToolDefinition<unknown>, from: Point, to: Point, state: ToolState<unknown> = IDLE) {
  const down = pointerDown(tool, state, from);
  const moved = pointerMove(tool, down.state, to, THRESHOLD);
  return { down, moved, up: pointerUp(tool, moved.state, to) };
}

describe("two-point tools", () => {
  it("go idle -> pointing -> dragging -> idle and commit a ruler", () => {
    const { down, moved, up } = drag(DRAWING_TOOLS.ruler, { x: 0, y: 0 }, { x: 30, y: 40 });
    expect(down.state.name).toBe("pointing");
    expect(moved.state.name).toBe("dragging");
    expect(previewOf(DRAWING_TOOLS.ruler, moved.state)).toEqual({ kind: "ruler", a: { x: 0, y: 0 }, b: { x: 30, y: 40 } });
    expect(up.state).toEqual(IDLE);
    expect(up.commit).toEqual({ kind: "ruler", a: { x: 0, y: 0 }, b: { x: 30, y: 40 } });
  });

  it("stay pointing under the drag threshold, and a tap draws nothing", () => {
    const down = pointerDown(DRAWING_TOOLS.arrow, IDLE, { x: 0, y: 0 });
    const moved = pointerMove(DRAWING_TOOLS.arrow, down.state, { x: 2, y: 2 }, THRESHOLD);
    expect(moved.state.name).toBe("pointing");
    const up = pointerUp(DRAWING_TOOLS.arrow, moved.state, { x: 2, y: 2 });
    expect(up).toEqual({ state: IDLE });
  });

  it("commit an arrow from tail to head and the vertical protractor from its vertex", () => {
    expect(drag(DRAWING_TOOLS.arrow, { x: 1, y: 2 }, { x: 50, y: 60 }).up.commit).toEqual({ kind: "arrow", from: { x: 1, y: 2 }, to: { x: 50, y: 60 } });
    expect(drag(DRAWING_TOOLS["protractor-vertical"], { x: 100, y: 400 }, { x: 130, y: 360 }).up.commit).toEqual({
      kind: "protractor",
      mode: "vertical",
      vertex: { x: 100, y: 400 },
      a: { x: 130, y: 360 },
    });
  });

  it("ignores moves while idle and cancel drops a drag in progress", () => {
    expect(pointerMove(DRAWING_TOOLS.ruler, IDLE, { x: 9, y: 9 }, THRESHOLD).state).toEqual(IDLE);
    expect(pointerUp(DRAWING_TOOLS.ruler, IDLE, { x: 9, y: 9 })).toEqual({ state: IDLE });
    expect(cancel().state).toEqual(IDLE);
  });
});

describe("three-point protractor", () => {
  const tool = DRAWING_TOOLS.protractor;

  it("drags the first ray, waits in placing with a live second ray, and commits on the third click", () => {
    const { up } = drag(tool, { x: 100, y: 100 }, { x: 100, y: 400 });
    expect(up.commit).toBeUndefined();
    expect(up.state.name).toBe("placing");
    const hovering = pointerMove(tool, up.state, { x: 500, y: 400 }, THRESHOLD);
    expect(previewOf(tool, hovering.state)).toEqual({
      kind: "protractor",
      mode: "three-point",
      a: { x: 100, y: 100 },
      vertex: { x: 100, y: 400 },
      b: { x: 500, y: 400 },
    });
    const placed = pointerDown(tool, hovering.state, { x: 500, y: 400 });
    expect(placed.state).toEqual(IDLE);
    expect(placed.commit).toEqual({ kind: "protractor", mode: "three-point", a: { x: 100, y: 100 }, vertex: { x: 100, y: 400 }, b: { x: 500, y: 400 } });
  });

  it("drops a protractor whose first ray is too short or whose third point sits on the vertex", () => {
    expect(drag(tool, { x: 0, y: 0 }, { x: 5, y: 0 }).up.state.name).toBe("placing");
    const short = pointerUp(tool, { name: "dragging", origin: { x: 0, y: 0 }, draft: { a: { x: 0, y: 0 }, vertex: { x: 0, y: 0 }, b: null } }, { x: 1, y: 1 });
    expect(short).toEqual({ state: IDLE });
    const { up } = drag(tool, { x: 0, y: 0 }, { x: 0, y: 100 });
    expect(pointerDown(tool, up.state, { x: 1, y: 100 })).toEqual({ state: IDLE });
  });
});

describe("ring, pen and note", () => {
  it("fits a ring into the dragged box", () => {
    expect(drag(DRAWING_TOOLS.ring, { x: 10, y: 20 }, { x: 110, y: 60 }).up.commit).toEqual({ kind: "ring", center: { x: 60, y: 40 }, radiusXPx: 50, radiusYPx: 20 });
    expect(drag(DRAWING_TOOLS.ring, { x: 10, y: 20 }, { x: 110, y: 21 }).up.commit).toBeUndefined();
  });

  it("records a pen stroke, skipping points closer than the minimum spacing", () => {
    const tool = DRAWING_TOOLS.pen;
    let t = pointerDown(tool, IDLE, { x: 0, y: 0 });
    for (const p of [{ x: 10, y: 0 }, { x: 10 + PEN_MIN_SPACING_PX / 2, y: 0 }, { x: 20, y: 0 }]) t = pointerMove(tool, t.state, p, THRESHOLD);
    expect(pointerUp(tool, t.state, { x: 20, y: 0 }).commit).toEqual({ kind: "pen", points: [{ x: 0, y: 0 }, { x: 10, y: 0 }, { x: 20, y: 0 }] });
  });

  it("places a note on a tap with its text still to write", () => {
    const down = pointerDown(DRAWING_TOOLS.note, IDLE, { x: 7, y: 8 });
    expect(pointerUp(DRAWING_TOOLS.note, down.state, { x: 7, y: 8 }).commit).toEqual({ kind: "note", at: { x: 7, y: 8 }, text: "" });
  });
});

describe("select tool", () => {
  const shapes: Shape[] = [
    { id: "a", frameIndex: 0, frameTimeS: 0, spanEndS: null, geometry: { kind: "ruler", a: { x: 0, y: 0 }, b: { x: 100, y: 0 } }, style: { colour: "action", stroke: "fine" }, revision: 1 },
    { id: "b", frameIndex: 0, frameTimeS: 0, spanEndS: null, geometry: { kind: "ring", center: { x: 50, y: 0 }, radiusXPx: 10, radiusYPx: 10 }, style: { colour: "fault", stroke: "fine" }, revision: 1 },
  ];

  it("selects the topmost shape under the pointer, or clears the selection on empty canvas", () => {
    expect(shapeAt(shapes, { x: 50, y: 0 }, 3)?.id).toBe("b");
    expect(selectDown(shapes, { x: 90, y: 1 }, 3).select).toBe("a");
    expect(selectDown(shapes, { x: 300, y: 300 }, 3).select).toBeNull();
  });

  it("moves the pressed shape by the drag and reports the new geometry on release", () => {
    const down = selectDown(shapes, { x: 90, y: 0 }, 3);
    const moved = selectMove(down.state, { x: 95, y: 10 }, THRESHOLD);
    expect(moved.state.name).toBe("dragging");
    expect(draggedGeometry(moved.state, shapes[0])).toEqual({ kind: "ruler", a: { x: 5, y: 10 }, b: { x: 105, y: 10 } });
    const up = selectUp(moved.state, shapes, { x: 95, y: 10 });
    expect(up.move).toEqual({ shapeId: "a", geometry: { kind: "ruler", a: { x: 5, y: 10 }, b: { x: 105, y: 10 } } });
    expect(up.state.name).toBe("idle");
  });

  it("does not move anything on a click without a drag", () => {
    const down = selectDown(shapes, { x: 90, y: 0 }, 3);
    expect(selectUp(selectMove(down.state, { x: 91, y: 0 }, THRESHOLD).state, shapes, { x: 91, y: 0 }).move).toBeUndefined();
  });
});
