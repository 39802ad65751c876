// Object storage for clips and per-frame tracks through the S3 API. Points at the local fake in
// development and tests (S3_ENDPOINT), at a real S3-compatible service by configuration only.
import "server-only";
import { S3Client } from "@aws-sdk/client-s3";

export function storageConfig() {
  return {
    endpoint: process.env.S3_ENDPOINT ?? "http://127.0.0.1:4569",
    region: process.env.S3_REGION ?? "us-east-1",
    bucket: process.env.S3_BUCKET ?? "plumbline-clips",
    accessKeyId: process.env.S3_ACCESS_KEY_ID ?? "S3RVER",
    secretAccessKey: process.env.S3_SECRET_ACCESS_KEY ?? "S3RVER",
  };
}

const globalForStorage = globalThis as unknown as { plumblineS3?: S3Client };

export function s3Client(): S3Client {
  if (globalForStorage.plumblineS3) return globalForStorage.plumblineS3;
  const config = storageConfig();
  // The SDK's default checksums corrupt uploads to s3rver (stored chunk-encoded): only when required.
  const client = new S3Client({
    endpoint: config.endpoint,
    region: config.region,
    forcePathStyle: true,
    credentials: { accessKeyId: config.accessKeyId, secretAccessKey: config.secretAccessKey },
    requestChecksumCalculation: "WHEN_REQUIRED",
    responseChecksumValidation: "WHEN_REQUIRED",
  });
  globalForStorage.plumblineS3 = client;
  return client;
}
