import type { PlanPanelToHost, PlanView } from '../../protocol/planView';
import { button, element, section } from './dom';
import { renderPowerCurveChart } from './powerCurveChart';
import { renderTable } from './table';

type Post = (message: PlanPanelToHost) => void;

function headerSection(view: PlanView): HTMLElement {
  const node = element('header', undefined, { class: 'panel-header' });
  node.append(element('h1', view.title), element('p', view.headline, { class: 'summary plan-headline' }));
  return node;
}

function factsSection(view: PlanView): HTMLElement {
  const node = section(view.labels.facts, 'plan-facts');
  const list = element('dl', undefined, { class: 'plan-facts' });
  for (const fact of view.facts) list.append(element('dt', fact.label), element('dd', fact.value));
  node.append(list);
  return node;
}

function curveSection(view: PlanView): HTMLElement {
  const node = section(view.labels.curve, 'power-curve');
  const figure = element('figure', undefined, { class: 'chart-figure', 'data-chart': 'power-curve' });
  figure.append(renderPowerCurveChart(view.curve), element('figcaption', view.curve.description));
  const fallback = element('details', undefined, { class: 'curve-table' });
  fallback.append(element('summary', view.curve.tableToggle), renderTable(view.curve.table, 'power-curve-table'));
  node.append(figure, fallback);
  return node;
}

function listSection(title: string, id: string, items: string[]): HTMLElement | undefined {
  if (items.length === 0) return undefined;
  const node = section(title, id);
  const list = element('ul');
  for (const item of items) list.append(element('li', item));
  node.append(list);
  return node;
}

function paragraphSection(view: PlanView, post: Post): HTMLElement {
  const node = section(view.labels.paragraph, 'plan-paragraph');
  node.append(element('p', view.paragraph, { class: 'write-up plan-paragraph' }));
  const row = element('div', undefined, { class: 'button-row' });
  if (view.insertUnavailable === undefined) row.append(button(view.labels.insert, () => post({ type: 'insertPlan' }), { 'data-action': 'insert-plan' }));
  row.append(button(view.labels.copy, () => post({ type: 'copyPlan' }), { class: view.insertUnavailable === undefined ? 'secondary' : '', 'data-action': 'copy-plan' }));
  node.append(row);
  if (view.insertUnavailable !== undefined) node.append(element('p', view.insertUnavailable, { class: 'legend-note' }));
  return node;
}

/** Lays out one finished plan view; the panel adds no numbers and no prose of its own. */
export function renderPlanView(root: HTMLElement, view: PlanView, post: Post): void {
  const parts = [
    headerSection(view),
    factsSection(view),
    curveSection(view),
    listSection(view.labels.assumptions, 'plan-assumptions', view.assumptions),
    paragraphSection(view, post),
    listSection(view.labels.notes, 'plan-notes', view.notes),
  ];
  root.replaceChildren(...parts.filter((part): part is HTMLElement => part !== undefined));
}
