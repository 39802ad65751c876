// Local fakes of the hosted services (mail, object storage, payments), started in-process
// by the start command and by the tests. Returns the environment the app needs to reach them.
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { startMailFake } from "./mail-fake";
import { startS3Fake } from "./s3-fake";

const repoRoot = path.resolve(import.meta.dirname, "../..");

export interface RunningFakes {
  env: Record<string, string>;
  mailUrl: string;
  stop: () => Promise<void>;
}

/** `ephemeral` picks free ports (tests); otherwise the fixed development ports. */
export async function startFakes({ ephemeral }: { ephemeral: boolean }): Promise<RunningFakes> {
  const mail = await startMailFake(ephemeral ? { smtpPort: 0, httpPort: 0 } : { smtpPort: 2525, httpPort: 3025 });
  // Tests keep their objects in a temporary folder, removed on stop; development keeps them under .data/s3.
  const s3Directory = ephemeral ? mkdtempSync(path.join(tmpdir(), "plumbline-s3-")) : path.join(repoRoot, ".data", "s3");
  const s3 = await startS3Fake({ port: ephemeral ? 0 : 4569, directory: s3Directory });
  return {
    env: { SMTP_URL: mail.smtpUrl, S3_ENDPOINT: s3.endpoint },
    mailUrl: mail.httpUrl,
    stop: async () => {
      await mail.stop();
      await s3.stop();
      if (ephemeral) rmSync(s3Directory, { recursive: true, force: true });
    },
  };
}
