// Picks how the browser turns a clip into frames for the analysis. WebCodecs in the worker gives every
// frame with its exact time and costs least; when WebCodecs is missing or cannot decode the clip's codec
// but the page's <video> element can play it, the element is played (and seeked where it skipped a
// frame) on the page and each frame is drawn and handed to the worker. With neither, the server makes
// an H.264 copy. Pure, so the rule is tested without a browser.

export const FRAME_DECODERS = ["webcodecs", "video-element"] as const;
export type FrameDecoder = (typeof FRAME_DECODERS)[number];

export interface DecoderCapabilities {
  /** `VideoDecoder` exists on the page (a worker of the same page has it too). */
  videoDecoder: boolean;
  /** `VideoDecoder.isConfigSupported` accepted the clip's decoder configuration. */
  webCodecsDecodes: boolean;
  /** `HTMLVideoElement.canPlayType` for the clip's MIME type with its codec string. */
  videoElementPlays: "" | "maybe" | "probably";
  /** `requestVideoFrameCallback`, which names the presentation time of each frame the element shows. */
  videoFrameCallback: boolean;
}

/** The decoder to use, or null when this browser can decode the clip neither way. */
export function chooseFrameDecoder(capabilities: DecoderCapabilities): FrameDecoder | null {
  if (capabilities.videoDecoder && capabilities.webCodecsDecodes) return "webcodecs";
  // Without frame callbacks the element cannot tell which frame it shows, so exact frame times are lost.
  if (capabilities.videoElementPlays !== "" && capabilities.videoFrameCallback) return "video-element";
  return null;
}
