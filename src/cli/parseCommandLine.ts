import { parseArgs } from 'node:util';
import type { AnalyzeOptions } from '../core/analysis';
import type { AnalyzeRequest, DocumentFormat } from '../core/analyze';
import { isOneOf, listChoices, ORDERED_DIMENSIONS, PAIRWISE_ADJUSTMENTS, STUDY_DESIGNS } from '../core/designs/designOptions';
import { DEFAULT_SEED, type PValueMethod } from '../core/exact/choosePValue';

/** What `tallywise analyze` asks of the engine: the file, how to print, and the request's own fields. */
export type AnalyzeCommand = Pick<AnalyzeRequest, 'line' | 'selection' | 'tableIndex' | 'fit' | 'columns' | 'weight' | 'stratum'> & {
  kind: 'analyze';
  file: string;
  format?: DocumentFormat;
  json: boolean;
  options: Partial<AnalyzeOptions>;
  /** Monte Carlo threads (--threads); undefined means automatic. */
  threads?: number;
};

/** `tallywise plan`: what to plan from; the core checks the values themselves. */
export type PlanSource =
  | { from: 'effect-size'; w: number; df: number }
  | { from: 'groups'; groups: string; allocation?: number[] }
  | { from: 'fit'; anticipated: string; nullProportions: string }
  | { from: 'two-proportions'; p1: number; p2?: number; difference?: number; ratio?: number; oddsRatio?: number; allocation?: number[] }
  | { from: 'table'; file: string; format?: DocumentFormat; line?: number; tableIndex?: number; nullProportions?: string; allocation?: number[] }
  | { from: 'sensitivity'; sizes: number[]; df?: number; p1?: number };

export interface PlanCommand {
  kind: 'plan';
  source: PlanSource;
  alpha?: number;
  power?: number;
  json: boolean;
}

export type Command =
  | AnalyzeCommand
  | PlanCommand
  | { kind: 'demo'; json: boolean }
  | { kind: 'help' }
  | { kind: 'version' };

export type Parsed = { ok: true; command: Command } | { ok: false; message: string };

