// Frames the page sends to the worker (decoded by its <video> element), as the async iterable the
// pipeline reads. Each frame the pipeline takes is reported back, so the page sends only a few ahead.
import type { ClipFrame } from "@/lib/pipeline";

export class FrameInbox implements AsyncIterable<ClipFrame> {
  private readonly queue: ClipFrame[] = [];
  private closed = false;
  private taken = 0;
  private wake: (() => void) | null = null;

  constructor(private readonly onTaken: (framesTaken: number) => void) {}

  push(frame: ClipFrame): void {
    if (this.closed) return;
    this.queue.push(frame);
    this.notify();
  }

  /** No more frames: the pipeline finishes with those already queued. */
  close(): void {
    this.closed = true;
    this.notify();
  }

  private notify(): void {
    const wake = this.wake;
    this.wake = null;
    wake?.();
  }

  async *[Symbol.asyncIterator](): AsyncGenerator<ClipFrame> {
    for (;;) {
      const frame = this.queue.shift();
      if (frame) {
        this.taken += 1;
        this.onTaken(this.taken);
        yield frame;
      } else if (this.closed) return;
      else await new Promise<void>((resolve) => (this.wake = resolve));
    }
  }
}
