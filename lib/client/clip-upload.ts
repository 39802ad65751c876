// Uploads a clip the way the server expects: start (or resume) a multipart upload, PUT the parts
// straight to storage through presigned URLs (a few at a time, with progress), then complete it.
// A failed or interrupted upload resumes by asking which parts storage already holds.
import { apiFetch, ApiError } from "./api";
import { clipResponseSchema, partUrlsSchema, uploadedPartsSchema, uploadStartedSchema, type ClipViewData } from "./clip-responses";

/** Parts in flight at once: enough to fill a phone's uplink, few enough to keep memory low (common practice). */
const PARALLEL_PARTS = 3;
/** Part URLs asked for per request. */
const PRESIGN_BATCH = 12;

export interface UploadProgress {
  sentBytes: number;
  totalBytes: number;
}

export interface UploadOptions {
  setId: string;
  file: Blob;
  onProgress?: (progress: UploadProgress) => void;
  signal?: AbortSignal;
}

interface Upload {
  uploadId: string;
  partSizeBytes: number;
  partCount: number;
}

const base = (setId: string) => `/api/sets/${encodeURIComponent(setId)}/clip`;

/** The upload in progress for this file (same size), or a new one. */
async function startOrResume(setId: string, file: Blob): Promise<{ upload: Upload; done: Map<number, string> }> {
  const { clip } = await apiFetch(base(setId), { schema: clipResponseSchema });
  if (clip.status === "uploading" && clip.upload && clip.sizeBytes === file.size) {
    const listed = await apiFetch(`${base(setId)}/parts?uploadId=${encodeURIComponent(clip.upload.uploadId)}`, { schema: uploadedPartsSchema });
    const expected = (n: number) => Math.min(clip.upload!.partSizeBytes, file.size - (n - 1) * clip.upload!.partSizeBytes);
    const done = new Map(listed.parts.filter((p) => p.sizeBytes === expected(p.partNumber)).map((p) => [p.partNumber, p.etag]));
    return { upload: clip.upload, done };
  }
  const started = await apiFetch(base(setId), {
    method: "POST",
    body: { sizeBytes: file.size, contentType: file.type || "application/octet-stream", fileName: file instanceof File ? file.name : null },
    schema: uploadStartedSchema,
  });
  return { upload: started.upload, done: new Map() };
}

/** PUTs one part with XMLHttpRequest (fetch reports no upload progress); resolves with storage's ETag. */
function putPart(url: string, body: Blob, onSent: (bytes: number) => void, signal?: AbortSignal): Promise<string> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open("PUT", url);
    xhr.upload.onprogress = (event) => onSent(event.loaded);
    xhr.onload = () => {
      const etag = xhr.getResponseHeader("ETag");
      if (xhr.status >= 200 && xhr.status < 300 && etag) resolve(etag);
      else reject(new ApiError(xhr.status, "upload", `Storage refused a part of the clip (status ${xhr.status}). Retry to resume.`));
    };
    xhr.onerror = () => reject(new ApiError(0, "network", "The connection dropped during the upload. Retry to resume where it stopped."));
    xhr.onabort = () => reject(new DOMException("Upload cancelled", "AbortError"));
    signal?.addEventListener("abort", () => xhr.abort(), { once: true });
    xhr.send(body);
  });
}

async function presign(setId: string, uploadId: string, partNumbers: number[]): Promise<Map<number, string>> {
  const urls = new Map<number, string>();
  for (let i = 0; i < partNumbers.length; i += PRESIGN_BATCH) {
    const batch = partNumbers.slice(i, i + PRESIGN_BATCH);
    const { parts } = await apiFetch(`${base(setId)}/parts`, { method: "POST", body: { uploadId, partNumbers: batch }, schema: partUrlsSchema });
    for (const part of parts) urls.set(part.partNumber, part.url);
  }
  return urls;
}

export async function uploadClip({ setId, file, onProgress, signal }: UploadOptions): Promise<ClipViewData> {
  const { upload, done } = await startOrResume(setId, file);
  const sliceOf = (n: number) => file.slice((n - 1) * upload.partSizeBytes, n * upload.partSizeBytes);
  const sent = new Map<number, number>();
  for (const n of done.keys()) sent.set(n, sliceOf(n).size);
  const report = () => onProgress?.({ sentBytes: [...sent.values()].reduce((a, b) => a + b, 0), totalBytes: file.size });
  report();
  const missing = Array.from({ length: upload.partCount }, (_, i) => i + 1).filter((n) => !done.has(n));
  const urls = await presign(setId, upload.uploadId, missing);
  const queue = [...missing];
  const worker = async () => {
    for (let n = queue.shift(); n !== undefined; n = queue.shift()) {
      const partNumber = n;
      const etag = await putPart(urls.get(partNumber) as string, sliceOf(partNumber), (bytes) => {
        sent.set(partNumber, bytes);
        report();
      }, signal);
      done.set(partNumber, etag);
    }
  };
  await Promise.all(Array.from({ length: Math.min(PARALLEL_PARTS, missing.length) }, worker));
  const parts = [...done.entries()].map(([partNumber, etag]) => ({ partNumber, etag })).sort((a, b) => a.partNumber - b.partNumber);
  const { clip } = await apiFetch(`${base(setId)}/complete`, { method: "POST", body: { uploadId: upload.uploadId, parts }, schema: clipResponseSchema });
  return clip;
}