export const USAGE = `Usage:
  tallywise analyze <file|-> [options]   test the count table in a Markdown, CSV/TSV or text file
  tallywise plan [<file>] [options]      sample size and power for the next study (see "Planning")
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

How the counts were collected (see README, "Designs"):
  --design D          independent (default) | paired (a 2×2 of the same units measured twice:
                      McNemar) | stratified (several 2×2 tables one after another, or raw data
                      with --stratum: Cochran–Mantel–Haenszel)
  --stratum COL       raw data: the column naming each observation's stratum (site, shift...)
  --ordered D         rows | columns | both | none (default: labels that read as numbers or
                      ranges count as ordered); ordered dimensions get a trend test
  --scores LIST       scores of the ordered dimension, e.g. 0,1,2,5 (default 0, 1, 2, ...);
                      --row-scores and --column-scores when both are ordered
  --pairwise M        holm (default) | bonferroni | off: which groups differ, two at a time

Numbers and wording:
  --alpha X           significance level (default 0.05)
  --confidence X      confidence level for intervals (default 0.95)
  --yates             apply Yates' continuity correction to 2×2 tables (default: off, reported beside)
  --p-value M         auto | exact | monte-carlo | asymptotic (default auto: exact when
                      Cochran's rule fails, Monte Carlo when the exact search is too big)
  --replicates R      Monte Carlo replicates (default 45,999: p near .05 to about ±.002)
  --seed S            Monte Carlo seed (default ${DEFAULT_SEED}; reported with the result)
  --exact-time MS     time limit for an exact search before Monte Carlo takes over (default 5000)
  --threads N         threads for Monte Carlo simulation (default: the cores, at most 4; any N gives the same p)
  --decimals N        decimals for statistics (default 2)
  --one-line          a one-line result instead of the paragraph
  --plain             plain text write-up (no Markdown emphasis)
  --json              one JSON object per analysis (see README, "JSON output")

Planning (tallywise plan):
  --w W --df K        from an effect size w (Cohen) and the test's degrees of freedom
  --groups P          anticipated outcome proportions per group: "0.04,0.96; 0.08,0.92"
  --allocation A      relative group sizes, e.g. 1,2 (default equal)
  --anticipated P --null Q
                      goodness of fit: anticipated proportions P against the null proportions Q
  --p1 X --p2 Y       two proportions (or --difference D, --ratio R, --odds-ratio OR instead of --p2)
  <file> [--table K | --line N] [--null Q]
                      the anticipated table of counts in a document (one row or column: with --null)
  --sensitivity --n N --df K      smallest detectable w for N observations
  --sensitivity --n N1,N2 --p1 X  smallest detectable second proportion for two groups
  --alpha X           significance level (default 0.05); --power X target power (default 0.8)
  --json              n, perGroup, power, targetPower, w, df, alpha, criticalValue, lambda, curve, writeUp

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
        design: { type: 'string' },
        stratum: { type: 'string' },
        ordered: { type: 'string' },
        scores: { type: 'string' },
        'row-scores': { type: 'string' },
        'column-scores': { type: 'string' },
        pairwise: { type: 'string' },
        alpha: { type: 'string' },
        confidence: { type: 'string' },
        yates: { type: 'boolean' },
        decimals: { type: 'string' },
        'p-value': { type: 'string' },
        replicates: { type: 'string' },
        seed: { type: 'string' },
        'exact-time': { type: 'string' },
        threads: { type: 'string' },
        'one-line': { type: 'boolean' },
        plain: { type: 'boolean' },
        json: { type: 'boolean' },
        w: { type: 'string' },
        df: { type: 'string' },
        power: { type: 'string' },
        groups: { type: 'string' },
        allocation: { type: 'string' },
        anticipated: { type: 'string' },
        null: { type: 'string' },
        p1: { type: 'string' },
        p2: { type: 'string' },
        difference: { type: 'string' },
        ratio: { type: 'string' },
        'odds-ratio': { type: 'string' },
        sensitivity: { type: 'boolean' },
        n: { type: 'string' },
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
  if (verb === 'plan') return parsePlan(values, rest);
  const planFlag = PLAN_ONLY_FLAGS.find((flag) => values[flag] !== undefined);
  if (planFlag) return { ok: false, message: `--${planFlag} belongs to "tallywise plan", not "${verb}".\n\n${USAGE}` };
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
    threads: parseWhole('threads', values.threads),
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
  const design = parseDesignFlags(values);
  if (typeof design === 'string') return { ok: false, message: design };
  Object.assign(options, design);
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
      stratum: values.stratum,
      json: values.json === true,
      options,
      threads: numbers.threads as number | undefined,
    },
  };
}

/** --design, --ordered, --scores, --pairwise → engine options; the engine checks what fits the table. */
function parseDesignFlags(values: Record<string, string | boolean | undefined>): Partial<AnalyzeOptions> | string {
  const text = (name: string) => values[name] as string | undefined;
  const out: Partial<AnalyzeOptions> = {};
  const choices = [['design', STUDY_DESIGNS], ['ordered', ORDERED_DIMENSIONS], ['pairwise', PAIRWISE_ADJUSTMENTS]] as const;
  for (const [name, allowed] of choices) {
    const value = text(name);
    if (value === undefined) continue;
    if (!isOneOf<string>(allowed, value)) return `--${name} must be ${listChoices(allowed)} (got "${value}").`;
    (out as Record<string, unknown>)[name] = value;
  }
  if (values.stratum !== undefined && out.design === undefined) out.design = 'stratified';
  const lists = { scores: parseNumberList('scores', text('scores')), row: parseNumberList('row-scores', text('row-scores')), column: parseNumberList('column-scores', text('column-scores')) };
  for (const list of Object.values(lists)) if (typeof list === 'string') return list;
  if (lists.scores !== undefined && (lists.row !== undefined || lists.column !== undefined)) {
    return '--scores is for a table with one ordered dimension; with --row-scores or --column-scores, give both of those instead.';
  }
  if (lists.row !== undefined) out.rowScores = lists.row as number[];
  if (lists.column !== undefined) out.columnScores = lists.column as number[];
  if (lists.scores !== undefined) {
    // One list of scores belongs to the one ordered dimension; rows only when the user says so.
    if (out.ordered === 'rows') out.rowScores = lists.scores as number[];
    else out.columnScores = lists.scores as number[];
    if (out.ordered === undefined) out.ordered = 'columns';
  }
  return out;
}

const PLAN_ONLY_FLAGS = ['w', 'df', 'power', 'groups', 'allocation', 'anticipated', 'null', 'p1', 'p2', 'difference', 'ratio', 'odds-ratio', 'sensitivity', 'n'] as const;

function parseNumberList(name: string, text: string | undefined): number[] | string | undefined {
  if (text === undefined) return undefined;
  const parts = text.split(/[,:\s]+/).filter((part) => part !== '');
  const values = parts.map(Number);
  if (parts.length === 0 || values.some((value) => !Number.isFinite(value))) return `--${name} needs numbers separated by commas, like 1,2 (got "${text}").`;
  return values;
}

/** `tallywise plan ...` → a plan command; exactly one source of anticipated values. */
function parsePlan(values: Record<string, string | boolean | undefined>, rest: string[]): Parsed {
  const text = (name: string) => values[name] as string | undefined;
  const numbers: Record<string, number | string | undefined> = {};
  for (const name of ['w', 'df', 'alpha', 'power', 'p1', 'p2', 'difference', 'ratio', 'odds-ratio']) numbers[name] = parseNumber(name, text(name));
  numbers.line = parseWhole('line', text('line'));
  numbers.table = parseWhole('table', text('table'));
  for (const value of Object.values(numbers)) if (typeof value === 'string') return { ok: false, message: value };
  const allocation = parseNumberList('allocation', text('allocation'));
  const sizes = parseNumberList('n', text('n'));
  for (const value of [allocation, sizes]) if (typeof value === 'string') return { ok: false, message: value };
  const num = (name: string) => numbers[name] as number | undefined;
  const weights = allocation as number[] | undefined;
  if (rest.length > 1) return { ok: false, message: `plan takes at most one file (got ${rest.length}).\n\n${USAGE}` };
  const sources = [
    rest.length === 1 && 'a file',
    values.sensitivity === true && '--sensitivity',
    values.w !== undefined && '--w',
    values.groups !== undefined && '--groups',
    values.anticipated !== undefined && '--anticipated',
    values.p1 !== undefined && values.sensitivity !== true && '--p1',
  ].filter((source): source is string => typeof source === 'string');
  if (sources.length !== 1) {
    const found = sources.length === 0 ? 'none was given' : `got ${sources.join(' and ')}`;
    return { ok: false, message: `plan needs exactly one starting point: --w with --df, --groups, --anticipated with --null, --p1 with --p2, a file, or --sensitivity (${found}).\n\n${USAGE}` };
  }
  const settings = { alpha: num('alpha'), power: num('power'), json: values.json === true };
  const done = (source: PlanSource): Parsed => ({ ok: true, command: { kind: 'plan', source, ...settings } });
  const format = text('format');
  if (format !== undefined && format !== 'markdown' && format !== 'delimited' && format !== 'text') {
    return { ok: false, message: `--format must be markdown, delimited or text (got "${format}").` };
  }
  switch (sources[0]) {
    case 'a file':
      return done({ from: 'table', file: rest[0], format, line: num('line'), tableIndex: num('table'), nullProportions: text('null'), allocation: weights });
    case '--sensitivity': {
      const n = sizes as number[] | undefined;
      if (n === undefined) return { ok: false, message: '--sensitivity needs --n: the total sample size (with --df), or two group sizes N1,N2 (with --p1).' };
      if (n.length === 2 && num('p1') === undefined) return { ok: false, message: 'Two group sizes in --n need the baseline proportion --p1 of group 1.' };
      if (n.length === 1 && num('df') === undefined) return { ok: false, message: '--sensitivity with one --n needs --df, the degrees of freedom of the planned test.' };
      if (n.length > 2) return { ok: false, message: `--n takes one total or two group sizes (got ${n.length} numbers).` };
      return done({ from: 'sensitivity', sizes: n, df: num('df'), p1: num('p1') });
    }
    case '--w':
      if (num('df') === undefined) return { ok: false, message: '--w needs --df, the degrees of freedom of the planned test: (rows − 1) × (columns − 1), or categories − 1 for goodness of fit.' };
      return done({ from: 'effect-size', w: num('w') as number, df: num('df') as number });
    case '--groups':
      return done({ from: 'groups', groups: text('groups') as string, allocation: weights });
    case '--anticipated':
      if (text('null') === undefined) return { ok: false, message: '--anticipated needs --null: the proportions the goodness-of-fit test checks against.' };
      return done({ from: 'fit', anticipated: text('anticipated') as string, nullProportions: text('null') as string });
    default: {
      if (weights !== undefined && weights.length !== 2) return { ok: false, message: `--allocation for two proportions takes two weights, like 1,2 (got ${weights.length}).` };
      return done({ from: 'two-proportions', p1: num('p1') as number, p2: num('p2'), difference: num('difference'), ratio: num('ratio'), oddsRatio: num('odds-ratio'), allocation: weights });
    }
  }
}
