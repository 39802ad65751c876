// A local S3-compatible object store (s3rver) for development and tests. The clips bucket
// allows the browser to PUT upload parts directly (CORS, ETag exposed for multipart uploads).
import S3rver from "s3rver";
import { mkdirSync } from "node:fs";
import type { AddressInfo } from "node:net";

export const CLIPS_BUCKET = "plumbline-clips";

const CORS_CONFIG = `<CORSConfiguration>
  <CORSRule>
    <AllowedOrigin>*</AllowedOrigin>
    <AllowedMethod>GET</AllowedMethod>
    <AllowedMethod>PUT</AllowedMethod>
    <AllowedMethod>HEAD</AllowedMethod>
    <AllowedHeader>*</AllowedHeader>
    <ExposeHeader>ETag</ExposeHeader>
    <MaxAgeSeconds>3000</MaxAgeSeconds>
  </CORSRule>
</CORSConfiguration>`;

export interface RunningS3Fake {
  endpoint: string;
  stop: () => Promise<void>;
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
  const address = (await server.run()) as AddressInfo;
  return {
    endpoint: `http://127.0.0.1:${address.port}`,
    stop: () => server.close(),
  };
}
