import assert from 'node:assert/strict';
import * as core from '../../src/core/index';

describe('core API surface', () => {
  it('exports exactly these runtime names', () => {
    assert.deepEqual(Object.keys(core).sort(), [
      'CANCEL_INDEX', 'DEFAULT_ANALYZE_OPTIONS', 'DEFAULT_SEED', 'analyze', 'analyzeCountTable', 'chiSquareCriticalValue',
      'chiSquareUpperTail', 'choosePValue', 'contributionsTable', 'createCrossTabulator', 'crossTabulateText',
      'exactMultinomial', 'expectedCountsTable', 'findMarkdownTables', 'fisherExact2x2', 'freemanHaltonExact',
      'locateTable', 'monteCarloGoodnessOfFit', 'monteCarloIndependence', 'noncentralChiSquareCdf', 'observedTable',
      'planStudy', 'proposeMerge', 'readCountTable', 'renderTable', 'resolveOptions', 'resultsReport', 'runAnalysisJob', 'smallestDetectableDifference', 'smallestDetectableEffect',
      'statisticsLines', 'testGoodnessOfFit', 'testIndependence', 'toJson', 'writePlan', 'writeUp',
      'analyzeStrataTables', 'analyzeTabulatedStrata', 'locateStrata', 'strataFromCrossTabulation', 'mcnemarTest',
      'cochranMantelHaenszel', 'exactStratifiedTest', 'mantelFleissCriterion', 'cochranArmitageTrend', 'linearByLinear',
      'pairwiseComparisons', 'adjustPValues', 'DEFAULT_DESIGN_OPTIONS', 'designSections',
    ].sort());
  });
});
