import assert from 'node:assert/strict';
import * as path from 'node:path';
import { analyze, type AnalyzeRequest } from '../../src/core/analyze';
import { runAnalysisInWorker } from '../../src/extension/runAnalysisInWorker';

// Runs the bundled worker (dist/analysisWorker.js, built by `npm test` before mocha) in a real thread.
const workerFile = path.resolve(__dirname, '..', '..', '..', 'dist', 'analysisWorker.js');

function sparseTable(rows: number, columns: number): string {
  const header = `| Site | ${Array.from({ length: columns }, (_, c) => `K${c + 1}`).join(' | ')} |`;
  const rule = `|---|${Array.from({ length: columns }, () => '---').join('|')}|`;
  const body = Array.from({ length: rows }, (_, r) => `| S${r + 1} | ${Array.from({ length: columns }, (_, c) => ((r * 7 + c * 3) % 5) + 1).join(' | ')} |`);
  return [header, rule, ...body].join('\n');
}

describe('runAnalysisInWorker', () => {
  it('returns the same analysis as the engine run in this thread', async () => {
    const request: AnalyzeRequest = { text: sparseTable(3, 4), format: 'markdown' };
    const inWorker = await runAnalysisInWorker(workerFile, request);
    const here = analyze(request);
    assert.ok(inWorker.ok && here.ok);
    if (!inWorker.ok || !here.ok) return;
    assert.equal(inWorker.value.result.statistic, here.value.result.statistic);
    assert.equal(inWorker.value.exact?.p, here.value.exact?.p);
    assert.equal(inWorker.value.writeUp, here.value.writeUp);
  });

  it('gives the engine\'s own Monte Carlo p with 1, 2 and 3 pool threads (dist/monteCarloPoolWorker.js)', async () => {
    const request: AnalyzeRequest = { text: sparseTable(6, 7), format: 'markdown', options: { pValueMethod: 'monte-carlo', replicates: 20_999 } };
    const here = analyze(request);
    assert.ok(here.ok);
    if (!here.ok) return;
    assert.equal(here.value.exact?.method, 'monte-carlo-patefield');
    for (const threads of [1, 2, 3]) {
      const inWorker = await runAnalysisInWorker(workerFile, request, { threads });
      assert.ok(inWorker.ok, `${threads} threads`);
      if (!inWorker.ok) return;
      assert.equal(inWorker.value.exact?.p, here.value.exact?.p, `${threads} threads`);
      assert.equal(inWorker.value.writeUp, here.value.writeUp, `${threads} threads`);
    }
  });

  it('reports progress and stops promptly when cancelled', async () => {
    const controller = new AbortController();
    const fractions: number[] = [];
    const started = Date.now();
    const request: AnalyzeRequest = {
      text: sparseTable(10, 10),
      format: 'markdown',
      options: { pValueMethod: 'monte-carlo', replicates: 10_000_000 },
    };
    const result = await runAnalysisInWorker(workerFile, request, {
      signal: controller.signal,
      onProgress: (fraction) => {
        fractions.push(fraction);
        if (fractions.length === 2) controller.abort();
      },
    });
    assert.equal(result.ok, false);
    if (!result.ok) assert.equal(result.issue.code, 'cancelled');
    assert.ok(fractions.length >= 2, 'progress was reported');
    assert.ok(fractions.every((f) => f >= 0 && f <= 1));
    assert.ok(Date.now() - started < 15_000, 'stopped long before 10 million replicates would finish');
  });
});

describe('runAnalysisInWorker with a table already read', () => {
  it('runs analyzeCountTable in the worker and matches the same call in this thread', async () => {
    const { analyzeCountTable } = await import('../../src/core/analyze');
    const first = analyze({ text: sparseTable(3, 3), format: 'markdown' });
    assert.ok(first.ok);
    if (!first.ok) return;
    const job = { kind: 'table' as const, table: first.value.table, origin: first.value.origin, options: { ...first.value.options, pValueMethod: 'monte-carlo' as const, replicates: 2000 } };
    const inWorker = await runAnalysisInWorker(workerFile, job);
    const here = analyzeCountTable(job.table, job.origin, undefined, job.options);
    assert.ok(inWorker.ok && here.ok);
    if (!inWorker.ok || !here.ok) return;
    assert.equal(inWorker.value.exact?.method, 'monte-carlo-patefield');
    assert.equal(inWorker.value.exact?.p, here.value.exact?.p);
    assert.equal(inWorker.value.writeUp, here.value.writeUp);
  });
});
