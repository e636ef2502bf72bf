/**
 * A real Chromium for page tests: Debian's /usr/bin/chromium (or
 * SCATTERBOOK_BROWSER), headless, offline and quiet, with a fresh profile.
 * In CI a missing browser fails the tests instead of skipping them.
 */
import { existsSync, mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import puppeteer, { type Browser } from 'puppeteer-core';
import { launchArgs } from '../../src/pdf/print.js';

export function browserPath(): string | null {
  const candidates = [process.env.SCATTERBOOK_BROWSER, '/usr/bin/chromium', '/usr/bin/chromium-browser', '/usr/bin/google-chrome'].filter(Boolean) as string[];
  return candidates.find((p) => existsSync(p)) ?? null;
}

export const haveBrowser = browserPath() !== null;
if (!haveBrowser && process.env.CI) throw new Error('page tests need Chromium in CI: apt-get install -y chromium');

export async function launch(): Promise<Browser> {
  // the flags the PDF printer launches with (offline, quiet, a fresh profile, no sandbox as root)
  const args = launchArgs(mkdtempSync(join(tmpdir(), 'scatterbook-chromium-')));
  return puppeteer.launch({ executablePath: browserPath() as string, headless: true, args });
}
