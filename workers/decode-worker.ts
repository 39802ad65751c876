// Decodes a clip for the analysis worker, in a worker of its own. WebCodecs hands decoded frames back
// (and takes the next packets) on the thread that owns the decoder; in the analysis worker that
// thread is busy with pose for tens of milliseconds at a time, so decoding stalled meanwhile. Here
// the thread is idle, so decoding overlaps tracking and pose. Frames go over as transferred
// VideoFrames, at most DECODE_AHEAD_FRAMES ahead of those the analysis worker released.
import { ALL_FORMATS, BlobSource, Input, VideoSampleSink } from "mediabunny";
import { DECODE_AHEAD_FRAMES, decodeRequestSchema, type DecodeResponse } from "./decode-messages";

const scope = self as unknown as DedicatedWorkerGlobalScope;

let sent = 0;
let released = 0;
let wake: (() => void) | null = null;

function post(message: DecodeResponse, transfer: Transferable[] = []): void {
  scope.postMessage(message, transfer);
}

async function decode(clip: Blob): Promise<void> {
  const input = new Input({ source: new BlobSource(clip), formats: ALL_FORMATS });
  try {
    const video = await input.getPrimaryVideoTrack();
    if (!video) throw new Error("The file has no video track");
    for await (const sample of new VideoSampleSink(video).samples()) {
      try {
        while (sent - released >= DECODE_AHEAD_FRAMES) await new Promise<void>((resolve) => (wake = resolve));
        const frame = sample.toVideoFrame();
        post({ type: "frame", tS: sample.timestamp, rotation: sample.rotation, flip: sample.flip, frame }, [frame]);
        sent += 1;
      } finally {
        sample.close();
      }
    }
    post({ type: "end" });
  } catch (error) {
    post({ type: "error", message: error instanceof Error ? error.message : String(error) });
  } finally {
    input.dispose();
  }
}

scope.onmessage = (event: MessageEvent<unknown>) => {
  const parsed = decodeRequestSchema.safeParse(event.data);
  if (!parsed.success) {
    post({ type: "error", message: `bad request: ${parsed.error.issues[0].message}` });
    return;
  }
  const request = parsed.data;
  if (request.type === "decode") {
    void decode(request.clip);
    return;
  }
  released = Math.max(released, request.framesReleased);
  const resume = wake;
  wake = null;
  resume?.();
};
