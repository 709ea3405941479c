import assert from 'node:assert/strict';
import { spawnSync } from 'node:child_process';
import * as fs from 'node:fs';
import * as path from 'node:path';
import { parse } from 'csv-parse/sync';
import { crossTabulateText } from '../../../src/core/table/crossTabulate';
import { locateStrata } from '../../../src/core/table/locateStrata';
import { strataFromCrossTabulation } from '../../../src/core/table/strataFromCrossTabulation';

/** The repository root: four levels above the compiled test, or the working directory when compiled elsewhere. */
const root = [path.resolve(__dirname, '..', '..', '..', '..'), process.cwd()].find((dir) => fs.existsSync(path.join(dir, 'examples', 'ferry-seasickness.md')));

function example(name: string): string {
  assert.ok(root, 'the examples folder was not found');
  return fs.readFileSync(path.join(root, 'examples', name), 'utf8');
}

describe('stratified examples', () => {
  it('reads the ferry note as three strata with their route names and the counts as written', () => {
    const found = locateStrata(example('ferry-seasickness.md'), { format: 'markdown', line: 11 });
    if (!found.ok) assert.fail(found.issue.message);
    assert.deepEqual(found.value.strata.map((stratum) => stratum.label), ['Harbour to Skerry (short, sheltered)', 'Long Sound (open water)', 'Outer Isles (long crossing, swell)']);
    assert.deepEqual(found.value.rowLabels, ['Took ginger sweets', 'No sweets']);
    assert.deepEqual(found.value.columnLabels, ['Seasick', 'Fine']);
    assert.deepEqual(found.value.strata.map((stratum) => stratum.table.observed), [[[6, 74], [11, 69]], [[19, 43], [27, 36]], [[31, 24], [38, 17]]]);
    assert.deepEqual(found.value.notes, []);
  });

  it('cross-tabulates the delivery log per shift as csv-parse plus a plain loop does', () => {
    const text = example('bakery-late-deliveries.csv');
    const tabulation = crossTabulateText(text, { columns: ['van', 'arrival'], stratum: 'shift' });
    if (!tabulation.ok) assert.fail(tabulation.issue.message);
    const strata = strataFromCrossTabulation(tabulation.value);
    if (!strata.ok) assert.fail(strata.issue.message);
    // Outside reference: csv-parse 7.0.3, run live.
    const records = parse(text, { columns: true }) as Record<string, string>[];
    assert.equal(records.length, 204);
    const shifts = [...new Set(records.map((record) => record.shift))];
    assert.deepEqual(strata.value.strata.map((stratum) => stratum.label), shifts);
    for (const stratum of strata.value.strata) {
      strata.value.rowLabels.forEach((van, r) => strata.value.columnLabels.forEach((arrival, c) => {
        const expected = records.filter((record) => record.shift === stratum.label && record.van === van && record.arrival === arrival).length;
        assert.equal(stratum.table.observed[r][c], expected, `${stratum.label}: ${van} × ${arrival}`);
      }));
    }
  });

  it('matches a fresh run of its committed generator', () => {
    assert.ok(root);
    const run = spawnSync(process.execPath, [path.join(root, 'examples', 'generate-late-deliveries.mjs')], { encoding: 'utf8' });
    assert.equal(run.status, 0, run.stderr);
    assert.equal(run.stdout, example('bakery-late-deliveries.csv'));
  });
});
