import type { Reporter, TestModule } from 'vitest/node';

/** Prints one plain line CI can read: "vitest: N passed, M failed, K skipped". */
export default class SummaryReporter implements Reporter {
  onTestRunEnd(modules: ReadonlyArray<TestModule>) {
    let passed = 0;
    let failed = 0;
    let skipped = 0;
    for (const m of modules) {
      for (const t of m.children.allTests()) {
        const state = t.result().state;
        if (state === 'passed') passed++;
        else if (state === 'failed') failed++;
        else skipped++;
      }
      if (m.state() === 'failed' && [...m.children.allTests()].length === 0) failed++;
    }
    console.log(`\nvitest: ${passed} passed, ${failed} failed, ${skipped} skipped`);
  }
}
