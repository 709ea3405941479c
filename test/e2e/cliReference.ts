import { spawnSync } from 'node:child_process';
import * as path from 'node:path';

// The CLI (dist/cli.js, built from the same sources as the packaged extension) run on the bundled
// example a scenario opens: what the results panel shows is checked against what the CLI reports for
// the same file and options, so no number in the UI scenarios is typed in by hand.

const root = path.resolve(__dirname, '..', '..', '..');
const CLI = path.join(root, 'dist', 'cli.js');
const CLI_MS = 60_000;

/** One design block of the CLI's text report: "Title:", its "- " lines, then an optional Markdown table. */
export interface CliSection {
  title: string;
  lines: string[];
  /** Header and body rows of the table under the block (cells as printed), when there is one. */
  table?: { header: string[]; rows: string[][] };
}

function runCli(example: string, args: string[]): string {
  const file = path.join(root, 'examples', example);
  const result = spawnSync(process.execPath, [CLI, 'analyze', file, ...args], { encoding: 'utf8', timeout: CLI_MS });
  if (result.status !== 0) {
    throw new Error(`the CLI reference run failed (exit ${result.status ?? result.signal}): tallywise analyze examples/${example} ${args.join(' ')}\n${result.stderr}`);
  }
  return result.stdout;
}

/** `tallywise analyze examples/<example> <args> --json`, parsed (one table, so one JSON object). */
export function cliJson<T>(example: string, args: string[]): T {
  return JSON.parse(runCli(example, [...args, '--json'])) as T;
}

function cells(line: string): string[] {
  return line.replace(/^\|\s?/, '').replace(/\s?\|$/, '').split(' | ').map((cell) => cell.replace(/\\\|/g, '|').trim());
}

/**
 * The design block titled `title` in the CLI's text report for the same file and options. `withTable`
 * says whether the block ends in a table: in the text report a block's table and the next block (for a
 * paired table, the observed counts) are both a blank line away, so the layout alone cannot tell.
 */
export function cliSection(example: string, args: string[], title: string, withTable: boolean): CliSection {
  const lines = runCli(example, args).split('\n');
  const start = lines.indexOf(`${title}:`);
  if (start < 0) throw new Error(`the CLI report of examples/${example} ${args.join(' ')} has no "${title}:" block`);
  let at = start + 1;
  const bullets: string[] = [];
  while (at < lines.length && lines[at].startsWith('- ')) bullets.push(lines[at++].slice(2));
  const section: CliSection = { title, lines: bullets };
  if (!withTable) return section;
  if (lines[at] !== '' || !lines[at + 1]?.startsWith('| ') || !/^\| -+/.test(lines[at + 2] ?? '')) {
    throw new Error(`the CLI report's "${title}:" block of examples/${example} has no table under its lines`);
  }
  const header = cells(lines[at + 1]);
  const rows: string[][] = [];
  for (at += 3; at < lines.length && lines[at].startsWith('| '); at++) rows.push(cells(lines[at]));
  return { ...section, table: { header, rows } };
}

/** Fixed decimals with the report's minus sign (U+2212), as src/core/report/formatNumber.ts prints them. */
export function fixed(value: number, decimals = 2): string {
  const text = Math.abs(value).toFixed(decimals);
  return value < 0 && Number(text) !== 0 ? `−${text}` : text;
}
