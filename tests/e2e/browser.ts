// Launches Debian's Chromium through playwright-core. playwright's launch() gives every
// browser a fresh temporary profile folder and removes it on close.
import { chromium, type Browser } from "playwright-core";

export const CHROMIUM_PATH = "/usr/bin/chromium";

const CHROMIUM_ARGS = [
  "--no-sandbox",
  "--disable-gpu",
  "--disable-background-networking",
  "--disable-component-update",
  "--disable-sync",
  "--no-first-run",
  "--disable-quic",
];

/** Chromium's own test camera (a moving pattern), granted without a permission prompt. */
const FAKE_CAMERA_ARGS = ["--use-fake-device-for-media-stream", "--use-fake-ui-for-media-stream"];

export function launchBrowser(options: { fakeCamera?: boolean } = {}): Promise<Browser> {
  const args = options.fakeCamera ? [...CHROMIUM_ARGS, ...FAKE_CAMERA_ARGS] : CHROMIUM_ARGS;
  return chromium.launch({ executablePath: CHROMIUM_PATH, headless: true, args });
}
