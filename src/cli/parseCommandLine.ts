import { parseArgs } from 'node:util';
import type { AnalyzeOptions } from '../core/analysis';
import type { DocumentFormat } from '../core/analyze';
import { DEFAULT_SEED, type PValueMethod } from '../core/exact/choosePValue';

export interface AnalyzeCommand {
  kind: 'analyze';
  file: string;
  format?: DocumentFormat;
  line?: number;
  selection?: { startLine: number; endLine: number };
  tableIndex?: number;
  fit?: string;
  columns?: [string, string];
  weight?: string;
  json: boolean;
  options: Partial<AnalyzeOptions>;
}

export type Command =
  | AnalyzeCommand
  | { kind: 'demo'; json: boolean }
  | { kind: 'help' }
  | { kind: 'version' };

export type Parsed = { ok: true; command: Command } | { ok: false; message: string };

export const USAGE = `Usage:
  tallywise analyze <file|-> [options]   test the count table in a Markdown, CSV/TSV or text file
  tallywise demo [--json]                analyse the bundled example notes
  tallywise help | --version

Choosing the table:
  --line N            the table that contains line N (1-based)
  --lines A-B         the table inside lines A to B (a selection)
  --table K           the K-th table in the file (1-based; default: the first)
  --format F          markdown | delimited | text (default: from the file name; needed for "-")

What to test:
  --fit SPEC          goodness of fit of one row or column: 9:3:3:1 | 0.5,0.3,0.2 | 50%,30%,20%
                      | equal | poisson | binomial | binomial:N
  --columns A,B       raw data (one row per observation): cross-tabulate columns A and B
  --weight COL        raw data: a column holding how many observations each row stands for

Numbers and wording:
  --alpha X           significance level (default 0.05)
  --confidence X      confidence level for intervals (default 0.95)
  --yates             apply Yates' continuity correction to 2×2 tables (default: off, reported beside)
  --p-value M         auto | exact | monte-carlo | asymptotic (default auto: exact when
                      Cochran's rule fails, Monte Carlo when the exact search is too big)
  --replicates R      Monte Carlo replicates (default 45,999: p near .05 to about ±.002)
  --seed S            Monte Carlo seed (default ${DEFAULT_SEED}; reported with the result)
  --exact-time MS     time limit for an exact search before Monte Carlo takes over (default 5000)
  --decimals N        decimals for statistics (default 2)
  --one-line          a one-line result instead of the paragraph
  --plain             plain text write-up (no Markdown emphasis)
  --json              one JSON object per analysis (see README, "JSON output")

Exit status: 0 on success, 2 on bad input (the message goes to stderr).`;

function parseNumber(name: string, text: string | undefined): number | string | undefined {
  if (text === undefined) return undefined;
  const value = Number(text);
  return Number.isFinite(value) && text.trim() !== '' ? value : `--${name} needs a number (got "${text}").`;
}

function parseWhole(name: string, text: string | undefined): number | string | undefined {
  const value = parseNumber(name, text);
  if (typeof value === 'number' && (!Number.isInteger(value) || value < 1)) return `--${name} needs a whole number of at least 1 (got "${text}").`;
  return value;
}

