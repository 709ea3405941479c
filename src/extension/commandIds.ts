/** Every command Tallywise contributes; package.json must list exactly these (pinned by a test). */
export const COMMAND_ID = {
  checkTableHere: 'tallywise.checkTableHere',
  testFit: 'tallywise.testFit',
  insertWriteUp: 'tallywise.insertWriteUp',
  copyResults: 'tallywise.copyResults',
  panelState: 'tallywise.test.panelState',
  planStudy: 'tallywise.planStudy',
  checkTableAs: 'tallywise.checkTableAs',
} as const;

/** The results panel's view type (also its `onWebviewPanel:` activation event). */
export const RESULTS_VIEW_TYPE = 'tallywise.results';
