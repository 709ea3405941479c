import type { DisplayTable } from '../../protocol/messages';
import { element } from './dom';

function isMarked(table: DisplayTable, row: number, column: number): boolean {
  return (table.marked ?? []).some(([r, c]) => r === row && c === column);
}

export interface CellDecoration {
  /** Classes for a body cell (row and column without the label column). */
  classes(row: number, column: number): string[];
  /** Text shown before the cell's own text, e.g. a direction marker. */
  prefix?(row: number, column: number): string;
}

/**
 * A data table with a caption, column headers (`th scope="col"`) and row headers (`th scope="row"`).
 * Marked cells get the `marked` class and a visually hidden word so they read without styling.
 */
export function renderTable(table: DisplayTable, className: string, decoration?: CellDecoration): HTMLTableElement {
  const node = element('table', undefined, { class: `data-table ${className}` });
  node.append(element('caption', table.caption));
  const head = element('thead');
  const headRow = element('tr');
  table.header.forEach((label, index) => headRow.append(element('th', label, { scope: 'col', class: index === 0 ? 'corner' : '' })));
  head.append(headRow);
  const body = element('tbody');
  table.rows.forEach((cells, r) => {
    const row = element('tr');
    const [label, ...values] = cells;
    row.append(element('th', label ?? '', { scope: 'row' }));
    values.forEach((text, c) => {
      const cell = element('td');
      const classes = decoration ? decoration.classes(r, c) : [];
      const prefix = decoration?.prefix?.(r, c) ?? '';
      if (isMarked(table, r, c)) {
        classes.push('marked');
        const strong = element('strong', prefix + text);
        cell.append(strong, element('span', ' (marked)', { class: 'visually-hidden' }));
      } else {
        cell.textContent = prefix + text;
      }
      if (classes.length > 0) cell.setAttribute('class', classes.join(' '));
      row.append(cell);
    });
    body.append(row);
  });
  node.append(head, body);
  return node;
}
