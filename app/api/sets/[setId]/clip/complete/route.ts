// POST: finishes the multipart upload and checks the stored clip (size, content, duration). A refused
// clip is deleted and the set goes back to having none, so a retry starts clean.
import { requireSession, requireSetAccess } from "@/lib/access";
import { ApiError, parseOrThrow, readJson, withErrors } from "@/lib/errors";
import { completeClipUploadSchema } from "@/lib/validation/clip";
import { clipStateOf, dropClipUpload, finishClipUpload, requireCurrentUpload } from "@/db/queries/clips";
import { findSet } from "@/db/queries/sets";
import { partCountFor } from "@/lib/clips/limits";
import { abortMultipartUpload, completeMultipartUpload, deleteObject } from "@/lib/clips/storage";
import { verifyStoredClip } from "@/lib/clips/verify";
import { clipView } from "@/lib/clips/view";

type Context = { params: Promise<{ setId: string }> };

export const POST = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireSession(request);
  const set = await requireSetAccess(viewer, (await params).setId);
  const data = parseOrThrow(completeClipUploadSchema, await readJson(request, "upload"), "upload");
  const upload = requireCurrentUpload(set, data.uploadId);
  const expectedParts = partCountFor(upload.sizeBytes);
  if (data.parts.length !== expectedParts) {
    throw new ApiError("bad_request:upload", `The clip has ${expectedParts} parts but ${data.parts.length} were listed. Resume the upload.`);
  }
  try {
    await completeMultipartUpload(upload.storageKey, upload.uploadId, data.parts);
  } catch {
    throw new ApiError("bad_request:upload", "Some parts of the clip did not arrive intact. Resume the upload to send them again.");
  }
  let checked;
  try {
    checked = await verifyStoredClip(upload.storageKey, upload.sizeBytes);
  } catch (error) {
    await deleteObject(upload.storageKey);
    await abortMultipartUpload(upload.storageKey, upload.uploadId);
    await dropClipUpload(set.id, upload.uploadId);
    throw error;
  }
  if (!(await finishClipUpload(set.id, upload.uploadId, checked))) {
    await deleteObject(upload.storageKey);
    throw new ApiError("conflict:upload", "Another upload replaced this one while it was being checked.");
  }
  const updated = await findSet(set.id);
  return Response.json({ clip: await clipView(clipStateOf(updated ?? set)) });
});
