import assert from 'node:assert/strict';
import { countTablesForLens, MAX_LENS_DOCUMENT_LENGTH } from '../../src/extension/countTablesForLens';

// Invented ski-school notes: one count table, one table of names, one count table inside a code fence.
const NOTES = [
  '# Ski school, week 3',
  '',
  '| Level | Passed | Retake |',
  '| --- | --- | --- |',
  '| Novice | 18 | 7 |',
  '| Expert | 22 | 3 |',
  '',
  '| Instructor | Slope |',
  '| --- | --- |',
  '| Ines | North |',
  '| Tomas | East |',
  '',
  '```',
  '| A | B |',
  '| --- | --- |',
  '| 1 | 2 |',
  '```',
  '',
  'Lift queue by hour:',
  '',
  '| Hour | 9 | 10 | 11 |',
  '| --- | --- | --- | --- |',
  '| Riders | 40 | 55 | 61 |',
].join('\n');

describe('countTablesForLens', () => {
  it('offers a lens on each table of counts, at its header line, and none on other tables or code', () => {
    assert.deepEqual(countTablesForLens(NOTES), [{ startLine: 3, endLine: 6 }, { startLine: 21, endLine: 23 }]);
  });

  it('offers none in a document without tables', () => {
    assert.deepEqual(countTablesForLens('Just a note about the bus depot.\n'), []);
  });

  it('skips documents too long to scan on every edit', () => {
    const long = NOTES + '\n' + 'x'.repeat(MAX_LENS_DOCUMENT_LENGTH);
    assert.deepEqual(countTablesForLens(long), []);
  });
});
