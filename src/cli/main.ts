import * as path from 'node:path';
import type { Analysis } from '../core/analysis';
import { resultsReport } from '../core/report/resultsReport';
import { toJson } from '../core/toJson';
import { runDemo } from './demo';
import { parseCommandLine, USAGE } from './parseCommandLine';
import { describeIssue, runAnalyze } from './runAnalyze';
import { runPlan } from './runPlan';

const EXIT_OK = 0;
const EXIT_BAD_INPUT = 2;

function printAnalysis(file: string, analysis: Analysis, json: boolean): void {
  if (json) {
    process.stdout.write(JSON.stringify({ file, ...toJson(analysis) }, null, 2) + '\n');
    return;
  }
  process.stdout.write(`${file}: ${resultsReport(analysis)}\n`);
  if (analysis.origin.count > 1 && analysis.table.format !== 'crosstab' && analysis.kind !== 'stratified') {
    process.stdout.write(`\n(${analysis.origin.count} tables in this file; choose another with --table K or --line N.)\n`);
  }
}

export async function main(argv: string[]): Promise<number> {
  const parsed = parseCommandLine(argv);
  if (!parsed.ok) {
    process.stderr.write(parsed.message + '\n');
    return EXIT_BAD_INPUT;
  }
  const command = parsed.command;
  switch (command.kind) {
    case 'help':
      process.stdout.write(USAGE + '\n');
      return EXIT_OK;
    case 'version':
      process.stdout.write('tallywise 0.1.0\n');
      return EXIT_OK;
    case 'demo':
      return runDemo(path.join(__dirname, '..', 'examples'), command.json);
    case 'plan': {
      const planned = runPlan(command);
      if (!planned.ok) {
        const file = command.source.from === 'table' ? `${command.source.file}: ` : '';
        process.stderr.write(`tallywise plan: ${file}${planned.issue.message}\n`);
        return EXIT_BAD_INPUT;
      }
      process.stdout.write((command.json ? JSON.stringify(planned.value.json, null, 2) : planned.value.text) + '\n');
      return EXIT_OK;
    }
    case 'analyze': {
      const result = await runAnalyze(command);
      if (!result.ok) {
        process.stderr.write(describeIssue(command.file, result.issue) + '\n');
        return EXIT_BAD_INPUT;
      }
      printAnalysis(command.file, result.value, command.json);
      return EXIT_OK;
    }
  }
}

if (require.main === module) {
  // A reader that stops early (`tallywise analyze ... | head`) is not an error.
  process.stdout.on('error', (error: NodeJS.ErrnoException) => {
    if (error.code === 'EPIPE') process.exit(0);
    throw error;
  });
  main(process.argv.slice(2)).then(
    (code) => { process.exitCode = code; },
    (error: unknown) => {
      // A programmer error: say so plainly, without a stack trace for the user.
      process.stderr.write(`tallywise: internal error: ${(error as Error).message}. Please report it with the input file.\n`);
      process.exitCode = 1;
    },
  );
}
