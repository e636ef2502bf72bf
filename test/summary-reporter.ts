/**
 * A vitest reporter that ends the run with one plain line, "tests: N passed,
 * N failed, N skipped", which CI tooling reads regardless of the runner. A
 * test file that fails to load counts as a failure. When tests were skipped,
 * a line before it names the files and what this machine lacks to run them.
 */
import type { Reporter, TestModule } from 'vitest/node';
import { relative } from 'node:path';
import { PREREQUISITES } from './support/prerequisites.js';

export default class SummaryReporter implements Reporter {
  onTestRunEnd(modules: ReadonlyArray<TestModule>): void {
    let passed = 0,
      failed = 0,
      skipped = 0;
    const skippedIn = new Map<string, number>();
    for (const m of modules) {
      if (m.errors().length > 0) failed++; // the file did not load, or a hook outside any test failed
      for (const t of m.children.allTests()) {
        const state = t.result().state;
        if (state === 'passed') passed++;
        else if (state === 'failed') failed++;
        else {
          skipped++;
          const file = relative(process.cwd(), m.moduleId);
          skippedIn.set(file, (skippedIn.get(file) ?? 0) + 1);
        }
      }
    }
    if (skipped) {
      const missing = PREREQUISITES.filter((p) => !p.present());
      const files = [...skippedIn].map(([f, n]) => `${f} ${n}`).join(', ');
      const why = missing.length ? `this machine lacks ${missing.map((p) => `${p.name} (${p.howTo})`).join('; ')}` : 'skipped by a filter or .skip';
      process.stdout.write(`\nskipped ${skipped} test${skipped === 1 ? '' : 's'} (${files}): ${why}; in CI these fail instead of skipping`);
    }
    process.stdout.write(`\ntests: ${passed} passed, ${failed} failed, ${skipped} skipped\n`);
  }
}
