// POST: presigned URLs the browser PUTs upload parts to. GET ?uploadId=: the parts already stored,
// so an interrupted upload resumes where it stopped.
import { requireSession, requireSetAccess } from "@/lib/access";
import { ApiError, parseOrThrow, readJson, withErrors } from "@/lib/errors";
import { presignPartsSchema, uploadIdQuerySchema } from "@/lib/validation/clip";
import { requireCurrentUpload } from "@/db/queries/clips";
import { partCountFor } from "@/lib/clips/limits";
import { listUploadedParts, presignPart } from "@/lib/clips/storage";

type Context = { params: Promise<{ setId: string }> };

export const GET = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireSession(request);
  const set = await requireSetAccess(viewer, (await params).setId);
  const { uploadId } = parseOrThrow(uploadIdQuerySchema, Object.fromEntries(new URL(request.url).searchParams), "upload");
  const upload = requireCurrentUpload(set, uploadId);
  return Response.json({ parts: await listUploadedParts(upload.storageKey, uploadId) });
});

export const POST = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireSession(request);
  const set = await requireSetAccess(viewer, (await params).setId);
  const data = parseOrThrow(presignPartsSchema, await readJson(request, "upload"), "upload");
  const upload = requireCurrentUpload(set, data.uploadId);
  const partCount = partCountFor(upload.sizeBytes);
  const beyond = data.partNumbers.find((n) => n > partCount);
  if (beyond !== undefined) {
    throw new ApiError("bad_request:upload", `Part ${beyond} is beyond the clip's ${partCount} part${partCount === 1 ? "" : "s"}.`);
  }
  const parts = await Promise.all(
    data.partNumbers.map(async (partNumber) => ({ partNumber, url: await presignPart(upload.storageKey, upload.uploadId, partNumber) })),
  );
  return Response.json({ parts });
});
