// Checks a freshly uploaded clip where it is stored: the size the browser declared, the content's first
// bytes (a video container, whatever the file was called), and a duration and picture ffprobe can read.
import "server-only";
import { ApiError } from "@/lib/errors";
import type { CheckedClip } from "@/db/queries/clips";
import { MAX_CLIP_BYTES, MAX_CLIP_DURATION_S, formatMegabytes } from "./limits";
import { ClipProbeError, probeClip } from "./probe";
import { SNIFF_BYTES, sniffVideo } from "./sniff";
import { objectSize, presignRead, readHead } from "./storage";

/** ffprobe's read URL only has to outlive the probe itself. */
const PROBE_URL_TTL_S = 120;

const refuse = (message: string) => new ApiError("bad_request:clip", message);

export async function verifyStoredClip(key: string, declaredSizeBytes: number): Promise<CheckedClip> {
  const sizeBytes = await objectSize(key);
  if (sizeBytes === null) throw refuse("The uploaded clip is missing from storage. Upload it again.");
  if (sizeBytes > MAX_CLIP_BYTES) {
    throw refuse(`The clip is larger than ${formatMegabytes(MAX_CLIP_BYTES)}. Trim it to the set and try again.`);
  }
  if (sizeBytes !== declaredSizeBytes) {
    throw refuse(`The upload holds ${sizeBytes} bytes but the clip has ${declaredSizeBytes}: some parts are missing or doubled. Upload it again.`);
  }
  const sniffed = sniffVideo(await readHead(key, SNIFF_BYTES));
  if (sniffed.kind !== "video") throw refuse(`This file is not a video we can read. ${sniffed.reason}`);
  let probe;
  try {
    probe = await probeClip(await presignRead(key, PROBE_URL_TTL_S));
  } catch (error) {
    if (error instanceof ClipProbeError) throw refuse(error.message);
    throw error;
  }
  if (probe.durationS > MAX_CLIP_DURATION_S) {
    throw refuse(
      `The clip is ${Math.round(probe.durationS)} s long; the limit is ${MAX_CLIP_DURATION_S / 60} minutes. Trim it to the set and try again.`,
    );
  }
  return { sizeBytes, container: sniffed.container, ...probe };
}
