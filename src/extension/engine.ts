// Entry of dist/engine.js: the statistics and report code, loaded with require() only when a command
// runs (loadEngine.ts), so activation and the CodeLens never pay for it.
export { analyze, analyzeCountTable } from '../core/analyze';
export { resultsReport } from '../core/report/resultsReport';
export { parseFitSpec } from '../core/stats/parseFitSpec';
export { buildPanelView } from './panelView';
export { fitCategories } from './fitCategories';
export { mergedCountTable } from './mergedCountTable';
export { rawDataColumns } from './rawDataColumns';
export { withMarkup } from './withMarkup';
