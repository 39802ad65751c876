// The markup a player holds: live shapes by id, plus the last revision of every deleted one so a
// shape brought back by undo outranks its own deletion. Pure functions over plain data.
import type { Shape } from "./shape";

export interface MarkupState {
  shapes: Record<string, Shape>;
  /** Revision at which each deleted shape was deleted. */
  deleted: Record<string, number>;
}

export const EMPTY_MARKUP: MarkupState = { shapes: {}, deleted: {} };

/** The revision the next write of this shape must carry. */
export function nextRevision(state: MarkupState, shapeId: string): number {
  return Math.max(state.shapes[shapeId]?.revision ?? 0, state.deleted[shapeId] ?? 0) + 1;
}

export function putShape(state: MarkupState, shape: Shape): MarkupState {
  const { [shape.id]: _gone, ...deleted } = state.deleted;
  return { shapes: { ...state.shapes, [shape.id]: shape }, deleted };
}

export function removeShape(state: MarkupState, shapeId: string, revision: number): MarkupState {
  const { [shapeId]: _gone, ...shapes } = state.shapes;
  return { shapes, deleted: { ...state.deleted, [shapeId]: revision } };
}

/**
 * Merges what the server sent with local edits it has not seen yet (pending writes win, since they
 * carry higher revisions and are on their way).
 */
export function mergeServer(state: MarkupState, server: readonly Shape[], pendingIds: ReadonlySet<string>): MarkupState {
  const shapes: Record<string, Shape> = {};
  for (const shape of server) if (!pendingIds.has(shape.id)) shapes[shape.id] = shape;
  const deleted: Record<string, number> = {};
  for (const id of pendingIds) {
    if (state.shapes[id]) shapes[id] = state.shapes[id];
    else if (state.deleted[id] !== undefined) deleted[id] = state.deleted[id];
  }
  return { shapes, deleted };
}

/**
 * Shapes in drawing order: by frame, then in the order they were made (the server lists them by creation
 * and new shapes are added last; object keys that are not integers keep insertion order, and the sort is stable).
 */
export function shapeList(state: MarkupState): Shape[] {
  return Object.values(state.shapes).sort((a, b) => a.frameIndex - b.frameIndex);
}
