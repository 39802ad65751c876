// Clip and track objects in S3: presigned multipart uploads straight from the browser, short-lived
// presigned reads, and the server's own reads and writes. Keys are random and scoped per set.
import "server-only";
import { randomBytes } from "node:crypto";
import { createReadStream, createWriteStream } from "node:fs";
import { stat } from "node:fs/promises";
import { Readable } from "node:stream";
import { pipeline } from "node:stream/promises";
import {
  AbortMultipartUploadCommand,
  CompleteMultipartUploadCommand,
  CreateMultipartUploadCommand,
  DeleteObjectCommand,
  GetObjectCommand,
  HeadObjectCommand,
  ListPartsCommand,
  PutObjectCommand,
  UploadPartCommand,
  type Part,
} from "@aws-sdk/client-s3";
import { getSignedUrl } from "@aws-sdk/s3-request-presigner";
import { s3Client, storageConfig } from "@/lib/storage";

/** Presigned part URLs live long enough for one part on a slow phone connection (common practice). */
export const PART_URL_TTL_S = 15 * 60;
/** Read URLs are short-lived: enough to start playback or the analysis, not to pass around. */
export const READ_URL_TTL_S = 10 * 60;

const bucket = () => storageConfig().bucket;

/**
 * A fresh folder for one clip of one set: `sets/<setId>/<128 random bits>/`. The random part makes
 * keys unguessable; the set id keeps every object of a set under one prefix.
 */
export function newClipFolder(setId: string): string {
  return `sets/${setId}/${randomBytes(16).toString("base64url")}/`;
}

export function folderOf(key: string): string {
  return key.slice(0, key.lastIndexOf("/") + 1);
}

export async function createMultipartUpload(key: string, contentType: string): Promise<string> {
  const result = await s3Client().send(new CreateMultipartUploadCommand({ Bucket: bucket(), Key: key, ContentType: contentType }));
  if (!result.UploadId) throw new Error("object storage returned no upload id");
  return result.UploadId;
}

export function presignPart(key: string, uploadId: string, partNumber: number): Promise<string> {
  return getSignedUrl(s3Client(), new UploadPartCommand({ Bucket: bucket(), Key: key, UploadId: uploadId, PartNumber: partNumber }), {
    expiresIn: PART_URL_TTL_S,
  });
}

export interface UploadedPart {
  partNumber: number;
  etag: string;
  sizeBytes: number;
}

export async function listUploadedParts(key: string, uploadId: string): Promise<UploadedPart[]> {
  const parts: UploadedPart[] = [];
  let marker: string | undefined;
  for (;;) {
    const page = await s3Client().send(
      new ListPartsCommand({ Bucket: bucket(), Key: key, UploadId: uploadId, PartNumberMarker: marker }),
    );
    for (const part of page.Parts ?? []) {
      if (part.PartNumber && part.ETag) parts.push({ partNumber: part.PartNumber, etag: part.ETag, sizeBytes: part.Size ?? 0 });
    }
    if (!page.IsTruncated || !page.NextPartNumberMarker) return parts;
    marker = page.NextPartNumberMarker;
  }
}

export async function completeMultipartUpload(key: string, uploadId: string, parts: { partNumber: number; etag: string }[]): Promise<void> {
  const sorted: Part[] = [...parts].sort((a, b) => a.partNumber - b.partNumber).map((p) => ({ PartNumber: p.partNumber, ETag: p.etag }));
  await s3Client().send(
    new CompleteMultipartUploadCommand({ Bucket: bucket(), Key: key, UploadId: uploadId, MultipartUpload: { Parts: sorted } }),
  );
}

/** Best effort: an upload that is already gone needs no aborting. */
export async function abortMultipartUpload(key: string, uploadId: string): Promise<void> {
  await s3Client()
    .send(new AbortMultipartUploadCommand({ Bucket: bucket(), Key: key, UploadId: uploadId }))
    .catch(() => undefined);
}

/** The object's size in bytes, or null when there is no such object. */
export async function objectSize(key: string): Promise<number | null> {
  try {
    const head = await s3Client().send(new HeadObjectCommand({ Bucket: bucket(), Key: key }));
    return head.ContentLength ?? 0;
  } catch (error) {
    if ((error as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode === 404) return null;
    throw error;
  }
}

/** The first `count` bytes of an object (a ranged GET). */
export async function readHead(key: string, count: number): Promise<Uint8Array> {
  const result = await s3Client().send(new GetObjectCommand({ Bucket: bucket(), Key: key, Range: `bytes=0-${count - 1}` }));
  if (!result.Body) return new Uint8Array();
  return result.Body.transformToByteArray();
}

/** Best effort: the caller is undoing work, and a missing object is already undone. */
export async function deleteObject(key: string): Promise<void> {
  await s3Client()
    .send(new DeleteObjectCommand({ Bucket: bucket(), Key: key }))
    .catch(() => undefined);
}

/**
 * Signing takes milliseconds of CPU on every read of an analysis; a URL is handed out again while at least
 * half of its life remains. Access is checked before this is called, and each URL still opens one key only.
 */
const readUrls = new Map<string, { url: string; reuseUntilMs: number }>();
const MAX_CACHED_READ_URLS = 10_000;

export async function presignRead(key: string, ttlS = READ_URL_TTL_S): Promise<string> {
  const id = `${ttlS}:${key}`;
  const now = Date.now();
  const cached = readUrls.get(id);
  if (cached && cached.reuseUntilMs > now) return cached.url;
  const url = await getSignedUrl(s3Client(), new GetObjectCommand({ Bucket: bucket(), Key: key }), { expiresIn: ttlS });
  if (readUrls.size >= MAX_CACHED_READ_URLS) readUrls.clear();
  readUrls.set(id, { url, reuseUntilMs: now + (ttlS * 1000) / 2 });
  return url;
}

export async function putJson(key: string, value: unknown): Promise<void> {
  await s3Client().send(
    new PutObjectCommand({ Bucket: bucket(), Key: key, Body: JSON.stringify(value), ContentType: "application/json" }),
  );
}

export async function getJson(key: string): Promise<unknown> {
  const result = await s3Client().send(new GetObjectCommand({ Bucket: bucket(), Key: key }));
  return JSON.parse((await result.Body?.transformToString("utf8")) ?? "null");
}

export async function downloadToFile(key: string, path: string): Promise<void> {
  const result = await s3Client().send(new GetObjectCommand({ Bucket: bucket(), Key: key }));
  if (!(result.Body instanceof Readable)) throw new Error(`object ${key} has no readable body`);
  await pipeline(result.Body, createWriteStream(path));
}

export async function uploadFile(key: string, path: string, contentType: string): Promise<void> {
  const { size } = await stat(path);
  await s3Client().send(
    new PutObjectCommand({ Bucket: bucket(), Key: key, Body: createReadStream(path), ContentLength: size, ContentType: contentType }),
  );
}
