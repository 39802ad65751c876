// Markup edits in the browser: visibility on frames and spans, revisions, undo/redo, and merging the
// server's list with edits still on their way.
import { describe, expect, it } from "vitest";
import { EMPTY_HISTORY, HISTORY_LIMIT, record, redo, undo } from "@/lib/markup/history";
import { EMPTY_MARKUP, mergeServer, nextRevision, putShape, removeShape, shapeList } from "@/lib/markup/store";
import { isShapeVisible, type Shape } from "@/lib/markup/shape";

function shape(id: string, revision = 1, frameIndex = 10): Shape {
  return {
    id,
    frameIndex,
    frameTimeS: frameIndex / 30,
    spanEndS: null,
    geometry: { kind: "arrow", from: { x: 0, y: 0 }, to: { x: 10, y: 10 } },
    style: { colour: "action", stroke: "medium" },
    revision,
  };
}

describe("visibility", () => {
  it("shows a shape on its own frame only, unless it has a span", () => {
    const s = shape("a", 1, 30);
    expect(isShapeVisible(s, 30, 1)).toBe(true);
    expect(isShapeVisible(s, 31, 31 / 30)).toBe(false);
    // Same moment under another frame numbering (the engine's frame list instead of the track's).
    expect(isShapeVisible(s, 29, 1)).toBe(true);
    const spanned = { ...s, spanEndS: 2 };
    expect(isShapeVisible(spanned, 45, 1.5)).toBe(true);
    expect(isShapeVisible(spanned, 60, 2)).toBe(true);
    expect(isShapeVisible(spanned, 61, 61 / 30)).toBe(false);
    expect(isShapeVisible(spanned, 29, 29 / 30)).toBe(false);
  });
});

describe("revisions", () => {
  it("raises the revision past the shape's own and past its deletion", () => {
    let state = putShape(EMPTY_MARKUP, shape("a", 3));
    expect(nextRevision(state, "a")).toBe(4);
    expect(nextRevision(state, "new")).toBe(1);
    state = removeShape(state, "a", 4);
    expect(state.shapes.a).toBeUndefined();
    expect(nextRevision(state, "a")).toBe(5);
    state = putShape(state, shape("a", 5));
    expect(state.deleted.a).toBeUndefined();
  });

  it("keeps pending local edits over the server's list and takes the rest from the server", () => {
    let local = putShape(EMPTY_MARKUP, shape("mine", 4));
    local = removeShape(local, "gone", 2);
    const merged = mergeServer(local, [shape("mine", 3), shape("gone", 1), shape("theirs", 1)], new Set(["mine", "gone"]));
    expect(merged.shapes.mine.revision).toBe(4);
    expect(merged.shapes.gone).toBeUndefined();
    expect(merged.deleted.gone).toBe(2);
    // The server's shapes first, in its (creation) order, then the local edits still on their way.
    expect(shapeList(merged).map((s) => s.id)).toEqual(["theirs", "mine"]);
    expect(shapeList(putShape(merged, shape("early", 1, 2))).map((s) => s.id)).toEqual(["early", "theirs", "mine"]);
  });
});

describe("undo and redo", () => {
  it("restores the shape before an edit, then the one after it", () => {
    const before = shape("a", 1);
    const after = { ...before, revision: 2, geometry: { kind: "arrow", from: { x: 5, y: 5 }, to: { x: 15, y: 15 } } } as Shape;
    let history = record(EMPTY_HISTORY, { shapeId: "a", before: null, after: before });
    history = record(history, { shapeId: "a", before, after });
    const undone = undo(history);
    expect(undone?.restore).toEqual({ shapeId: "a", shape: before });
    const undoneTwice = undo(undone!.history);
    expect(undoneTwice?.restore).toEqual({ shapeId: "a", shape: null });
    expect(undo(undoneTwice!.history)).toBeNull();
    const redone = redo(undoneTwice!.history);
    expect(redone?.restore).toEqual({ shapeId: "a", shape: before });
    expect(redo(redo(redone!.history)!.history)).toBeNull();
  });

  it("forgets the redo branch after a new edit and keeps a bounded history", () => {
    let history = record(EMPTY_HISTORY, { shapeId: "a", before: null, after: shape("a") });
    history = undo(history)!.history;
    history = record(history, { shapeId: "b", before: null, after: shape("b") });
    expect(redo(history)).toBeNull();
    for (let i = 0; i < HISTORY_LIMIT + 10; i++) history = record(history, { shapeId: `s${i}`, before: null, after: shape(`s${i}`) });
    expect(history.past).toHaveLength(HISTORY_LIMIT);
  });
});
