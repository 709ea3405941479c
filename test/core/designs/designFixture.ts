import { readFileSync } from 'node:fs';
import { join } from 'node:path';

/** One case of test/fixtures/scipy/designs.json (written by generate_designs.py, scipy 1.17.1). */
export interface DesignCase {
  name: string;
  input: { kind: string } & Record<string, unknown>;
  expected: Record<string, unknown>;
  tolerance: number;
}

/** The cases of one kind from the committed fixture. */
export function designCases(kind: string): DesignCase[] {
  const path = join(__dirname, '..', '..', '..', '..', 'test', 'fixtures', 'scipy', 'designs.json');
  const document = JSON.parse(readFileSync(path, 'utf8')) as { cases: DesignCase[] };
  return document.cases.filter((entry) => entry.input.kind === kind);
}
