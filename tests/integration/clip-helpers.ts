// Helpers for the clip tests: the in-process S3 fake on a free port, sets made through the real route,
// and a multipart upload driven the way the browser drives it (presigned PUTs straight to storage).
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { expect } from "vitest";
import { startS3Fake } from "@/dev/fakes/s3-fake";
import { CLIP_PART_BYTES } from "@/lib/clips/limits";
import * as setsRoute from "@/app/api/sets/route";
import * as clipRoute from "@/app/api/sets/[setId]/clip/route";
import * as partsRoute from "@/app/api/sets/[setId]/clip/parts/route";
import * as completeRoute from "@/app/api/sets/[setId]/clip/complete/route";
import { call, json, type TestPerson } from "./helpers";

export interface TestStorage {
  endpoint: string;
  stop: () => Promise<void>;
}

/** Starts the S3 fake in a temporary folder and points lib/storage at it. */
export async function startTestStorage(): Promise<TestStorage> {
  const directory = mkdtempSync(path.join(tmpdir(), "plumbline-s3-test-"));
  const s3 = await startS3Fake({ port: 0, directory });
  process.env.S3_ENDPOINT = s3.endpoint;
  // lib/storage caches its client on globalThis; a client from an earlier test file points at a stopped fake.
  (globalThis as { plumblineS3?: unknown }).plumblineS3 = undefined;
  return {
    endpoint: s3.endpoint,
    stop: async () => {
      await s3.stop();
      rmSync(directory, { recursive: true, force: true });
    },
  };
}

/**
 * The date of sets that test files make in numbers, long ago, so lists that show "the latest 50" (GET /api/sets
 * for an admin in tests/integration/sets.test.ts) still show the sets of the file that checks them.
 */
export const OLD_DATE = "2024-01-15";

/** A set of the person's; dated OLD_DATE unless the body gives a date. */
export async function createTestSet(person: TestPerson, body: Record<string, unknown> = {}): Promise<string> {
  const response = await call(setsRoute.POST, "/api/sets", {
    method: "POST",
    cookie: person.cookie,
    body: { sessionDate: OLD_DATE, lift: "squat", loadKg: 140, reps: 5, cameraView: "side", ...body },
  });
  expect(response.status).toBe(201);
  return (await json<{ set: { id: string } }>(response)).set.id;
}

export interface StartedUpload {
  uploadId: string;
  partSizeBytes: number;
  partCount: number;
}

export function startUpload(person: TestPerson | undefined, setId: string, sizeBytes: number): Promise<Response> {
  return call(clipRoute.POST, "", { method: "POST", cookie: person?.cookie, params: { setId }, body: { sizeBytes, contentType: "video/mp4" } });
}

export function presignParts(person: TestPerson | undefined, setId: string, uploadId: string, partNumbers: number[]): Promise<Response> {
  return call(partsRoute.POST, "", { method: "POST", cookie: person?.cookie, params: { setId }, body: { uploadId, partNumbers } });
}

export function listParts(person: TestPerson | undefined, setId: string, uploadId: string): Promise<Response> {
  return call(partsRoute.GET, `/x?uploadId=${encodeURIComponent(uploadId)}`, { cookie: person?.cookie, params: { setId } });
}

export function completeUpload(
  person: TestPerson | undefined,
  setId: string,
  uploadId: string,
  parts: { partNumber: number; etag: string }[],
): Promise<Response> {
  return call(completeRoute.POST, "", { method: "POST", cookie: person?.cookie, params: { setId }, body: { uploadId, parts } });
}

export function getClip(person: TestPerson | undefined, setId: string): Promise<Response> {
  return call(clipRoute.GET, "", { cookie: person?.cookie, params: { setId } });
}

/** PUTs one part to its presigned URL, as the browser does; returns the ETag storage answered with. */
export async function putPart(url: string, bytes: Uint8Array): Promise<string> {
  const response = await fetch(url, { method: "PUT", body: new Uint8Array(bytes) });
  expect(response.status).toBe(200);
  const etag = response.headers.get("etag");
  expect(etag).toBeTruthy();
  return etag as string;
}

export function partBytes(bytes: Uint8Array, partNumber: number): Uint8Array {
  return bytes.subarray((partNumber - 1) * CLIP_PART_BYTES, partNumber * CLIP_PART_BYTES);
}

/** Start, PUT every part, complete: the whole upload; returns the completion's response. */
export async function uploadWhole(person: TestPerson, setId: string, bytes: Uint8Array): Promise<Response> {
  const started = await startUpload(person, setId, bytes.length);
  expect(started.status).toBe(201);
  const { upload } = await json<{ upload: StartedUpload }>(started);
  const numbers = Array.from({ length: upload.partCount }, (_, i) => i + 1);
  const { parts } = await json<{ parts: { partNumber: number; url: string }[] }>(await presignParts(person, setId, upload.uploadId, numbers));
  const uploaded = [];
  for (const part of parts) uploaded.push({ partNumber: part.partNumber, etag: await putPart(part.url, partBytes(bytes, part.partNumber)) });
  return completeUpload(person, setId, upload.uploadId, uploaded);
}
