/** Progress on one terminal line, only when stdout is a TTY; a no-op otherwise. */
import type { Terminal } from './terminal.js';

export interface Progress {
  update(text: string): void;
  done(): void;
}

export function progress(t: Terminal): Progress {
  if (!t.stdout.isTTY) return { update: () => {}, done: () => {} };
  let shown = false;
  return {
    update(text) {
      t.stdout.write(`\r\x1b[2K${text}`);
      shown = true;
    },
    done() {
      if (shown) t.stdout.write('\r\x1b[2K');
      shown = false;
    },
  };
}
