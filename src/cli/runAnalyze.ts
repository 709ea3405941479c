import * as fs from 'node:fs';
import * as path from 'node:path';
import { analyze, analyzeCountTable, analyzeTabulatedStrata, splitCrossTabulation, type AnalyzeRequest, type DocumentFormat } from '../core/analyze';
import type { Analysis } from '../core/analysis';
import type { SearchControl } from '../core/exact/choosePValue';
import { resolveOptions } from '../core/options';
import { createCrossTabulator } from '../core/table/crossTabulate';
import type { Issue, Result } from '../core/types';
import { monteCarloThreadCount } from '../node/monteCarloThreadCount';
import { searchControlWithPool } from '../node/searchControlWithPool';
import type { AnalyzeCommand } from './parseCommandLine';

/** Delimited files larger than this are streamed through the cross-tabulator instead of read whole. */
export const STREAM_THRESHOLD_BYTES = 16 * 1024 * 1024;
const STREAM_CHUNK_BYTES = 64 * 1024;

/** File name → how to look for tables in it. */
export function formatForFile(file: string): DocumentFormat {
  const extension = path.extname(file).toLowerCase();
  if (extension === '.md' || extension === '.markdown' || extension === '.mdown') return 'markdown';
  if (['.csv', '.tsv', '.tab', '.psv', '.ssv'].includes(extension)) return 'delimited';
  return 'text';
}

/** "notes.md: line 6, column 12: ..." (messages with a place open with it in words). */
export function describeIssue(file: string, issue: Issue): string {
  return `${file}: ${issue.message}`;
}

function readInput(file: string): Result<string> {
  try {
    return { ok: true, value: file === '-' ? fs.readFileSync(0, 'utf8') : fs.readFileSync(file, 'utf8') };
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    const reason = code === 'ENOENT' ? 'no such file' : code === 'EISDIR' ? 'it is a folder' : String((error as Error).message);
    return { ok: false, issue: { code: 'unreadable', message: `Cannot read ${file}: ${reason}.` } };
  }
}

async function streamRawData(command: AnalyzeCommand): Promise<Result<Analysis>> {
  const options = resolveOptions(command.options);
  if (!options.ok) return options;
  const tabulator = createCrossTabulator({ columns: command.columns, weight: command.weight, stratum: command.stratum });
  const stream = fs.createReadStream(command.file, { encoding: 'utf8', highWaterMark: STREAM_CHUNK_BYTES });
  for await (const chunk of stream) tabulator.push(chunk as string);
  const tabulated = tabulator.finish();
  if (!tabulated.ok) return tabulated;
  if (command.stratum !== undefined) return analyzeTabulatedStrata(tabulated.value, { ...options.value, design: 'stratified' });
  const { table, origin } = splitCrossTabulation(tabulated.value);
  return withPool(command, (control) => analyzeCountTable(table, origin, command.fit, options.value, control));
}

/** Runs the engine with Monte Carlo blocks spread over --threads worker threads (one: in this thread). */
async function withPool(command: AnalyzeCommand, run: (control: SearchControl) => Result<Analysis>): Promise<Result<Analysis>> {
  const pooled = searchControlWithPool(terminalProgress(), monteCarloThreadCount(command.threads));
  try {
    return run(pooled.control);
  } finally {
    await pooled.close();
  }
}

function shouldStream(command: AnalyzeCommand, format: DocumentFormat): boolean {
  if (command.file === '-' || format !== 'delimited') return false;
  try {
    return fs.statSync(command.file).size > STREAM_THRESHOLD_BYTES;
  } catch {
    return false;
  }
}

/** Progress of long exact or Monte Carlo searches on stderr, only when a person is watching a terminal. */
function terminalProgress(): SearchControl {
  if (!process.stderr.isTTY) return {};
  let shown = false;
  return {
    onProgress: (fraction: number) => {
      shown = true;
      process.stderr.write(`\r  computing the exact or simulated p-value: ${Math.round(fraction * 100)}%   `);
      if (fraction >= 1 && shown) process.stderr.write('\r' + ' '.repeat(60) + '\r');
    },
  };
}

export async function runAnalyze(command: AnalyzeCommand): Promise<Result<Analysis>> {
  const format = command.format ?? (command.file === '-' ? 'text' : formatForFile(command.file));
  if (shouldStream(command, format)) return streamRawData(command);
  const text = readInput(command.file);
  if (!text.ok) return text;
  const request: AnalyzeRequest = {
    text: text.value,
    format,
    line: command.line,
    selection: command.selection,
    tableIndex: command.tableIndex,
    fit: command.fit,
    columns: command.columns,
    weight: command.weight,
    stratum: command.stratum,
    options: command.options,
  };
  return withPool(command, (control) => analyze({ ...request, control }));
}

