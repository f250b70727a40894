import type { Reporter, TestModule } from 'vitest/node';

/**
 * Prints the closing line CI reads, `N passed, N failed[, N skipped]`, alone on a line.
 *
 * Vitest's own summary is not in that form. Printing from `onTestRunEnd` would come out
 * before Vitest's summary, so the line is printed when the process exits.
 */
export default class SummaryReporter implements Reporter {
  private passed = 0;
  private failed = 0;
  private skipped = 0;

  onTestRunEnd(testModules: ReadonlyArray<TestModule>, unhandledErrors: ReadonlyArray<unknown>): void {
    for (const module of testModules) {
      for (const test of module.children.allTests()) {
        const state = test.result().state;
        if (state === 'passed') this.passed += 1;
        else if (state === 'failed') this.failed += 1;
        else this.skipped += 1;
      }
      // A file that failed to load has no tests but must still count as a failure.
      if (module.state() === 'failed' && [...module.children.allTests()].length === 0) this.failed += 1;
    }
    this.failed += unhandledErrors.length;
    const line = `${this.passed} passed, ${this.failed} failed${this.skipped ? `, ${this.skipped} skipped` : ''}`;
    process.once('exit', () => process.stdout.write(`\n${line}\n`));
  }
}
