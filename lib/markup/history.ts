// Undo and redo over markup edits. Each entry remembers a shape before and after one edit (null: absent);
// undoing writes the "before" back as a new revision, so it syncs like any other edit.
import type { Shape } from "./shape";

export interface Change {
  shapeId: string;
  before: Shape | null;
  after: Shape | null;
}

export interface History {
  past: Change[];
  future: Change[];
}

/** Enough for a review session; the oldest edits fall off (common practice for editor undo stacks). */
export const HISTORY_LIMIT = 200;

export const EMPTY_HISTORY: History = { past: [], future: [] };

export function record(history: History, change: Change): History {
  return { past: [...history.past, change].slice(-HISTORY_LIMIT), future: [] };
}

/** The state to restore for one shape, and the history after the step; null when there is nothing to undo. */
export function undo(history: History): { history: History; restore: { shapeId: string; shape: Shape | null } } | null {
  const change = history.past[history.past.length - 1];
  if (!change) return null;
  return {
    history: { past: history.past.slice(0, -1), future: [change, ...history.future] },
    restore: { shapeId: change.shapeId, shape: change.before },
  };
}

export function redo(history: History): { history: History; restore: { shapeId: string; shape: Shape | null } } | null {
  const [change, ...rest] = history.future;
  if (!change) return null;
  return { history: { past: [...history.past, change], future: rest }, restore: { shapeId: change.shapeId, shape: change.after } };
}
