// A local S3-compatible object store (s3rver) for development and tests. The clips bucket
// allows the browser to PUT upload parts directly (CORS, ETag exposed for multipart uploads) and to
// read clips by byte range. s3rver lacks ListParts and AbortMultipartUpload; both are added here.
import S3rver from "s3rver";
import { mkdirSync } from "node:fs";
import { readdir, readFile, rm, stat } from "node:fs/promises";
import type { AddressInfo } from "node:net";
import path from "node:path";

export const CLIPS_BUCKET = "plumbline-clips";

const CORS_CONFIG = `<CORSConfiguration>
  <CORSRule>
    <AllowedOrigin>*</AllowedOrigin>
    <AllowedMethod>GET</AllowedMethod>
    <AllowedMethod>PUT</AllowedMethod>
    <AllowedMethod>HEAD</AllowedMethod>
    <AllowedHeader>*</AllowedHeader>
    <ExposeHeader>ETag</ExposeHeader>
    <ExposeHeader>Content-Length</ExposeHeader>
    <ExposeHeader>Content-Range</ExposeHeader>
    <ExposeHeader>Accept-Ranges</ExposeHeader>
    <MaxAgeSeconds>3000</MaxAgeSeconds>
  </CORSRule>
</CORSConfiguration>`;

export interface RunningS3Fake {
  endpoint: string;
  stop: () => Promise<void>;
}

interface KoaContext {
  method: string;
  path: string;
  query: Record<string, string | string[] | undefined>;
  status: number;
  body: unknown;
}
type Middleware = (ctx: KoaContext, next: () => Promise<void>) => Promise<void>;
interface S3rverInternals {
  middleware: Middleware[];
  store: { getResourcePath(bucket: string, key: string | undefined, resource: string): string };
}

/** Parts stored so far for one upload, as ListParts reports them. */
async function listParts(uploadDir: string) {
  const names = await readdir(uploadDir).catch(() => null);
  if (!names) return null;
  const numbers = names.filter((n) => /^\d+$/.test(n)).map(Number).sort((a, b) => a - b);
  return Promise.all(
    numbers.map(async (n) => {
      const file = path.join(uploadDir, String(n));
      const [{ size, mtime }, md5] = await Promise.all([stat(file), readFile(`${file}.md5`, "utf8")]);
      return { PartNumber: n, LastModified: mtime.toISOString(), ETag: JSON.stringify(md5.trim()), Size: size };
    }),
  );
}

/** ListParts (GET ?uploadId) and AbortMultipartUpload (DELETE ?uploadId) over s3rver's upload folders. */
function multipartExtras(server: S3rver): Middleware {
  const internals = server as unknown as S3rverInternals;
  return async (ctx, next) => {
    const uploadId = typeof ctx.query.uploadId === "string" ? ctx.query.uploadId : null;
    const match = /^\/([^/]+)\/(.+)$/.exec(ctx.path);
    if (!uploadId || !match || !/^[0-9a-f]+$/.test(uploadId) || (ctx.method !== "GET" && ctx.method !== "DELETE")) return next();
    const [, bucket, key] = match;
    const uploadDir = path.join(internals.store.getResourcePath(bucket, undefined, "uploads"), uploadId);
    if (ctx.method === "DELETE") {
      await rm(uploadDir, { recursive: true, force: true });
      ctx.status = 204;
      return;
    }
    const parts = await listParts(uploadDir);
    if (!parts) {
      ctx.status = 404;
      ctx.body = { Error: { Code: "NoSuchUpload", Message: "The specified upload does not exist.", UploadId: uploadId } };
      return;
    }
    ctx.body = {
      ListPartsResult: { Bucket: bucket, Key: decodeURIComponent(key), UploadId: uploadId, MaxParts: 10000, IsTruncated: false, Part: parts },
    };
  };
}

export async function startS3Fake({ port, directory }: { port: number; directory: string }): Promise<RunningS3Fake> {
  mkdirSync(directory, { recursive: true });
  const server = new S3rver({
    address: "127.0.0.1",
    port,
    directory,
    silent: true,
    configureBuckets: [{ name: CLIPS_BUCKET, configs: [CORS_CONFIG] }],
  });
  // Before s3rver's router (the last middleware), after its XML encoder and logger.
  const { middleware } = server as unknown as S3rverInternals;
  middleware.splice(middleware.length - 1, 0, multipartExtras(server));
  const address = (await server.run()) as AddressInfo;
  return {
    endpoint: `http://127.0.0.1:${address.port}`,
    stop: () => server.close(),
  };
}
