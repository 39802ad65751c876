"use client";
// The markup of one set in the browser: loads the saved shapes, applies edits at once, records them for
// undo/redo and hands each one to the save queue (kept in localStorage, retried until the server has it).
import { useQuery } from "@tanstack/react-query";
import { useCallback, useEffect, useMemo, useReducer, useRef, useState } from "react";
import { ApiError, apiFetch } from "@/lib/client/api";
import { EMPTY_HISTORY, record, redo as redoStep, undo as undoStep, type History } from "@/lib/markup/history";
import { toShapeInput, type Shape } from "@/lib/markup/shape";
import { EMPTY_MARKUP, mergeServer, nextRevision, putShape, removeShape, shapeList, type MarkupState } from "@/lib/markup/store";
import { createSyncQueue, type PendingOp, type SendResult, type SyncQueue } from "@/lib/markup/sync-queue";
import { markupListResponseSchema, markupPutResponseSchema } from "@/lib/validation/markup";

function storageOrNull(): Storage | null {
  try {
    return window.localStorage;
  } catch {
    return null;
  }
}

async function send(setId: string, op: PendingOp): Promise<SendResult> {
  try {
    const path = `/api/sets/${setId}/markup/${op.shapeId}`;
    if (op.type === "put") await apiFetch(path, { method: "PUT", body: op.body, schema: markupPutResponseSchema });
    else await apiFetch(`${path}?revision=${op.revision}`, { method: "DELETE" });
    return "done";
  } catch (error) {
    // Offline, signed out for a moment, or the server in trouble: keep it and try again.
    if (!(error instanceof ApiError) || error.status === 0 || error.status === 401 || error.status === 429 || error.status >= 500) return "retry";
    return "drop";
  }
}

export interface MarkupApi {
  shapes: Shape[];
  canEdit: boolean;
  loaded: boolean;
  pendingCount: number;
  /** A message when the server refused an edit for good (e.g. access withdrawn). */
  problem: string | null;
  create(shape: Omit<Shape, "revision">): void;
  update(shapeId: string, change: Partial<Omit<Shape, "id" | "revision">>): void;
  remove(shapeId: string): void;
  undo(): void;
  redo(): void;
  canUndo: boolean;
  canRedo: boolean;
}

export function useMarkup(setId: string, mayEdit: boolean): MarkupApi {
  const stateRef = useRef<MarkupState>(EMPTY_MARKUP);
  const historyRef = useRef<History>(EMPTY_HISTORY);
  const queueRef = useRef<SyncQueue | null>(null);
  const [, rerender] = useReducer((n: number) => n + 1, 0);
  const [pendingCount, setPendingCount] = useState(0);
  const [problem, setProblem] = useState<string | null>(null);

  const query = useQuery({
    queryKey: ["sets", setId, "markup"],
    queryFn: () => apiFetch(`/api/sets/${setId}/markup`, { schema: markupListResponseSchema }),
    // Another tab or another coach may be drawing on the same set: pick up their shapes now and then.
    refetchInterval: 30_000,
    refetchOnWindowFocus: true,
  });

  useEffect(() => {
    const queue = createSyncQueue({
      storage: storageOrNull(),
      storageKey: `plumbline:markup:${setId}:pending`,
      send: (op) => send(setId, op),
      onChange: (pending) => setPendingCount(pending.length),
      onDropped: () => setProblem("An edit to the markup was refused by the server and was not saved."),
    });
    queueRef.current = queue;
    setPendingCount(queue.pending().length);
    void queue.flush();
    const online = () => void queue.flush();
    window.addEventListener("online", online);
    return () => {
      window.removeEventListener("online", online);
      queueRef.current = null;
    };
  }, [setId]);

  useEffect(() => {
    if (!query.data) return;
    const pendingIds = new Set((queueRef.current?.pending() ?? []).map((op) => op.shapeId));
    const server: Shape[] = query.data.shapes.map((s) => ({
      id: s.id,
      frameIndex: s.frameIndex,
      frameTimeS: s.frameTimeS,
      spanEndS: s.spanEndS,
      geometry: s.geometry,
      style: s.style,
      revision: s.revision,
    }));
    // Pending edits saved in this browser before a reload go on top of what the server has.
    const queued = new Map((queueRef.current?.pending() ?? []).map((op) => [op.shapeId, op]));
    let state = mergeServer(stateRef.current, server, pendingIds);
    for (const op of queued.values()) {
      state = op.type === "put" ? putShape(state, { id: op.shapeId, ...op.body }) : removeShape(state, op.shapeId, op.revision);
    }
    stateRef.current = state;
    rerender();
  }, [query.data]);

  const canEdit = mayEdit && (query.data?.canEdit ?? false);

  /** Writes one shape's new state (null: deleted) at the next revision; returns what was written. */
  const write = useCallback((shapeId: string, next: Omit<Shape, "revision"> | null): Shape | null => {
    const revision = nextRevision(stateRef.current, shapeId);
    if (next) {
      const shape = { ...next, revision };
      stateRef.current = putShape(stateRef.current, shape);
      queueRef.current?.enqueue({ type: "put", shapeId, revision, body: toShapeInput(shape) });
      rerender();
      return shape;
    }
    stateRef.current = removeShape(stateRef.current, shapeId, revision);
    queueRef.current?.enqueue({ type: "delete", shapeId, revision });
    rerender();
    return null;
  }, []);

  const edit = useCallback(
    (shapeId: string, next: Omit<Shape, "revision"> | null) => {
      if (!canEdit) return;
      const before = stateRef.current.shapes[shapeId] ?? null;
      const after = write(shapeId, next);
      historyRef.current = record(historyRef.current, { shapeId, before, after });
    },
    [canEdit, write],
  );

  const step = useCallback(
    (direction: "undo" | "redo") => {
      if (!canEdit) return;
      const result = direction === "undo" ? undoStep(historyRef.current) : redoStep(historyRef.current);
      if (!result) return;
      historyRef.current = result.history;
      write(result.restore.shapeId, result.restore.shape);
    },
    [canEdit, write],
  );

  const state = stateRef.current;
  const shapes = useMemo(() => shapeList(state), [state]);
  return {
    shapes,
    canEdit,
    loaded: query.isSuccess,
    pendingCount,
    problem,
    create: (shape) => edit(shape.id, shape),
    update: (shapeId, change) => {
      const current = stateRef.current.shapes[shapeId];
      if (current) edit(shapeId, { ...current, ...change });
    },
    remove: (shapeId) => {
      if (stateRef.current.shapes[shapeId]) edit(shapeId, null);
    },
    undo: () => step("undo"),
    redo: () => step("redo"),
    canUndo: canEdit && historyRef.current.past.length > 0,
    canRedo: canEdit && historyRef.current.future.length > 0,
  };
}
