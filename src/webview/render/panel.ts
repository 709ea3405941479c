import type { PanelToHost, PanelView } from '../../protocol/messages';
import { renderCharts } from './charts';
import { renderDesignSections } from './designSections';
import { button, element, section } from './dom';
import { renderHeatMap } from './heatMap';
import { renderTable } from './table';

type Post = (message: PanelToHost) => void;

/** Expected counts, contributions and residuals of independence do not describe paired or stratified counts. */
function hasIndependenceTables(view: PanelView): boolean {
  return view.kind !== 'paired' && view.kind !== 'stratified';
}

function summarySection(view: PanelView): HTMLElement {
  const node = element('header', undefined, { class: 'panel-header' });
  node.append(element('h1', view.title), element('p', view.summary, { class: 'summary' }));
  const validity = element('p', undefined, { class: `validity ${view.validityOk ? 'validity-ok' : 'validity-failed'}` });
  validity.append(element('strong', view.validityOk ? '✓ Validity check met. ' : '⚠ Validity check not met. '), document.createTextNode(view.validity));
  node.append(validity);
  return node;
}

function warningsSection(view: PanelView): HTMLElement | undefined {
  if (view.warnings.length === 0) return undefined;
  const node = section('Notes', 'notes');
  const list = element('ul');
  for (const warning of view.warnings) list.append(element('li', warning));
  node.append(list);
  return node;
}

function exactSection(view: PanelView, post: Post): HTMLElement | undefined {
  if (!view.canRunExact) return undefined;
  const node = section('Exact p-value', 'exact');
  node.append(element('p', 'The chi-square p-value may be inaccurate for these counts. Ask for a p-value that does not rely on the approximation:'));
  const row = element('div', undefined, { class: 'button-row' });
  row.append(
    button('Run the exact test', () => post({ type: 'runExact', method: 'exact' }), { 'data-action': 'run-exact' }),
    button('Estimate by simulation (Monte Carlo)', () => post({ type: 'runExact', method: 'monte-carlo' }), { class: 'secondary', 'data-action': 'run-monte-carlo' }),
  );
  node.append(row);
  return node;
}

function writeUpSection(view: PanelView, post: Post): HTMLElement {
  const node = section('Write-up', 'write-up');
  node.append(element('p', view.writeUp, { class: 'write-up' }));
  const row = element('div', undefined, { class: 'button-row' });
  row.append(
    button('Insert below the table', () => post({ type: 'insertWriteUp', withExpectedTable: false, withChartLink: false }), { 'data-action': 'insert' }),
    ...(!hasIndependenceTables(view)
      ? []
      : [button('Insert with the expected counts', () => post({ type: 'insertWriteUp', withExpectedTable: true, withChartLink: false }), { class: 'secondary', 'data-action': 'insert-with-expected' })]),
    button('Copy', () => post({ type: 'copyWriteUp' }), { class: 'secondary', 'data-action': 'copy' }),
  );
  node.append(row);
  return node;
}

function tablesSection(view: PanelView): HTMLElement {
  const node = section('Tables', 'tables');
  const { observed, expected, contributions, residuals } = view.tables;
  if (!hasIndependenceTables(view)) {
    node.append(renderTable(observed, 'observed'));
    return node;
  }
  node.append(
    renderTable(observed, 'observed'),
    renderTable(expected, 'expected'),
    renderTable(contributions, 'contributions'),
    renderHeatMap(residuals),
    element('p', '▲ more than expected, ▼ fewer; bold cells are beyond the marked critical value. Colour depth follows the size of the residual.', { class: 'legend-note' }),
  );
  return node;
}

function mergeSection(view: PanelView, post: Post): HTMLElement | undefined {
  if (!view.merge) return undefined;
  const node = section('Proposed merge', 'merge');
  node.append(element('p', view.merge.description), renderTable(view.merge.table, 'merged'), element('p', view.merge.result, { class: 'merge-result' }));
  const row = element('div', undefined, { class: 'button-row' });
  row.append(button('Apply the proposed merge', () => post({ type: 'applyMerge' }), { 'data-action': 'apply-merge' }));
  node.append(row);
  return node;
}

function detailsSection(view: PanelView): HTMLElement | undefined {
  if (view.details.length === 0) return undefined;
  const node = section('All statistics', 'details');
  const list = element('ul', undefined, { class: 'details' });
  for (const line of view.details) list.append(element('li', line));
  node.append(list);
  return node;
}

/** Lays out one finished view; the panel adds no numbers and no prose of its own about the data. */
export function renderPanel(root: HTMLElement, view: PanelView, post: Post): void {
  const parts: (HTMLElement | undefined)[] = [
    summarySection(view),
    warningsSection(view),
    exactSection(view, post),
    ...renderDesignSections(view.designSections ?? []),
    mergeSection(view, post),
    writeUpSection(view, post),
    tablesSection(view),
    ...(view.chart ? renderCharts(view.chart, post) : []),
    detailsSection(view),
  ];
  root.replaceChildren(...parts.filter((part): part is HTMLElement => part !== undefined));
}
