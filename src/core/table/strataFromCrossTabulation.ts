import { fail, ok, type CountTable, type Result } from '../types';
import type { CrossTabulation } from './crossTabulationTypes';
import type { StrataTables } from './strataTables';

function describeValues(labels: readonly string[]): string {
  const shown = labels.slice(0, 5).map((label) => `"${label}"`).join(', ');
  return labels.length > 5 ? `${shown} and ${labels.length - 5} more` : shown;
}

/**
 * Turns a cross-tabulation with a stratum column into the strata of a stratified 2×2×K design: one 2×2 table per
 * stratum value, all on the cross-tabulation's two row labels and two column labels (a stratum where a
 * combination never occurs has a 0 there).
 *
 * @param tabulation - the result of `crossTabulateText` or `createCrossTabulator` with the `stratum` option
 * @returns the strata in order of first appearance, or an issue when the table is not 2×2 or there are fewer
 *   than two strata (`strata`), or when no stratum column was chosen (`bad-option`)
 * @example
 * const tabulation = crossTabulateText(text, { columns: ['van', 'late'], stratum: 'shift' });
 * if (tabulation.ok) strataFromCrossTabulation(tabulation.value); // ok: one 2×2 table per shift
 */
export function strataFromCrossTabulation(tabulation: CrossTabulation): Result<StrataTables> {
  const where = { line: tabulation.startLine, column: 1 };
  const [rowName, columnName] = tabulation.columnsUsed;
  if (tabulation.strata === undefined || tabulation.stratumColumn === undefined) {
    return fail({ code: 'bad-option', message: 'No stratum column was chosen. Choose the column whose values split the rows into strata (such as a site or a shift).', location: where });
  }
  for (const [name, labels, role] of [[rowName, tabulation.rowLabels, 'group'], [columnName, tabulation.columnLabels, 'outcome']] as const) {
    if (labels.length !== 2) {
      const count = labels.length === 1 ? 'only 1 value' : `${labels.length} values`;
      return fail({
        code: 'strata',
        message: `The ${role} column '${name}' has ${count} (${describeValues(labels)}); a stratified analysis needs exactly two groups and two outcomes. ` +
          'Choose columns with two values each, or group the values into two categories first.',
        location: where,
      });
    }
  }
  if (tabulation.strata.length < 2) {
    return fail({
      code: 'strata',
      message: `The stratum column '${tabulation.stratumColumn}' has only one value (${describeValues(tabulation.strata.map((stratum) => stratum.label))}); a stratified analysis needs two or more strata. Choose another stratum column, or analyse the table without strata.`,
      location: where,
    });
  }
  const strata = tabulation.strata.map((stratum) => {
    const table: CountTable = {
      format: 'crosstab',
      rowLabels: [...tabulation.rowLabels],
      columnLabels: [...tabulation.columnLabels],
      observed: stratum.observed.map((row) => [...row]),
      startLine: tabulation.startLine,
      endLine: tabulation.endLine,
      rowsOrdered: tabulation.rowsOrdered,
      columnsOrdered: tabulation.columnsOrdered,
      generatedRowLabels: false,
      generatedColumnLabels: false,
      warnings: [],
    };
    return { label: stratum.label, table };
  });
  return ok({
    strata,
    rowLabels: [...tabulation.rowLabels],
    columnLabels: [...tabulation.columnLabels],
    firstIndex: 1,
    lastIndex: 1,
    count: 1,
    startLine: tabulation.startLine,
    endLine: tabulation.endLine,
    notes: [],
  });
}
