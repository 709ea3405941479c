import type { Analysis } from './analysis';

/**
 * The stable JSON shape of one analysis (documented in the README, "JSON output").
 * Field names here are an interface: scripts read them. Add fields; do not rename them.
 */
export function toJson(analysis: Analysis): Record<string, unknown> {
  const { result, table, origin } = analysis;
  const common = {
    kind: analysis.kind,
    test: result.test,
    n: result.n,
    df: result.df,
    statistic: result.statistic,
    p: result.p,
    log10p: result.log10p,
    g: result.g.statistic,
    gTest: result.g,
    validity: result.validity,
    mergeProposal: result.mergeProposal ?? null,
    exact: analysis.exact
      ? {
        method: analysis.exact.method,
        p: analysis.exact.p,
        log10p: analysis.exact.log10p,
        replicates: analysis.exact.replicates ?? null,
        seed: analysis.exact.seed ?? null,
        interval: analysis.exact.interval ?? null,
        elapsedMs: analysis.exact.elapsedMs,
        reason: analysis.exact.reason,
        exactStoppedBy: analysis.exact.exactStoppedBy ?? null,
        pLess: analysis.exact.pLess ?? null,
        pGreater: analysis.exact.pGreater ?? null,
      }
      : null,
    exactNote: analysis.exactNote ?? null,
    followUps: analysis.followUps ?? null,
    paired: analysis.paired ?? null,
    stratified: analysis.stratified
      ? {
        strata: analysis.stratified.strata.map((stratum, index) => ({
          label: stratum.label,
          observed: stratum.table.observed,
          startLine: stratum.table.startLine,
          n: analysis.stratified!.cmh.strata[index].n,
          oddsRatio: analysis.stratified!.cmh.strata[index].oddsRatio ?? null,
        })),
        cmh: analysis.stratified.cmh.statistic,
        cmhCorrected: analysis.stratified.cmh.corrected,
        pooledOddsRatio: analysis.stratified.cmh.pooledOddsRatio ?? null,
        breslowDay: analysis.stratified.cmh.breslowDay ?? null,
        mantelFleiss: analysis.stratified.mantelFleiss,
        exact: analysis.stratified.exact ?? null,
        exactReason: analysis.stratified.exactReason ?? null,
        strataSkipped: analysis.stratified.cmh.strataSkipped,
      }
      : null,
    warnings: analysis.warnings.map((w) => ({ code: w.code, message: w.message, location: w.location ?? null })),
    writeUp: analysis.writeUp,
    expectedTable: analysis.expectedTable,
    contributionsTable: analysis.contributionsTable,
    table: {
      format: table.format,
      rowLabels: table.rowLabels,
      columnLabels: table.columnLabels,
      observed: table.observed,
      startLine: table.startLine,
      endLine: table.endLine,
      index: origin.index,
      count: origin.count,
      rowsOrdered: table.rowsOrdered,
      columnsOrdered: table.columnsOrdered,
      crossTabulation: origin.crossTabulation ?? null,
    },
    options: {
      alpha: analysis.options.alpha,
      confidenceLevel: analysis.options.confidenceLevel,
      continuity: analysis.options.continuity,
      pValueMethod: analysis.options.pValueMethod,
      design: analysis.options.design,
      ordered: analysis.options.ordered,
      pairwise: analysis.options.pairwise,
    },
  };
  if (result.test === 'independence') {
    return {
      ...common,
      expected: result.expected,
      contributions: result.contributions,
      contributionShares: result.contributionShares,
      pearsonResiduals: result.pearsonResiduals,
      adjustedResiduals: result.adjustedResiduals,
      residualCriticalValue: result.residualCriticalValue,
      flaggedCells: result.flaggedCells,
      pearson: result.pearson,
      yates: result.yates ?? null,
      continuityCorrected: result.continuityCorrected,
      cramersV: result.effect.cramersV,
      effect: result.effect,
      twoByTwo: result.twoByTwo ?? null,
      rowProportions: result.rowProportions,
      columnProportions: result.columnProportions,
    };
  }
  return {
    ...common,
    hypothesis: result.hypothesis,
    estimatedParameters: result.estimatedParameters,
    expectedProportions: result.expectedProportions,
    expected: result.expected,
    contributions: result.contributions,
    contributionShares: result.contributionShares,
    pearsonResiduals: result.pearsonResiduals,
    standardizedResiduals: result.standardizedResiduals,
    residualCriticalValue: result.residualCriticalValue,
    flaggedCells: result.flaggedCells,
    cohensW: result.cohensW,
    cramersV: null,
    proportions: result.proportions,
  };
}
