import { existsSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import type { Tolerance } from '../../helpers/assertClose';

/** JSON has no infinities: the generator writes them as strings, and an undefined odds ratio as null. */
export type FixtureNumber = number | 'Infinity' | '-Infinity' | null;

export interface FisherCase {
  name: string;
  input: { kind: 'fisher'; table: [[number, number], [number, number]] };
  expected: { p: number; pLess: number; pGreater: number; oddsRatio?: FixtureNumber; lower?: FixtureNumber; upper?: FixtureNumber };
  tolerance: { p: Tolerance; oddsRatio?: Tolerance; interval?: Tolerance };
  nearTies?: { x: number; relativeDifference: number }[];
  /** The definition summed with mpmath, present where scipy differs from it (see knownDifference). */
  mpmathExpected?: { p: number; pLess: number; pGreater: number };
  knownDifference?: string;
}

export interface Log10pCase {
  name: string;
  input: { kind: 'log10p'; table: [[number, number], [number, number]] };
  expected: { p: number; log10p: number };
  tolerance: { p: Tolerance; log10p: Tolerance };
}

export interface MarginsInput {
  x: number;
  rowTotal: number;
  otherRowTotal: number;
  columnTotal: number;
}

export interface LogProbabilityCase {
  name: string;
  input: { kind: 'logpmf' } & MarginsInput;
  expected: { logProbability: number };
  tolerance: Tolerance;
}

export interface NoncentralCase {
  name: string;
  input: { kind: 'noncentral'; oddsRatio: number } & MarginsInput;
  expected: { mean: number; pAtMost: number; pAtLeast: number };
  tolerance: Tolerance;
}

export type AnyFisherCase = FisherCase | Log10pCase | LogProbabilityCase | NoncentralCase;

export interface FisherFixture {
  generator: string;
  reference: string;
  referenceVersion: string;
  cases: AnyFisherCase[];
}

/** test/fixtures/scipy/fisher.json (written by generate_fisher.py), found from the repository root. */
export function readFisherFixture(): FisherFixture {
  let directory = __dirname;
  while (!existsSync(join(directory, 'package.json'))) {
    const parent = dirname(directory);
    if (parent === directory) throw new Error('readFisherFixture: repository root not found');
    directory = parent;
  }
  return JSON.parse(readFileSync(join(directory, 'test', 'fixtures', 'scipy', 'fisher.json'), 'utf8')) as FisherFixture;
}

export function fixtureNumber(value: FixtureNumber | undefined): number | null {
  if (value === 'Infinity') return Infinity;
  if (value === '-Infinity') return -Infinity;
  return value ?? null;
}

export function casesOfKind<K extends AnyFisherCase['input']['kind']>(kind: K): Extract<AnyFisherCase, { input: { kind: K } }>[] {
  return readFisherFixture().cases.filter((c) => c.input.kind === kind) as Extract<AnyFisherCase, { input: { kind: K } }>[];
}
