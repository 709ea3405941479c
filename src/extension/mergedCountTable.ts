import type { Analysis } from '../core/analysis';
import { fail, ok, type CountTable, type Result } from '../core/types';

/** The row or column label under which merged expected counts are passed to the engine's expected-counts test. */
const EXPECTED_LABEL = 'Expected';

/**
 * The table the analysis's merge proposal describes, ready for `analyzeCountTable`: for independence the
 * merged rows or columns; for goodness of fit the pooled counts beside their pooled expected counts (a
 * column or row labelled "Expected", which the engine tests the counts against).
 *
 * @param analysis - an analysis whose result carries a merge proposal
 * @returns the merged table, or why it cannot be re-analysed
 */
export function mergedCountTable(analysis: Analysis): Result<CountTable> {
  const { result, table } = analysis;
  const proposal = result.mergeProposal;
  if (!proposal) return fail({ code: 'bad-option', message: 'This result has no proposed merge: Cochran\'s rule already holds or nothing can be merged.' });
  const base: CountTable = { ...table, cellLocations: undefined, warnings: [] };
  if (result.test === 'independence') {
    return ok(proposal.dimension === 'rows'
      ? { ...base, rowLabels: proposal.labels, observed: proposal.observed, rowsOrdered: table.rowsOrdered }
      : { ...base, columnLabels: proposal.labels, observed: proposal.observed, columnsOrdered: table.columnsOrdered });
  }
  if (result.hypothesis.kind === 'poisson' || result.hypothesis.kind === 'binomial') {
    return fail({
      code: 'bad-option',
      message: 'The merged result for a fitted distribution is already shown in the panel: its parameter stays estimated from the full counts, which a re-analysis of the pooled counts could not keep.',
    });
  }
  const alongRows = table.rowLabels.length !== 1;
  const labels = alongRows ? table.rowLabels : table.columnLabels;
  const indexOf = new Map(labels.map((label, index) => [label, index]));
  const pooledExpected: number[] = [];
  for (const group of proposal.groups) {
    let sum = 0;
    for (const label of group) {
      const index = indexOf.get(label);
      if (index === undefined) return fail({ code: 'bad-option', message: `The proposed merge names a category "${label}" that the table does not have; run the analysis again.` });
      sum += result.expected[index];
    }
    pooledExpected.push(sum);
  }
  const pooledObserved = proposal.observed.flat();
  if (pooledObserved.length !== pooledExpected.length) {
    return fail({ code: 'bad-option', message: 'The proposed merge does not match the table; run the analysis again.' });
  }
  if (alongRows) {
    return ok({
      ...base,
      rowLabels: proposal.labels,
      columnLabels: [table.columnLabels[0], EXPECTED_LABEL],
      observed: pooledObserved.map((count, index) => [count, pooledExpected[index]]),
    });
  }
  return ok({ ...base, rowLabels: [table.rowLabels[0], EXPECTED_LABEL], columnLabels: proposal.labels, observed: [pooledObserved, pooledExpected] });
}
