// GET: the set's analysis (reps, series, set measures) and a short-lived URL of its full track.
// POST: saves what the browser's worker computed — result, model, settings, calibration — in one
// transaction, with the full per-frame track stored beside the clip; a new analysis replaces the old.
import { randomUUID } from "node:crypto";
import { requireSession, requireSetAccess, requireSetReader } from "@/lib/access";
import { ApiError, parseOrThrow, readJson, withErrors } from "@/lib/errors";
import { saveAnalysisSchema } from "@/lib/validation/analysis";
import { parseTrack, TrackInputError } from "@/lib/analysis/track";
import { getAnalysis, getAnalysisWithTrackKey, saveAnalysis } from "@/db/queries/analyses";
import { engineViewFor } from "@/lib/clips/analysis-view";
import { deleteObject, folderOf, presignRead, putJson } from "@/lib/clips/storage";
import type { LiftSet } from "@/db/schema";

type Context = { params: Promise<{ setId: string }> };

/** A 3-minute clip at 60 fps with 33 keypoints a frame stays well under this as JSON. */
const MAX_BODY_BYTES = 64 * 1024 * 1024;

export const GET = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireSession(request);
  // Reading also admits teammates while the set is shared for peer review; writes keep requireSetAccess.
  const { set } = await requireSetReader(viewer, (await params).setId);
  const found = await getAnalysisWithTrackKey(set.id);
  if (!found) throw new ApiError("not_found:analysis", "This set has not been analysed yet.");
  const { analysis, trackStorageKey } = found;
  return Response.json({ analysis, trackUrl: trackStorageKey ? await presignRead(trackStorageKey) : null });
});

function checkMatchesSet(set: LiftSet, lift: string, view: string): void {
  if (lift !== set.lift) throw new ApiError("bad_request:analysis", `The analysis is for a ${lift}, but the set is a ${set.lift}.`);
  const expected = engineViewFor(set.cameraView);
  if (view !== expected) throw new ApiError("bad_request:analysis", `The analysis used a ${view} view, but the set was filmed from the ${expected}.`);
}

function readTrack(input: unknown) {
  try {
    return parseTrack(input);
  } catch (error) {
    if (error instanceof TrackInputError) throw new ApiError("bad_request:analysis", `The track is not valid: ${error.message}`);
    throw error;
  }
}

export const POST = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireSession(request);
  const set = await requireSetAccess(viewer, (await params).setId);
  const body = parseOrThrow(saveAnalysisSchema, await readJson(request, "analysis", MAX_BODY_BYTES), "analysis");
  const track = readTrack(body.track);
  checkMatchesSet(set, body.result.settings.lift, body.result.settings.view);
  if (track.lift !== set.lift || track.view !== body.result.settings.view) {
    throw new ApiError("bad_request:analysis", "The track and the result describe different lifts or views.");
  }
  if (!set.clipStorageKey) throw new ApiError("conflict:analysis", "The set has no checked clip to analyse yet. Upload the clip first.");
  const trackStorageKey = `${folderOf(set.clipStorageKey)}tracks/${randomUUID()}.json`;
  await putJson(trackStorageKey, track);
  let saved;
  try {
    saved = await saveAnalysis(viewer, set.id, {
      model: `${body.model.id}@${body.model.version}`,
      settings: body.settings,
      calibration: body.calibration,
      result: body.result,
      trackStorageKey,
    });
  } catch (error) {
    await deleteObject(trackStorageKey);
    throw error;
  }
  await Promise.all(saved.replacedTrackKeys.map(deleteObject));
  return Response.json({ analysis: await getAnalysis(set.id) }, { status: 201 });
});
