import { analyzeCountTable } from '../src/core/analyze';
import { DEFAULT_ANALYZE_OPTIONS } from '../src/core/options';
import { testIndependence } from '../src/core/stats/testIndependence';
import { findMarkdownTables } from '../src/core/table/findMarkdownTables';
import type { CountTable } from '../src/core/types';
import { medianMs, seededRandom, type Figure } from './timing';

function randomTable(rows: number, columns: number, seed: number): CountTable {
  const random = seededRandom(seed);
  const observed = Array.from({ length: rows }, () => Array.from({ length: columns }, () => 5 + Math.floor(random() * 60)));
  return {
    format: 'markdown',
    rowLabels: observed.map((_, r) => `Row ${r + 1}`),
    columnLabels: observed[0].map((_, c) => `Column ${c + 1}`),
    observed,
    startLine: 1,
    endLine: rows + 2,
    rowsOrdered: false,
    columnsOrdered: false,
    generatedRowLabels: false,
    generatedColumnLabels: false,
    warnings: [],
  };
}

/** A Markdown document of about `megabytes` MB holding `tables` count tables between paragraphs. */
export function markdownWithTables(tables: number, megabytes: number, seed: number): string {
  const random = seededRandom(seed);
  const prose = 'The depot log for this week notes the shift, the weather and the buses that came back late. ';
  const parts: string[] = [];
  const proseRepeats = Math.max(1, Math.round((megabytes * 1024 * 1024) / tables / prose.length) - 3);
  for (let t = 0; t < tables; t++) {
    parts.push(`## Week ${t + 1}\n\n${prose.repeat(proseRepeats)}\n`);
    const header = '| Depot | Diesel | Hybrid | Electric |\n|---|---:|---:|---:|';
    const body = ['Eastgate', 'Riverside', 'Hilltop'].map((d) => `| ${d} | ${[0, 1, 2].map(() => Math.floor(random() * 90)).join(' | ')} |`);
    parts.push([header, ...body].join('\n') + '\n');
  }
  return parts.join('\n');
}

export function benchAnalysis(): Figure[] {
  const big = randomTable(50, 50, 1);
  const small = randomTable(3, 4, 2);
  const document = markdownWithTables(500, 5, 3);
  const found = findMarkdownTables(document).length;
  if (found !== 500) throw new Error(`benchmark document should hold 500 tables, found ${found}`);
  return [
    // The "full analysis": statistics, residuals, effect sizes and the V interval.
    { name: 'statistics, residuals, V with CI: 50×50 table', value: medianMs(() => testIndependence(big.observed)), unit: 'ms', target: { value: 10, better: 'lower' } },
    { name: 'statistics, residuals, V with CI: 3×4 table', value: medianMs(() => testIndependence(small.observed)), unit: 'ms', target: { value: 0.2, better: 'lower' } },
    // Everything a user gets, write-up and ready-to-insert tables included (no target set).
    { name: 'whole analysis with write-up and tables: 50×50', value: medianMs(() => analyzeCountTable(big, { index: 1, count: 1 }, undefined, DEFAULT_ANALYZE_OPTIONS)), unit: 'ms' },
    { name: 'whole analysis with write-up and tables: 3×4', value: medianMs(() => analyzeCountTable(small, { index: 1, count: 1 }, undefined, DEFAULT_ANALYZE_OPTIONS)), unit: 'ms' },
    { name: `find all tables, ${(document.length / 1048576).toFixed(1)} MB Markdown, 500 tables`, value: medianMs(() => findMarkdownTables(document), 1500), unit: 'ms', target: { value: 200, better: 'lower' } },
  ];
}
