// The markup save queue: writes survive a reload (storage), wait out a dropped connection with
// back-off, keep only the newest write per shape, and never drop a newer write queued mid-flight.
import { describe, expect, it } from "vitest";
import { createSyncQueue, retryDelayMs, type PendingOp, type QueueStorage, type SendResult } from "@/lib/markup/sync-queue";

function memoryStorage(): QueueStorage & { data: Map<string, string> } {
  const data = new Map<string, string>();
  return { data, getItem: (k) => data.get(k) ?? null, setItem: (k, v) => void data.set(k, v), removeItem: (k) => void data.delete(k) };
}

const body = (revision: number) => ({
  frameIndex: 1,
  frameTimeS: 0.03,
  spanEndS: null,
  geometry: { kind: "arrow" as const, from: { x: 0, y: 0 }, to: { x: 1, y: 1 } },
  style: { colour: "action" as const, stroke: "fine" as const },
  revision,
});
const put = (shapeId: string, revision: number): PendingOp => ({ type: "put", shapeId, revision, body: body(revision) });

describe("markup sync queue", () => {
  it("keeps unsent writes in storage and a new page picks them up and sends them", async () => {
    const storage = memoryStorage();
    const timers: (() => void)[] = [];
    const offline = createSyncQueue({ storage, storageKey: "k", send: async () => "retry", schedule: (run) => void timers.push(run) });
    offline.enqueue(put("a", 1));
    offline.enqueue({ type: "delete", shapeId: "b", revision: 2 });
    await offline.flush();
    expect(JSON.parse(storage.data.get("k") ?? "[]")).toHaveLength(2);
    expect(timers).toHaveLength(1);

    const sent: PendingOp[] = [];
    const reloaded = createSyncQueue({ storage, storageKey: "k", send: async (op) => (sent.push(op), "done") });
    expect(reloaded.pending()).toHaveLength(2);
    await reloaded.flush();
    expect(sent.map((op) => `${op.type}:${op.shapeId}`)).toEqual(["put:a", "delete:b"]);
    expect(storage.data.has("k")).toBe(false);
  });

  it("retries after a failure with back-off and sends once the connection is back", async () => {
    const timers: { run: () => void; delayMs: number }[] = [];
    let online = false;
    const sent: number[] = [];
    const queue = createSyncQueue({
      storage: memoryStorage(),
      storageKey: "k",
      send: async (op): Promise<SendResult> => {
        if (!online) throw new Error("network down");
        sent.push(op.revision);
        return "done";
      },
      schedule: (run, delayMs) => void timers.push({ run, delayMs }),
    });
    queue.enqueue(put("a", 1));
    await queue.flush();
    expect(timers.map((t) => t.delayMs)).toEqual([1000]);
    timers.shift()!.run();
    await queue.flush();
    expect(timers.map((t) => t.delayMs)).toEqual([2000]);
    online = true;
    timers.shift()!.run();
    await queue.flush();
    expect(sent).toEqual([1]);
    expect(queue.pending()).toHaveLength(0);
  });

  it("caps the back-off at 30 s", () => {
    expect([1, 2, 3, 6, 20].map(retryDelayMs)).toEqual([1000, 2000, 4000, 30000, 30000]);
  });

  it("keeps only the newest write per shape and ignores an older one", async () => {
    const queue = createSyncQueue({ storage: memoryStorage(), storageKey: "k", send: async () => "retry", schedule: () => undefined });
    queue.enqueue(put("a", 1));
    queue.enqueue(put("b", 1));
    queue.enqueue(put("a", 3));
    queue.enqueue(put("a", 2));
    expect(queue.pending().map((op) => `${op.shapeId}@${op.revision}`)).toEqual(["a@3", "b@1"]);
  });

  it("sends a newer write of a shape that was queued while the older one was in flight", async () => {
    const sent: number[] = [];
    let release: (result: SendResult) => void = () => undefined;
    const queue = createSyncQueue({
      storage: memoryStorage(),
      storageKey: "k",
      send: (op) => {
        sent.push(op.revision);
        return op.revision === 1 ? new Promise<SendResult>((resolve) => (release = resolve)) : Promise.resolve("done");
      },
    });
    queue.enqueue(put("a", 1));
    const flushing = queue.flush();
    queue.enqueue(put("a", 2));
    release("done");
    await flushing;
    await queue.flush();
    expect(sent).toEqual([1, 2]);
    expect(queue.pending()).toHaveLength(0);
  });

  it("drops and reports a write the server refuses for good", async () => {
    const dropped: PendingOp[] = [];
    const queue = createSyncQueue({ storage: memoryStorage(), storageKey: "k", send: async () => "drop", onDropped: (op) => dropped.push(op) });
    queue.enqueue(put("a", 1));
    await queue.flush();
    expect(dropped.map((op) => op.shapeId)).toEqual(["a"]);
    expect(queue.pending()).toHaveLength(0);
  });

  it("starts empty when storage holds something unreadable", () => {
    const storage = memoryStorage();
    storage.setItem("k", "{not json");
    expect(createSyncQueue({ storage, storageKey: "k", send: async () => "done" }).pending()).toEqual([]);
    storage.setItem("k", JSON.stringify([{ type: "put" }, put("a", 1)]));
    expect(createSyncQueue({ storage, storageKey: "k", send: async () => "done" }).pending()).toHaveLength(1);
  });
});
