// Which decoder the analysis uses for a clip in a given browser, and the frame-time arithmetic of the
// <video>-element decoder.
import { describe, expect, it } from "vitest";
import { chooseFrameDecoder, type DecoderCapabilities } from "@/lib/clips/decoder-choice";
import { frameIndexAt, seekTargetS, sortedFrameTimes } from "@/lib/clips/frame-times";

const everything: DecoderCapabilities = { videoDecoder: true, webCodecsDecodes: true, videoElementPlays: "probably", videoFrameCallback: true };

describe("chooseFrameDecoder", () => {
  it("uses WebCodecs in the worker whenever it can decode the codec", () => {
    expect(chooseFrameDecoder(everything)).toBe("webcodecs");
    expect(chooseFrameDecoder({ ...everything, videoElementPlays: "" })).toBe("webcodecs");
    expect(chooseFrameDecoder({ ...everything, videoFrameCallback: false })).toBe("webcodecs");
  });

  it("falls back to the <video> element when WebCodecs is missing or refuses the codec", () => {
    expect(chooseFrameDecoder({ ...everything, videoDecoder: false, webCodecsDecodes: false })).toBe("video-element");
    expect(chooseFrameDecoder({ ...everything, webCodecsDecodes: false })).toBe("video-element");
    expect(chooseFrameDecoder({ ...everything, webCodecsDecodes: false, videoElementPlays: "maybe" })).toBe("video-element");
  });

  it("never trusts a stale answer from a missing VideoDecoder", () => {
    expect(chooseFrameDecoder({ ...everything, videoDecoder: false })).toBe("video-element");
  });

  it("gives up (server conversion) when neither can decode, or the element cannot name its frames", () => {
    expect(chooseFrameDecoder({ ...everything, webCodecsDecodes: false, videoElementPlays: "" })).toBeNull();
    expect(chooseFrameDecoder({ ...everything, videoDecoder: false, webCodecsDecodes: false, videoFrameCallback: false })).toBeNull();
  });
});

describe("frame times", () => {
  it("sorts decode-order times into presentation order, dropping repeats and pre-roll", () => {
    // B-frames: decode order 0, 3, 1, 2 frames of 1/30 s.
    expect(sortedFrameTimes([0, 0.1, 1 / 30, 2 / 30, 2 / 30, -1 / 30])).toEqual([0, 1 / 30, 2 / 30, 0.1]);
  });

  const times = sortedFrameTimes(Array.from({ length: 10 }, (_, i) => i / 30));

  it("finds the frame an element shows at a media time rounded to microseconds", () => {
    expect(frameIndexAt(times, 0)).toBe(0);
    expect(frameIndexAt(times, 0.033333)).toBe(1);
    expect(frameIndexAt(times, 0.05)).toBe(1);
    expect(frameIndexAt(times, 0.3)).toBe(9);
    expect(frameIndexAt(times, 5)).toBe(9);
    expect(frameIndexAt(times, -0.01)).toBe(-1);
  });

  it("seeks to the middle of a frame's display interval, which lands back on that frame", () => {
    expect(seekTargetS(times, 0)).toBeCloseTo(1 / 60, 12);
    expect(seekTargetS(times, 4)).toBeCloseTo(4.5 / 30, 12);
    expect(seekTargetS(times, 9)).toBeCloseTo(9.5 / 30, 12);
    for (let i = 0; i < times.length; i++) expect(frameIndexAt(times, seekTargetS(times, i))).toBe(i);
    expect(() => seekTargetS(times, 10)).toThrow(RangeError);
    expect(seekTargetS([2], 0)).toBe(2);
  });
});
