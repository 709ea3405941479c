// Mocha's dot reporter plus one plain closing line, "N passed, N failed", that CI logs read
// the same way whatever the test runner.
import Mocha from 'mocha';

class DotWithTally extends Mocha.reporters.Dot {
  constructor(runner: Mocha.Runner, options?: Mocha.MochaOptions) {
    super(runner, options);
    runner.once(Mocha.Runner.constants.EVENT_RUN_END, () => {
      const stats = runner.stats ?? { passes: 0, failures: 0, pending: 0 };
      process.stdout.write(`tests: ${stats.passes} passed, ${stats.failures} failed, ${stats.pending} skipped\n`);
    });
  }
}

export = DotWithTally;
