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

export function launchBrowser(): Promise<Browser> {
  return chromium.launch({ executablePath: CHROMIUM_PATH, headless: true, args: CHROMIUM_ARGS });
}
