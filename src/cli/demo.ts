import * as fs from 'node:fs';
import * as path from 'node:path';
import { describeIssue, formatForFile, runAnalyze } from './runAnalyze';
import { resultsReport } from '../core/report/resultsReport';
import { toJson } from '../core/toJson';
import type { AnalyzeOptions } from '../core/analysis';

/** One demo step: a bundled example file and what to ask of it (examples/demo.json). */
interface DemoStep {
  file: string;
  title: string;
  table?: number;
  line?: number;
  fit?: string;
  columns?: [string, string];
  weight?: string;
  /** Raw data: the column naming each observation's stratum. */
  stratum?: string;
  /** Design options, e.g. { "design": "paired" } or { "ordered": "columns", "columnScores": [1, 2, 3] }. */
  options?: Partial<AnalyzeOptions>;
}

/** Analyses each bundled example as the manifest says and prints the reports. Returns the exit code. */
export async function runDemo(examplesDir: string, json: boolean): Promise<number> {
  const steps = JSON.parse(fs.readFileSync(path.join(examplesDir, 'demo.json'), 'utf8')) as DemoStep[];
  const out: unknown[] = [];
  let failures = 0;
  for (const step of steps) {
    const file = path.join(examplesDir, step.file);
    const result = await runAnalyze({
      kind: 'analyze',
      file,
      format: formatForFile(file),
      tableIndex: step.table,
      line: step.line,
      fit: step.fit,
      columns: step.columns,
      weight: step.weight,
      stratum: step.stratum,
      json,
      options: step.options ?? {},
    });
    const shown = path.join('examples', step.file);
    if (!result.ok) {
      failures += 1;
      process.stderr.write(describeIssue(shown, result.issue) + '\n');
      continue;
    }
    if (json) out.push({ file: shown, title: step.title, ...toJson(result.value) });
    else process.stdout.write(`${'='.repeat(78)}\n${step.title}\n${shown}: ${resultsReport(result.value)}\n\n`);
  }
  if (json) process.stdout.write(JSON.stringify(out, null, 2) + '\n');
  return failures === 0 ? 0 : 2;
}
