/**
 * Finding a Chromium-family browser to print with, in this order:
 *   1. --browser PATH, or the SCATTERBOOK_BROWSER environment variable;
 *   2. an installed Chrome, Chromium or Edge at the usual places of Linux,
 *      macOS and Windows;
 *   3. on Linux, the optional npm package @sparticuz/chromium, which ships a
 *      compressed Chromium that unpacks to /tmp on first use.
 * SCATTERBOOK_NO_BROWSER_SEARCH=1 skips 2 and 3 (for tests and for machines
 * where only an explicit browser may be used).
 */
import { existsSync, statSync } from 'node:fs';
import { join } from 'node:path';

export interface FoundBrowser {
  readonly path: string;
  readonly source: 'flag' | 'environment' | 'installed' | 'bundled';
  /** Extra launch arguments the bundled build needs. */
  readonly args: readonly string[];
}

export const HOW_TO_GET_PDFS =
  'to print PDFs, install Chromium or Chrome (on Debian and Ubuntu: apt-get install chromium), or pass --browser PATH (or set SCATTERBOOK_BROWSER) to a Chromium-family browser; on Linux, npm also installs the optional package @sparticuz/chromium, which scatterbook uses when it is present';

export function usualPlaces(platform: NodeJS.Platform = process.platform, env: NodeJS.ProcessEnv = process.env): string[] {
  if (platform === 'darwin') {
    return ['Google Chrome', 'Chromium', 'Microsoft Edge', 'Google Chrome Canary'].flatMap((app) => [
      `/Applications/${app}.app/Contents/MacOS/${app}`,
      join(env.HOME ?? '', 'Applications', `${app}.app`, 'Contents', 'MacOS', app),
    ]);
  }
  if (platform === 'win32') {
    const roots = [env.PROGRAMFILES, env['PROGRAMFILES(X86)'], env.LOCALAPPDATA].filter(Boolean) as string[];
    return roots.flatMap((r) => [
      join(r, 'Google', 'Chrome', 'Application', 'chrome.exe'),
      join(r, 'Microsoft', 'Edge', 'Application', 'msedge.exe'),
      join(r, 'Chromium', 'Application', 'chrome.exe'),
    ]);
  }
  return [
    '/usr/bin/chromium',
    '/usr/bin/chromium-browser',
    '/usr/bin/google-chrome',
    '/usr/bin/google-chrome-stable',
    '/usr/bin/microsoft-edge',
    '/usr/bin/microsoft-edge-stable',
    '/snap/bin/chromium',
    '/opt/google/chrome/chrome',
  ];
}

/** A browser the user named: it must be a file; a wrong path is the user's to fix, not a reason to build without PDFs. */
function named(path: string, source: 'flag' | 'environment', shown: string): FoundBrowser | { readonly missing: string; readonly named: true } {
  let st;
  try {
    st = statSync(path);
  } catch {
    return { missing: `${shown}: no such file`, named: true };
  }
  return st.isFile() ? { path, source, args: [] } : { missing: `${shown}: ${st.isDirectory() ? 'is a folder, not a browser' : 'is not a file'}`, named: true };
}

export async function findBrowser(
  flag: string | undefined,
  env: NodeJS.ProcessEnv = process.env,
): Promise<FoundBrowser | { readonly missing: string; readonly named?: true }> {
  if (flag) return named(flag, 'flag', `--browser ${flag}`);
  const fromEnv = env.SCATTERBOOK_BROWSER;
  if (fromEnv) return named(fromEnv, 'environment', `SCATTERBOOK_BROWSER=${fromEnv}`);
  if (env.SCATTERBOOK_NO_BROWSER_SEARCH) return { missing: 'no browser given, and SCATTERBOOK_NO_BROWSER_SEARCH forbids looking for one' };
  const installed = usualPlaces().find((p) => existsSync(p));
  if (installed) return { path: installed, source: 'installed', args: [] };
  if (process.platform === 'linux') {
    try {
      const mod = (await import('@sparticuz/chromium')) as unknown as { default: { executablePath(): Promise<string>; args: string[] } };
      const path = await mod.default.executablePath();
      if (path && existsSync(path))
        return { path, source: 'bundled', args: mod.default.args.filter((a) => !a.startsWith('--headless') && a !== '--single-process') };
    } catch {
      // not installed (it is optional), or it could not unpack: fall through
    }
  }
  return { missing: 'no Chromium-family browser found' };
}
