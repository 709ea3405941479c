import * as fs from 'node:fs';
import * as path from 'node:path';

/** One reference case as written by test/fixtures/mpmath/generate.py. */
export interface FixtureCase<Input, Expected, Tolerance = number> {
  name: string;
  input: Input;
  expected: Expected;
  tolerance: Tolerance;
}

export interface Fixture<Input, Expected, Tolerance = number> {
  generator: string;
  reference: string;
  referenceVersion: string;
  pythonVersion: string;
  cases: FixtureCase<Input, Expected, Tolerance>[];
}

function repositoryRoot(): string {
  let directory = __dirname;
  while (!fs.existsSync(path.join(directory, 'package.json'))) {
    const parent = path.dirname(directory);
    if (parent === directory) throw new Error('package.json not found above ' + __dirname);
    directory = parent;
  }
  return directory;
}

/** Reads test/fixtures/mpmath/<name>.json (found from the repository root, as compiled tests run from an output folder). */
export function readMpmathFixture<Input, Expected, Tolerance = number>(name: string): Fixture<Input, Expected, Tolerance> {
  const file = path.join(repositoryRoot(), 'test', 'fixtures', 'mpmath', `${name}.json`);
  return JSON.parse(fs.readFileSync(file, 'utf8')) as Fixture<Input, Expected, Tolerance>;
}

/** |actual − expected| / |expected|, for reporting the largest error seen. */
export function relativeError(actual: number, expected: number): number {
  return actual === expected ? 0 : Math.abs(actual - expected) / Math.abs(expected);
}
