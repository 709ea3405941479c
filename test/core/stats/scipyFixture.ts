import { existsSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';

/** One case of a fixture written by test/fixtures/scipy/generate_stats.py. */
export interface FixtureCase<Input, Expected> {
  name: string;
  input: Input;
  expected: Expected;
  tolerance: { relative: number; p: number; cramersVInterval?: number };
}

export interface Fixture<Input, Expected> {
  generator: string;
  reference: string;
  referenceVersion: string;
  cases: FixtureCase<Input, Expected>[];
}

/** Reads test/fixtures/scipy/<name>, found from the repository root, wherever the tests were compiled to. */
export function readScipyFixture<Input, Expected>(name: string): Fixture<Input, Expected> {
  let directory = __dirname;
  while (!existsSync(join(directory, 'package.json'))) {
    const parent = dirname(directory);
    if (parent === directory) throw new Error('readScipyFixture: repository root not found');
    directory = parent;
  }
  return JSON.parse(readFileSync(join(directory, 'test', 'fixtures', 'scipy', name), 'utf8')) as Fixture<Input, Expected>;
}
