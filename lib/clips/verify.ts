// Checks a freshly uploaded clip where it is stored: the size the browser declared, the content's first
// bytes (a video container, whatever the file was called), and a duration and picture ffprobe can read.
import "server-only";
import { ApiError } from "@/lib/errors";
import type { CheckedClip } from "@/db/queries/clips";
import { MAX_CLIP_BYTES, MAX_CLIP_DURATION_S, MAX_CLIP_SIDE_PX, MIN_CLIP_DURATION_S, MIN_CLIP_SIDE_PX, formatMegabytes } from "./limits";
import { ClipProbeError, lastPictureEndS, probeClip } from "./probe";
import { SNIFF_BYTES, sniffVideo } from "./sniff";
import { objectSize, presignRead, readHead } from "./storage";

/** ffprobe's read URL only has to outlive the probe itself. */
const PROBE_URL_TTL_S = 120;

const refuse = (message: string) => new ApiError("bad_request:clip", message);

/** How far the pictures may stop before the stated duration (audio often runs a little longer; common practice). */
const toleranceS = (durationS: number) => Math.max(0.5, durationS * 0.05);

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
  let picturesEndS;
  try {
    const url = await presignRead(key, PROBE_URL_TTL_S);
    probe = await probeClip(url);
    picturesEndS = await lastPictureEndS(url, probe.durationS - 3);
  } catch (error) {
    if (error instanceof ClipProbeError) throw refuse(error.message);
    throw error;
  }
  if (probe.durationS > MAX_CLIP_DURATION_S) {
    throw refuse(
      `The clip is ${Math.round(probe.durationS)} s long; the limit is ${MAX_CLIP_DURATION_S / 60} minutes. Trim it to the set and try again.`,
    );
  }
  if (picturesEndS < probe.durationS - toleranceS(probe.durationS)) {
    throw refuse(
      `The video is cut short: its pictures stop at ${picturesEndS.toFixed(1)} s of ${probe.durationS.toFixed(1)} s. Export it again and retry.`,
    );
  }
  if (probe.durationS < MIN_CLIP_DURATION_S) {
    throw refuse(`The clip is only ${probe.durationS.toFixed(2)} s long; film the whole set and try again.`);
  }
  const sides = [probe.widthPx, probe.heightPx];
  if (Math.min(...sides) < MIN_CLIP_SIDE_PX || Math.max(...sides) > MAX_CLIP_SIDE_PX) {
    throw refuse(
      `The picture is ${probe.widthPx}×${probe.heightPx} pixels; clips between ${MIN_CLIP_SIDE_PX} and ${MAX_CLIP_SIDE_PX} pixels a side can be analysed.`,
    );
  }
  return { sizeBytes, container: sniffed.container, ...probe };
}
