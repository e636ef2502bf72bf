/**
 * The closing line CI reads: a test file that fails to load counts as a
 * failure even though it ran no test, and skipped tests are named.
 */
import { describe, expect, it, vi } from 'vitest';
import SummaryReporter from './summary-reporter.js';

const mod = (id: string, errors: number, states: string[]) =>
  ({
    moduleId: id,
    errors: () => Array(errors).fill({ message: 'x' }),
    children: { allTests: () => states.map((s) => ({ result: () => ({ state: s }) })) },
  }) as never;

describe('the summary line', () => {
  it('counts a file that failed to load as a failure, and names skipped files', () => {
    const out: string[] = [];
    const spy = vi.spyOn(process.stdout, 'write').mockImplementation((s) => (out.push(String(s)), true));
    try {
      new SummaryReporter().onTestRunEnd([
        mod(`${process.cwd()}/test/a.test.ts`, 0, ['passed', 'passed']),
        mod(`${process.cwd()}/test/b.test.ts`, 1, []),
        mod(`${process.cwd()}/test/c.test.ts`, 0, ['skipped']),
      ]);
    } finally {
      spy.mockRestore();
    }
    const text = out.join('');
    expect(text).toContain('\ntests: 2 passed, 1 failed, 1 skipped\n');
    expect(text).toMatch(/skipped 1 test \(test\/c\.test\.ts 1\): /);
  });
});
