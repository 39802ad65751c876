// Local fakes of the hosted services (mail, object storage, payments), started in-process
// by the start command and by the tests. Returns the environment the app needs to reach them.
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { startMailFake } from "./mail-fake";
import { startS3Fake } from "./s3-fake";
import { startStripeFake } from "./stripe-fake";

const repoRoot = path.resolve(import.meta.dirname, "../..");

export interface RunningFakes {
  env: Record<string, string>;
  mailUrl: string;
  /** The payment fake's base URL (hosted checkout and portal pages, `/_control/*` for tests). */
  paymentsUrl: string;
  /** Points the payment fake's webhook events at the app, once its address is known. */
  setAppUrl: (appUrl: string) => void;
  stop: () => Promise<void>;
}

const webhookUrl = (appUrl: string) => new URL("/api/payments/webhook", appUrl).toString();

/** `ephemeral` picks free ports (tests); otherwise the fixed development ports. */
export async function startFakes({ ephemeral, appUrl }: { ephemeral: boolean; appUrl?: string }): Promise<RunningFakes> {
  const mail = await startMailFake(ephemeral ? { smtpPort: 0, httpPort: 0 } : { smtpPort: 2525, httpPort: 3025 });
  // Tests keep their objects in a temporary folder, removed on stop; development keeps them under .data/s3.
  const s3Directory = ephemeral ? mkdtempSync(path.join(tmpdir(), "plumbline-s3-")) : path.join(repoRoot, ".data", "s3");
  const s3 = await startS3Fake({ port: ephemeral ? 0 : 4569, directory: s3Directory });
  // Development keeps the fake's customers, prices and subscriptions across restarts, like the database does.
  const payments = await startStripeFake({
    port: ephemeral ? 0 : 12111,
    webhookUrl: appUrl ? webhookUrl(appUrl) : null,
    stateFile: ephemeral ? undefined : path.join(repoRoot, ".data", "stripe-fake.json"),
  });
  return {
    env: { SMTP_URL: mail.smtpUrl, S3_ENDPOINT: s3.endpoint, ...payments.env },
    mailUrl: mail.httpUrl,
    paymentsUrl: payments.url,
    setAppUrl: (url) => payments.setWebhookUrl(webhookUrl(url)),
    stop: async () => {
      await mail.stop();
      await s3.stop();
      await payments.stop();
      if (ephemeral) rmSync(s3Directory, { recursive: true, force: true });
    },
  };
}
