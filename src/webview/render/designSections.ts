import type { DesignSection } from '../../protocol/designSections';
import { element, section } from './dom';
import { renderTable } from './table';

/** One design block (paired, strata, pairwise, ordered): its lines as a list, then its table. */
function renderDesignSection(design: DesignSection): HTMLElement {
  const node = section(design.title, `design-${design.id}`);
  node.setAttribute('data-design', design.id);
  const list = element('ul', undefined, { class: 'design-lines' });
  for (const line of design.lines) list.append(element('li', line));
  node.append(list);
  if (design.table) node.append(renderTable(design.table, `design-table ${design.id}`));
  return node;
}

export function renderDesignSections(sections: readonly DesignSection[]): HTMLElement[] {
  return sections.map(renderDesignSection);
}
