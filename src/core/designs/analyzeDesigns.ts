import type { AnalyzeOptions, PairedAnalysis, StratifiedAnalysis } from '../analysis';
import { describeLocation } from '../table/describeLocation';
import type { LabelledStratum } from '../table/strataTables';
import { fail, ok, type CountTable, type Issue, type Result } from '../types';
import { cochranMantelHaenszel, type StratumTable } from './cochranMantelHaenszel';
import { exactStratifiedTest, MAX_EXACT_SUPPORT } from './exactStratifiedTest';
import { mantelFleissCriterion } from './mantelFleissCriterion';
import { mcnemarTest } from './mcnemarTest';

function asTwoByTwo(table: CountTable): StratumTable {
  const [[a, b], [c, d]] = table.observed;
  return [[a, b], [c, d]];
}

/**
 * McNemar's test for a 2×2 of the same units classified twice. The mid-p leads by default: it
 * keeps close to the nominal level where the exact conditional p is conservative and the
 * asymptotic one is too liberal with few discordant pairs (Fagerland, Lydersen & Laake 2013).
 */
export function analyzePaired(table: CountTable, options: AnalyzeOptions): Result<{ paired: PairedAnalysis; warnings: Issue[] }> {
  const location = { line: table.startLine, column: 1 };
  if (table.rowLabels.length !== 2 || table.columnLabels.length !== 2) {
    return fail({
      code: 'bad-option',
      message: `${describeLocation(location)}: a paired analysis needs a 2×2 table (the same units classified twice: the first answer in the rows, the second in the columns); this table is ${table.rowLabels.length}×${table.columnLabels.length}. Reduce it to two answers, or analyse it as independent groups.`,
      location,
    });
  }
  const result = mcnemarTest(asTwoByTwo(table), options.confidenceLevel);
  const warnings: Issue[] = [...table.warnings];
  const method = options.pValueMethod === 'asymptotic' ? 'asymptotic' : options.pValueMethod === 'auto' ? 'mid-p' : 'exact';
  if (options.pValueMethod === 'monte-carlo') {
    warnings.push({ code: 'bad-option', message: 'A paired table needs no simulation: its exact p comes straight from the binomial distribution, so that is reported instead.' });
  }
  const leadingTail = method === 'mid-p' ? result.midP : method === 'exact' ? result.exact : result.chiSquare;
  const sameLabels = table.rowLabels.every((label, index) => label.trim().toLowerCase() === table.columnLabels[index].trim().toLowerCase());
  if (!sameLabels) {
    warnings.push({
      code: 'paired-labels',
      message: `${describeLocation(location)}: the row labels (${table.rowLabels.join(', ')}) and column labels (${table.columnLabels.join(', ')}) differ; a paired table lists the same two answers in the same order in both, so check that the diagonal holds the units whose answer did not change.`,
      location,
    });
  }
  return ok({ paired: { ...result, leading: { p: leadingTail.p, log10p: leadingTail.log10p, method } }, warnings });
}

/** The strata summed cell by cell, as one table for context and for the crude odds ratio. */
export function sumStrata(strata: readonly LabelledStratum[]): CountTable {
  const first = strata[0].table;
  const last = strata[strata.length - 1].table;
  const observed = first.observed.map((row, r) => row.map((_, c) => strata.reduce((sum, stratum) => sum + stratum.table.observed[r][c], 0)));
  return { ...first, observed, cellLocations: undefined, startLine: first.startLine, endLine: last.endLine, warnings: strata.flatMap((stratum) => stratum.table.warnings) };
}

/** The CMH test, common odds ratio and homogeneity over K strata; each stratum must be 2×2 with the same labels. */
export function analyzeStrata(strata: readonly LabelledStratum[], options: AnalyzeOptions): Result<{ stratified: StratifiedAnalysis; warnings: Issue[] }> {
  if (strata.length < 2) {
    return fail({ code: 'bad-option', message: 'A stratified analysis needs at least two strata: put the 2×2 tables one after another with the same row and column labels, or name a stratum column in a raw data file.' });
  }
  for (const { label, table } of strata) {
    if (table.rowLabels.length !== 2 || table.columnLabels.length !== 2) {
      const location = { line: table.startLine, column: 1 };
      return fail({ code: 'bad-option', message: `${describeLocation(location)}: stratum "${label}" is ${table.rowLabels.length}×${table.columnLabels.length}; each stratum must be a 2×2 table (two groups, two outcomes).`, location });
    }
  }
  const tables = strata.map((stratum) => asTwoByTwo(stratum.table));
  const informative = tables.filter(([[a, b], [c, d]]) => a + b + c + d >= 2);
  if (informative.length === 0) {
    return fail({ code: 'empty-strata', message: 'Every stratum has fewer than two observations, so there is nothing to compare within strata.' });
  }
  const cmh = cochranMantelHaenszel(tables, options.confidenceLevel);
  const mantelFleiss = mantelFleissCriterion(tables);
  const warnings: Issue[] = [];
  const where = { line: strata[0].table.startLine, column: 1 };
  const wantExact = options.pValueMethod === 'exact' || options.pValueMethod === 'monte-carlo' || (options.pValueMethod === 'auto' && !mantelFleiss.ok);
  const exact = wantExact ? exactStratifiedTest(tables) : undefined;
  let exactReason: string | undefined;
  if (wantExact) {
    const why = options.pValueMethod === 'auto'
      ? `Because the summed expected count lies only ${mantelFleiss.distance.toFixed(1)} from a bound the margins allow (the Mantel–Fleiss criterion asks for 5)`
      : 'As requested';
    exactReason = exact
      ? `${why}, the p-value is from the exact conditional test (the distribution of the summed top-left counts given every stratum's margins).`
      : `${why}, an exact conditional test was wanted, but its support (more than ${MAX_EXACT_SUPPORT.toLocaleString('en-US')} values) is too large; the CMH chi-square p is reported, so read it with care.`;
  }
  if (!mantelFleiss.ok) {
    warnings.push({
      code: 'validity',
      message: `${describeLocation(where)}: the Mantel–Fleiss criterion is not met (the summed expected count is ${mantelFleiss.distance.toFixed(1)} from a bound; 5 is needed), so the CMH chi-square p-value may be inaccurate. ${exact ? 'The exact conditional p leads instead.' : 'Collect more observations per stratum or combine similar strata.'}`,
      location: where,
    });
  }
  if (cmh.breslowDay && cmh.breslowDay.tarone.p < options.alpha) {
    warnings.push({
      code: 'heterogeneity',
      message: `${describeLocation(where)}: the odds ratio differs between strata (Breslow–Day with Tarone's correction, p = ${cmh.breslowDay.tarone.p.toPrecision(2)}); the common odds ratio is a poor summary, so report the strata separately.`,
      location: where,
    });
  }
  const stratified = { strata: strata.map(({ label, table }) => ({ label, table })), cmh, mantelFleiss, ...(exact ? { exact } : {}), ...(exactReason ? { exactReason } : {}) };
  return ok({ stratified, warnings });
}
