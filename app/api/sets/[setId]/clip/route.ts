// GET: the set's clip (state, facts, short-lived read URLs). POST: start a multipart upload of a new clip.
// DELETE ?uploadId=: cancel the upload in progress. Anyone who may read the set may upload its clip.
import { requireSession, requireSetAccess, requireSetReader, requireUploadAllowed } from "@/lib/access";
import { parseOrThrow, readJson, withErrors } from "@/lib/errors";
import { startClipUploadSchema, uploadIdQuerySchema } from "@/lib/validation/clip";
import { beginClipUpload, clipStateOf, dropClipUpload, requireCurrentUpload } from "@/db/queries/clips";
import { CLIP_PART_BYTES, partCountFor } from "@/lib/clips/limits";
import { abortMultipartUpload, createMultipartUpload, deleteObject, newClipFolder } from "@/lib/clips/storage";
import { clipView } from "@/lib/clips/view";
import { consumeRate } from "@/lib/rate-limit";
import { reserveUpload } from "@/db/queries/upload-quota";

type Context = { params: Promise<{ setId: string }> };

export const GET = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireSession(request);
  // Reading also admits teammates while the set is shared for peer review; writes keep requireSetAccess.
  const { set } = await requireSetReader(viewer, (await params).setId);
  return Response.json({ clip: await clipView(clipStateOf(set)) });
});

export const POST = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireSession(request);
  const set = await requireSetAccess(viewer, (await params).setId);
  await requireUploadAllowed(viewer, set);
  const data = parseOrThrow(startClipUploadSchema, await readJson(request, "clip"), "clip");
  await consumeRate("clipUpload", viewer.userId, "rate_limited:upload", "clip uploads");
  await reserveUpload(set, viewer.userId, data.sizeBytes);
  // No extension: the name the browser gave says nothing; the content is checked on completion.
  const storageKey = `${newClipFolder(set.id)}original`;
  const uploadId = await createMultipartUpload(storageKey, "application/octet-stream");
  let replaced;
  try {
    replaced = await beginClipUpload(set.id, { storageKey, uploadId, sizeBytes: data.sizeBytes });
  } catch (error) {
    await abortMultipartUpload(storageKey, uploadId);
    throw error;
  }
  if (replaced.storageKey && replaced.uploadId) await abortMultipartUpload(replaced.storageKey, replaced.uploadId);
  if (replaced.storageKey && !replaced.uploadId) await deleteObject(replaced.storageKey);
  if (replaced.convertedKey) await deleteObject(replaced.convertedKey);
  const upload = { uploadId, partSizeBytes: CLIP_PART_BYTES, partCount: partCountFor(data.sizeBytes) };
  return Response.json({ upload }, { status: 201 });
});

export const DELETE = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireSession(request);
  const set = await requireSetAccess(viewer, (await params).setId);
  const { uploadId } = parseOrThrow(uploadIdQuerySchema, Object.fromEntries(new URL(request.url).searchParams), "upload");
  const upload = requireCurrentUpload(set, uploadId);
  await abortMultipartUpload(upload.storageKey, uploadId);
  await dropClipUpload(set.id, uploadId);
  return new Response(null, { status: 204 });
});
