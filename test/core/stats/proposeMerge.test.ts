import assert from 'node:assert/strict';
import fc from 'fast-check';
import { checkCochranRule } from '../../../src/core/stats/checkCochranRule';
import { independenceStatistic } from '../../../src/core/stats/independenceStatistic';
import { proposeMerge } from '../../../src/core/stats/proposeMerge';
import { tableMargins } from '../../../src/core/stats/tableMargins';
import { DEFAULT_TEST_OPTIONS } from '../../../src/core/stats/types';

const PROPERTY_SEED = 20260611;

describe('proposeMerge', () => {
  // Invented: bus depot, late departures by route (rows) and how late (columns, ordered).
  const routes = ['Harbour', 'Airport', 'Night owl', 'Hill loop'];
  const lateness = ['on time', '1–5 min', '6–10 min', '11–15 min', '>15 min'];
  const depot = [
    [48, 22, 9, 2, 1],
    [51, 30, 12, 3, 2],
    [6, 4, 3, 1, 0],
    [5, 3, 2, 0, 1],
  ];

  it('finds a merge that meets Cochran\'s rule for an invented sparse table', () => {
    assert.equal(checkCochranRule(tableMargins(depot).expected).ok, false);
    const proposal = proposeMerge(depot, { rows: routes, columns: lateness }, { ...DEFAULT_TEST_OPTIONS, columnsOrdered: true });
    assert.ok(proposal);
    assert.equal(proposal.passes, true);
    assert.equal(checkCochranRule(tableMargins(proposal.observed).expected).ok, true);
    const retested = independenceStatistic(proposal.observed, 'none');
    assert.deepEqual([proposal.statistic, proposal.df, proposal.p], [retested.statistic, retested.df, retested.p]);
    assert.equal(proposal.observed.flat().reduce((s, v) => s + v, 0), depot.flat().reduce((s, v) => s + v, 0));
    assert.match(proposal.reason, /Cochran's rule/);
  });

  it('joins only neighbouring categories of an ordered dimension, labelled as a range', () => {
    const proposal = proposeMerge(depot, { rows: routes, columns: lateness }, { ...DEFAULT_TEST_OPTIONS, columnsOrdered: true, rowsOrdered: true });
    assert.ok(proposal);
    const original = proposal.dimension === 'rows' ? routes : lateness;
    assert.deepEqual(proposal.groups.flat(), original, 'groups keep the original order');
    for (const [index, group] of proposal.groups.entries()) {
      if (group.length > 1) assert.match(proposal.labels[index], /–|\+/);
    }
  });

  it('joins the smallest nominal categories with " + "', () => {
    const proposal = proposeMerge([[20, 18], [15, 17], [2, 1]], { rows: ['Spruce', 'Birch', 'Larch'], columns: ['healthy', 'blighted'] }, DEFAULT_TEST_OPTIONS);
    assert.deepEqual(proposal?.groups, [['Spruce'], ['Birch', 'Larch']]);
    assert.deepEqual(proposal?.labels, ['Spruce', 'Birch + Larch']);
    assert.deepEqual(proposal?.observed, [[20, 18], [17, 18]]);
    assert.equal(proposal?.dimension, 'rows');
  });

  it('prefers the dimension that needs fewer merges', () => {
    // Columns: one thin column fixes it; rows would need several merges.
    const table = [
      [30, 25, 1],
      [28, 30, 0],
      [25, 27, 1],
      [31, 22, 1],
    ];
    const proposal = proposeMerge(table, { rows: ['a', 'b', 'c', 'd'], columns: ['x', 'y', 'z'] }, DEFAULT_TEST_OPTIONS);
    assert.equal(proposal?.dimension, 'columns');
    assert.deepEqual(proposal?.groups, [['x'], ['y', 'z']]);
  });

  it('returns the best attempt with passes = false when no single-dimension merge is enough', () => {
    const proposal = proposeMerge([[1, 1, 1], [1, 1, 1], [1, 1, 2]], { rows: ['a', 'b', 'c'], columns: ['x', 'y', 'z'] }, DEFAULT_TEST_OPTIONS);
    assert.ok(proposal);
    assert.equal(proposal.passes, false);
    assert.match(proposal.reason, /still not met/);
  });

  it('proposes nothing when the table passes or every dimension has two categories', () => {
    assert.equal(proposeMerge([[20, 30], [25, 35]], { rows: ['a', 'b'], columns: ['x', 'y'] }, DEFAULT_TEST_OPTIONS), undefined);
    assert.equal(proposeMerge([[1, 2], [3, 1]], { rows: ['a', 'b'], columns: ['x', 'y'] }, DEFAULT_TEST_OPTIONS), undefined);
  });

  it('keeps merged tables consistent with the original on random sparse tables (fast-check)', () => {
    const sparse = fc.tuple(fc.integer({ min: 2, max: 6 }), fc.integer({ min: 2, max: 6 }))
      .chain(([r, c]) => fc.array(fc.array(fc.integer({ min: 0, max: 12 }), { minLength: c, maxLength: c }), { minLength: r, maxLength: r }))
      .filter((t) => t.every((row) => row.some((v) => v > 0)) && t[0].every((_, j) => t.some((row) => row[j] > 0)));
    fc.assert(fc.property(sparse, fc.boolean(), fc.boolean(), (table, rowsOrdered, columnsOrdered) => {
      const labels = { rows: table.map((_, i) => `r${i}`), columns: table[0].map((_, j) => `c${j}`) };
      const proposal = proposeMerge(table, labels, { ...DEFAULT_TEST_OPTIONS, rowsOrdered, columnsOrdered });
      if (!proposal) return;
      const original = proposal.dimension === 'rows' ? labels.rows : labels.columns;
      assert.deepEqual([...proposal.groups.flat()].sort(), [...original].sort());
      if (proposal.dimension === 'rows' ? rowsOrdered : columnsOrdered) assert.deepEqual(proposal.groups.flat(), original);
      assert.equal(proposal.passes, checkCochranRule(tableMargins(proposal.observed).expected).ok);
      assert.ok(proposal.groups.length >= 2 && proposal.p >= 0 && proposal.p <= 1);
    }), { seed: PROPERTY_SEED, numRuns: 200 });
  });
});
