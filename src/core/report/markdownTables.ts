import type { ReportOptions } from '../analysis';
import type { TestResult } from '../stats/types';
import type { CountTable } from '../types';
import { formatFixed, formatPercent, formatSigned } from './formatNumber';

/** Escapes a label for a GFM table cell: pipes and backslashes would otherwise change the table. */
function cellText(label: string): string {
  if (!/[\\|\r\n]/.test(label)) return label;
  return label.replace(/\\/g, '\\\\').replace(/\|/g, '\\|').replace(/\r?\n/g, ' ');
}

/** A GFM table (Markdown) or space-aligned columns (plain text) from a header and rows. */
export function renderTable(header: string[], rows: string[][], markup: ReportOptions['markup']): string {
  if (markup === 'markdown') {
    const line = (cells: string[]) => `| ${cells.map(cellText).join(' | ')} |`;
    const align = `| ${header.map((_, i) => (i === 0 ? '---' : '---:')).join(' | ')} |`;
    return [line(header), align, ...rows.map(line)].join('\n');
  }
  const all = [header, ...rows];
  const widths = header.map((_, c) => Math.max(...all.map((r) => (r[c] ?? '').length)));
  return all
    .map((r) => r.map((cell, c) => (c === 0 ? cell.padEnd(widths[c]) : cell.padStart(widths[c]))).join('  ').trimEnd())
    .join('\n');
}

function labelsFor(table: CountTable): { rows: string[]; columns: string[] } {
  return { rows: table.rowLabels, columns: table.columnLabels };
}

/** Expected counts under the hypothesis, one decimal, beside the observed counts' layout. */
export function expectedCountsTable(result: TestResult, table: CountTable, report: ReportOptions): string {
  const { rows, columns } = labelsFor(table);
  const expected = result.test === 'independence' ? result.expected : reshape(result.expected, table);
  const header = ['Expected', ...columns];
  const body = expected.map((row, r) => [rows[r], ...row.map((e) => formatFixed(e, 1))]);
  return renderTable(header, body, report.markup);
}

/**
 * Each cell's contribution to X² with its share and signed residual, e.g. "6.12 (33%, +2.47)".
 * Independence tables show adjusted residuals; goodness of fit shows standardized residuals.
 */
export function contributionsTable(result: TestResult, table: CountTable, report: ReportOptions): string {
  const { rows, columns } = labelsFor(table);
  const contributions = result.test === 'independence' ? result.contributions : reshape(result.contributions, table);
  const shares = result.test === 'independence' ? result.contributionShares : reshape(result.contributionShares, table);
  const residuals = result.test === 'independence' ? result.adjustedResiduals : reshape(result.standardizedResiduals, table);
  const header = ['Contribution to χ² (share, residual)', ...columns];
  const body = contributions.map((row, r) => [
    rows[r],
    ...row.map((x, c) => `${formatFixed(x, report.decimals)} (${formatPercent(shares[r][c])}, ${formatSigned(residuals[r][c], 2)})`),
  ]);
  return renderTable(header, body, report.markup);
}

/** Goodness-of-fit vectors back into the table's 1×k or k×1 shape. */
function reshape(values: number[], table: CountTable): number[][] {
  return table.rowLabels.length === 1 ? [values] : values.map((v) => [v]);
}
