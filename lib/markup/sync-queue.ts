// Saving markup as it changes without losing work: every edit becomes a pending write of one shape,
// kept in (local) storage until the server confirms it, retried with back-off while the connection is
// down, and flushed again when the page comes back. Only the newest write per shape is kept, since the
// server applies the highest revision anyway (last write wins per shape).
import type { MarkupShapeInput } from "@/lib/validation/markup";

export type PendingOp =
  | { type: "put"; shapeId: string; revision: number; body: MarkupShapeInput }
  | { type: "delete"; shapeId: string; revision: number };

/** The part of the Web Storage API the queue uses (localStorage in the browser). */
export interface QueueStorage {
  getItem(key: string): string | null;
  setItem(key: string, value: string): void;
  removeItem(key: string): void;
}

/** done: confirmed; retry: try again later (offline, server trouble); drop: the server refused it for good. */
export type SendResult = "done" | "retry" | "drop";

export interface SyncQueueOptions {
  storage: QueueStorage | null;
  storageKey: string;
  send: (op: PendingOp) => Promise<SendResult>;
  onChange?: (pending: readonly PendingOp[]) => void;
  onDropped?: (op: PendingOp) => void;
  schedule?: (run: () => void, delayMs: number) => void;
}

export interface SyncQueue {
  enqueue(op: PendingOp): void;
  /** Sends what is pending, in order, until done or a send asks to retry. */
  flush(): Promise<void>;
  pending(): readonly PendingOp[];
}

/** Retry delays double from 1 s up to 30 s (common practice: capped exponential back-off). */
export function retryDelayMs(attempt: number): number {
  return Math.min(30_000, 1_000 * 2 ** Math.max(0, attempt - 1));
}

function isPendingOp(value: unknown): value is PendingOp {
  if (typeof value !== "object" || value === null) return false;
  const op = value as Record<string, unknown>;
  return (op.type === "put" || op.type === "delete") && typeof op.shapeId === "string" && typeof op.revision === "number";
}

function load(storage: QueueStorage | null, key: string): PendingOp[] {
  try {
    const parsed: unknown = JSON.parse(storage?.getItem(key) ?? "[]");
    return Array.isArray(parsed) ? parsed.filter(isPendingOp) : [];
  } catch {
    return [];
  }
}

export function createSyncQueue(options: SyncQueueOptions): SyncQueue {
  const { storage, storageKey, send } = options;
  const schedule = options.schedule ?? ((run, delayMs) => void setTimeout(run, delayMs));
  let ops = load(storage, storageKey);
  let flushing = false;
  let attempt = 0;
  let retryScheduled = false;

  function persist(): void {
    try {
      if (ops.length === 0) storage?.removeItem(storageKey);
      else storage?.setItem(storageKey, JSON.stringify(ops));
    } catch {
      // Storage full or blocked: the edits still go out from memory while the page stays open.
    }
    options.onChange?.(ops);
  }

  function without(op: PendingOp): void {
    const before = ops.length;
    ops = ops.filter((o) => o !== op);
    if (ops.length !== before) persist();
  }

  async function flush(): Promise<void> {
    if (flushing) return;
    flushing = true;
    try {
      while (ops.length > 0) {
        const op = ops[0];
        let result: SendResult;
        try {
          result = await send(op);
        } catch {
          result = "retry";
        }
        if (result === "retry") {
          attempt += 1;
          if (!retryScheduled) {
            retryScheduled = true;
            schedule(() => {
              retryScheduled = false;
              void flush();
            }, retryDelayMs(attempt));
          }
          return;
        }
        attempt = 0;
        if (result === "drop") options.onDropped?.(op);
        // A newer write of the same shape may have replaced this one meanwhile; it stays queued.
        without(op);
      }
    } finally {
      flushing = false;
    }
  }

  return {
    enqueue(op) {
      const index = ops.findIndex((o) => o.shapeId === op.shapeId);
      if (index === -1) ops = [...ops, op];
      else if (ops[index].revision <= op.revision) ops = ops.map((o, i) => (i === index ? op : o));
      else return;
      persist();
      void flush();
    },
    flush,
    pending: () => ops,
  };
}
