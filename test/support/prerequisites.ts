/**
 * What the independent checks need from the machine, and how to get it. The
 * tests skip what they cannot run outside CI (and fail in CI); the summary
 * reporter names what was missing, so that a green local run says what it
 * did not check.
 */
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';

export interface Prerequisite {
  readonly name: string;
  readonly present: () => boolean;
  readonly howTo: string;
}

export const PYTHON = '/usr/bin/python3';

export const PREREQUISITES: readonly Prerequisite[] = [
  {
    name: 'Chromium',
    present: () =>
      [process.env.SCATTERBOOK_BROWSER, '/usr/bin/chromium', '/usr/bin/chromium-browser', '/usr/bin/google-chrome'].some((p) => p && existsSync(p)),
    howTo: 'apt-get install chromium',
  },
  { name: 'poppler-utils', present: () => spawnSync('pdfinfo', ['-v']).status === 0, howTo: 'apt-get install poppler-utils' },
  {
    name: 'scikit-rf',
    present: () =>
      spawnSync(
        PYTHON,
        [
          '-c',
          'import numpy as np\nfor a in ("int","float","complex","bool","object"):\n    np.__dict__.get(a) or setattr(np, a, __builtins__.__dict__[a] if hasattr(__builtins__, "__dict__") else getattr(__builtins__, a))\nimport skrf',
        ],
        { stdio: 'ignore' },
      ).status === 0,
    howTo: 'apt-get install python3-scikit-rf',
  },
  {
    name: 'root (to mount a small tmpfs for the read-only, full-disk and mount-point tests)',
    present: () => process.getuid?.() === 0,
    howTo: 'run as root, as CI does',
  },
];
