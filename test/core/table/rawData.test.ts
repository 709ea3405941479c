import assert from 'node:assert/strict';
import { categoricalColumns, looksLikeRawData, RAW_DATA_SAMPLE_ROWS } from '../../../src/core/table/rawData';

// Invented ski school and greenhouse data. The rule (most values text, values repeat) is a project decision.

const skiLog = {
  header: ['date', 'instructor', 'level', 'completed'],
  rows: Array.from({ length: 30 }, (_, k) => [`2024-02-${String(1 + (k % 28)).padStart(2, '0')}`, ['Ina', 'Ole', 'Per'][k % 3], k % 4 ? 'novice' : 'expert', k % 5 ? 'yes' : 'no']),
};

describe('rawData', () => {
  it('recognises a log with one row per observation described by text categories', () => {
    assert.equal(looksLikeRawData(skiLog.header, skiLog.rows), true);
    assert.deepEqual(categoricalColumns(skiLog.header, skiLog.rows), [1, 2, 3]);
  });

  it('does not take a table of counts (one label column, numbers elsewhere) for raw data', () => {
    const header = ['', 'passed', 'failed'];
    const rows = [['novice', '12', '5'], ['improver', '1,204', '7'], ['expert', '30', '2 (6%)']];
    assert.equal(looksLikeRawData(header, rows), false);
    assert.deepEqual(categoricalColumns(header, rows), [0]);
  });

  it('does not count dates, times, numbers or mostly numeric columns as categorical', () => {
    const header = ['day', 'start', 'minutes', 'share', 'tray'];
    const rows = Array.from({ length: 10 }, (_, k) => ['03/04/2024', '09:30', String(40 + k), `${k}.5%`, k === 3 ? 'n/a' : String(k)]);
    assert.deepEqual(categoricalColumns(header, rows), []);
  });

  it('passes over identifier columns whose sampled values hardly repeat, once there are enough values to tell', () => {
    const header = ['lesson_id', 'level'];
    const rows = Array.from({ length: 40 }, (_, k) => [`L-${k}`, k % 2 ? 'novice' : 'expert']);
    assert.deepEqual(categoricalColumns(header, rows), [1]);
    assert.deepEqual(categoricalColumns(header, rows.slice(0, 10)), [0, 1]);
  });

  it(`judges only the first ${RAW_DATA_SAMPLE_ROWS} rows`, () => {
    const header = ['crop', 'bench'];
    const rows = Array.from({ length: RAW_DATA_SAMPLE_ROWS + 30 }, (_, k) => (k < RAW_DATA_SAMPLE_ROWS ? ['basil', String(k % 3)] : ['basil', 'north']));
    assert.equal(looksLikeRawData(header, rows), false);
  });

  it('ignores empty cells and short rows, and needs at least one value in a column', () => {
    const header = ['crop', 'bench', 'note'];
    const rows = [['basil', '', ''], ['mint'], ['basil', 'north']];
    assert.deepEqual(categoricalColumns(header, rows), [0, 1]);
    assert.equal(looksLikeRawData(header, []), false);
  });
});