/** argv (without node and script) → a command, or a message saying what is wrong. */
export function parseCommandLine(argv: string[]): Parsed {
  let parsed;
  try {
    parsed = parseArgs({
      args: argv,
      allowPositionals: true,
      strict: true,
      options: {
        line: { type: 'string' },
        lines: { type: 'string' },
        table: { type: 'string' },
        format: { type: 'string' },
        fit: { type: 'string' },
        columns: { type: 'string' },
        weight: { type: 'string' },
        alpha: { type: 'string' },
        confidence: { type: 'string' },
        yates: { type: 'boolean' },
        decimals: { type: 'string' },
        'p-value': { type: 'string' },
        replicates: { type: 'string' },
        seed: { type: 'string' },
        'exact-time': { type: 'string' },
        'one-line': { type: 'boolean' },
        plain: { type: 'boolean' },
        json: { type: 'boolean' },
        help: { type: 'boolean', short: 'h' },
        version: { type: 'boolean' },
      },
    });
  } catch (error) {
    return { ok: false, message: `${(error as Error).message}\n\n${USAGE}` };
  }
  const { values, positionals } = parsed;
  if (values.version) return { ok: true, command: { kind: 'version' } };
  const [verb, ...rest] = positionals;
  if (values.help || verb === undefined || verb === 'help') return { ok: true, command: { kind: 'help' } };
  if (verb === 'demo') return { ok: true, command: { kind: 'demo', json: values.json === true } };
  if (verb !== 'analyze') return { ok: false, message: `Unknown command "${verb}".\n\n${USAGE}` };
  if (rest.length !== 1) return { ok: false, message: `analyze takes one file (or "-" for standard input).\n\n${USAGE}` };

  const numbers = {
    line: parseWhole('line', values.line),
    table: parseWhole('table', values.table),
    alpha: parseNumber('alpha', values.alpha),
    confidence: parseNumber('confidence', values.confidence),
    decimals: parseNumber('decimals', values.decimals),
    replicates: parseWhole('replicates', values.replicates),
    seed: parseNumber('seed', values.seed),
    exactTime: parseNumber('exact-time', values['exact-time']),
  };
  for (const value of Object.values(numbers)) if (typeof value === 'string') return { ok: false, message: value };

  let selection: AnalyzeCommand['selection'];
  if (values.lines !== undefined) {
    const match = /^\s*(\d+)\s*[-–:]\s*(\d+)\s*$/.exec(values.lines);
    if (!match || Number(match[1]) < 1 || Number(match[2]) < Number(match[1])) {
      return { ok: false, message: `--lines needs a range like 12-18 (got "${values.lines}").` };
    }
    selection = { startLine: Number(match[1]), endLine: Number(match[2]) };
  }
  let columns: [string, string] | undefined;
  if (values.columns !== undefined) {
    const names = values.columns.split(',').map((s) => s.trim());
    if (names.length !== 2 || names.some((s) => s === '')) {
      return { ok: false, message: `--columns needs two column names separated by a comma, like instructor,outcome (got "${values.columns}").` };
    }
    columns = [names[0], names[1]];
  }
  const format = values.format;
  if (format !== undefined && format !== 'markdown' && format !== 'delimited' && format !== 'text') {
    return { ok: false, message: `--format must be markdown, delimited or text (got "${format}").` };
  }
  const options: Partial<AnalyzeOptions> = {};
  if (typeof numbers.alpha === 'number') options.alpha = numbers.alpha;
  if (typeof numbers.confidence === 'number') options.confidenceLevel = numbers.confidence;
  if (typeof numbers.decimals === 'number') options.decimals = numbers.decimals;
  if (typeof numbers.replicates === 'number') options.replicates = numbers.replicates;
  if (typeof numbers.seed === 'number') options.seed = numbers.seed;
  if (typeof numbers.exactTime === 'number') options.exactTimeMs = numbers.exactTime;
  const method = values['p-value'];
  if (method !== undefined) {
    if (!['auto', 'exact', 'monte-carlo', 'asymptotic'].includes(method)) {
      return { ok: false, message: `--p-value must be auto, exact, monte-carlo or asymptotic (got "${method}").` };
    }
    options.pValueMethod = method as PValueMethod;
  }
  if (values.yates) options.continuity = 'yates';
  if (values['one-line']) options.style = 'line';
  if (values.plain) options.markup = 'plain';
  return {
    ok: true,
    command: {
      kind: 'analyze',
      file: rest[0],
      format,
      line: numbers.line as number | undefined,
      selection,
      tableIndex: numbers.table as number | undefined,
      fit: values.fit,
      columns,
      weight: values.weight,
      json: values.json === true,
      options,
    },
  };
}
