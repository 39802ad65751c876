// The conversion job: fetch the set's original clip, make an H.264 copy beside it, and mark the clip
// ready, or failed with the reason. A set that moved on meanwhile (new clip) discards the copy.
import "server-only";
import { mkdtemp, rm } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { clipAwaitingConversion, failClipConversion, finishClipConversion } from "@/db/queries/clips";
import { convertToH264 } from "@/lib/clips/convert";
import { deleteObject, downloadToFile, folderOf, uploadFile } from "@/lib/clips/storage";

export type ConversionOutcome = "ready" | "failed" | "skipped";

const FAILED_MESSAGE = "The clip could not be converted to a format this browser plays.";

export async function convertClip(setId: string): Promise<ConversionOutcome> {
  const clip = await clipAwaitingConversion(setId);
  if (!clip) return "skipped";
  const work = await mkdtemp(path.join(tmpdir(), "plumbline-convert-"));
  const convertedKey = `${folderOf(clip.storageKey)}converted.mp4`;
  try {
    const input = path.join(work, "original");
    const output = path.join(work, "converted.mp4");
    await downloadToFile(clip.storageKey, input);
    await convertToH264(input, output);
    await uploadFile(convertedKey, output, "video/mp4");
    if (await finishClipConversion(setId, clip.storageKey, convertedKey)) return "ready";
    await deleteObject(convertedKey);
    return "skipped";
  } catch (error) {
    console.error(`[jobs] converting the clip of set ${setId} failed:`, error);
    await failClipConversion(setId, clip.storageKey, FAILED_MESSAGE);
    return "failed";
  } finally {
    await rm(work, { recursive: true, force: true });
  }
}
