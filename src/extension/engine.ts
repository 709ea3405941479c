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
export { DEFAULT_PLAN_ALPHA, planStudy } from '../core/plan/planStudy';
export { parseProportionGroups } from '../core/plan/parseProportionGroups';
export { checkDf, checkEffectSize, checkPower, checkProportions } from '../core/plan/validatePlanInputs';
export { writePlan } from '../core/report/writePlan';
export { planFromTable } from './planFromTable';
export { checkAlpha } from '../core/plan/validatePlanInputs';
export { buildPlanView } from './planPanelView';
export { sensitivityFromTable } from './sensitivityFromTable';
export { parseScores, tableShape } from './tableShape';
