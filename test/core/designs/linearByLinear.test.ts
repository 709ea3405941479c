import assert from 'node:assert/strict';
import fc from 'fast-check';
import { jStat } from 'jstat';
import { linearByLinear } from '../../../src/core/designs/linearByLinear';
import { assertClose } from '../../helpers/assertClose';
import { designCases } from './designFixture';

// The project's jstat type declaration lists only the distributions; corrcoeff is in jstat 1.9.6 itself.
const jStatCorrelation = (jStat as unknown as { corrcoeff(x: number[], y: number[]): number }).corrcoeff;

const PROPERTY_SEED = 20261202;

describe('linearByLinear', () => {
  it('gives M² = 6.57 and r = 0.0142 in size for the malformation table of Agresti (2007, Table 2.7)', () => {
    // Agresti (2007), An Introduction to Categorical Data Analysis 2nd ed., §2.5.1, scores 0, 0.5, 1.5, 4, 7
    // (from memory). Row 1 (malformation present) has score 0 here, so r is negative.
    const result = linearByLinear([[48, 38, 5, 1, 1], [17066, 14464, 788, 126, 37]], [0, 1], [0, 0.5, 1.5, 4, 7]);
    assertClose(result.statistic, 6.57, { absolute: 0.005 });
    assertClose(Math.abs(result.correlation), 0.0142, { absolute: 0.00005 });
  });

  describe('against SciPy fixtures', () => {
    // test/fixtures/scipy/designs.json from generate_designs.py (weighted correlation in NumPy, scipy.stats.chi2.sf).
    for (const { name, input, expected, tolerance } of designCases('linear')) {
      it(`agrees with scipy 1.17.1 on ${name}`, () => {
        const result = linearByLinear(input.table as number[][], input.rowScores as number[], input.columnScores as number[]);
        assertClose(result.correlation, expected.r as number, { relative: tolerance, absolute: 1e-15 }, input);
        assertClose(result.statistic, expected.m2 as number, { relative: tolerance, absolute: 1e-15 }, input);
        assertClose(result.p.p, expected.p as number, { relative: tolerance, absolute: 1e-300 }, input);
      });
    }
  });

  it('uses the Pearson correlation of the expanded observations, as jstat 1.9.6 computes it live', () => {
    const table = [[6, 2, 1], [3, 5, 4], [1, 2, 7]];
    const rowValues: number[] = [];
    const columnValues: number[] = [];
    table.forEach((row, i) => row.forEach((count, j) => { for (let k = 0; k < count; k++) { rowValues.push(i); columnValues.push(j); } }));
    const result = linearByLinear(table);
    assertClose(result.correlation, jStatCorrelation(rowValues, columnValues), 1e-12, table);
  });

  it('throws RangeError on bad arguments', () => {
    assert.throws(() => linearByLinear([[1, 2]]), RangeError);
    assert.throws(() => linearByLinear([[1, 2], [3]]), RangeError);
    assert.throws(() => linearByLinear([[1, 2], [3, 4]], [1, 1]), RangeError);
    assert.throws(() => linearByLinear([[1, 2], [3, 4]], [0, 1], [0]), RangeError);
  });

  it('keeps p in [0, 1] and r in [−1, 1]', () => {
    const table = fc.array(fc.array(fc.integer({ min: 1, max: 30 }), { minLength: 3, maxLength: 3 }), { minLength: 2, maxLength: 5 });
    fc.assert(
      fc.property(table, (counts) => {
        const result = linearByLinear(counts);
        assert.ok(result.p.p >= 0 && result.p.p <= 1 && Math.abs(result.correlation) <= 1);
      }),
      { seed: PROPERTY_SEED, numRuns: 200 },
    );
  });
});
