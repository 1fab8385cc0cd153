import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { chromium, type Browser } from "playwright-core";

/** Debian's chromium, headless, with nothing reaching out to the network on its own. */
export async function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
    headless: true,
    args: [
      "--headless",
      "--no-sandbox",
      "--disable-gpu",
      "--disable-quic",
      "--no-first-run",
      "--disable-background-networking",
      "--disable-component-update",
      "--disable-sync",
      "--enable-unsafe-swiftshader",
    ],
  });
}

/** Where browser tests leave screenshots for people to look at (git-ignored). */
export function artefactPath(name: string): string {
  const dir = path.resolve("test-results", "browser");
  fs.mkdirSync(dir, { recursive: true });
  return path.join(dir, name);
}

export function tempDir(): string {
  return fs.mkdtempSync(path.join(os.tmpdir(), "loxodrome-browser-"));
}
