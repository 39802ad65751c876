// Bench-only Web Worker: decodes a clip with mediabunny over WebCodecs and does nothing else with
// the frames, to show how much of the analysis worker's time decoding alone needs. Optionally copies
// each frame's planes out too (what the analysis worker does at the least for pose frames).
import { ALL_FORMATS, BlobSource, Input, VideoSampleSink } from "mediabunny";

const scope = self as unknown as DedicatedWorkerGlobalScope;

scope.onmessage = async (event: MessageEvent<{ clip: Blob; copy: boolean }>) => {
  const input = new Input({ source: new BlobSource(event.data.clip), formats: ALL_FORMATS });
  try {
    const video = await input.getPrimaryVideoTrack();
    if (!video) throw new Error("no video track");
    const started = performance.now();
    let frames = 0;
    let buffer = new Uint8Array(0);
    for await (const sample of new VideoSampleSink(video).samples()) {
      try {
        if (event.data.copy) {
          const size = sample.allocationSize();
          if (buffer.length < size) buffer = new Uint8Array(size);
          await sample.copyTo(buffer);
        }
      } finally {
        sample.close();
      }
      frames += 1;
    }
    scope.postMessage({ frames, wallS: (performance.now() - started) / 1000 });
  } catch (error) {
    scope.postMessage({ error: error instanceof Error ? error.message : String(error) });
  } finally {
    input.dispose();
  }
};
