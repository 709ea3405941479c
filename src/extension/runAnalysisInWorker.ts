import { Worker } from 'node:worker_threads';
import type { Analysis } from '../core/analysis';
// Type-only: a value import from core/analysisJob would pull the whole engine into dist/extension.js.
import type { WorkerToJob } from '../core/analysisJob';
import type { AnalyzeRequest } from '../core/analyze';
import type { Result } from '../core/types';
import type { TableJob, WorkerJob } from './analysisWorker';

/** How long a cancelled search may take to notice before the worker is stopped outright. */
const CANCEL_GRACE_MS = 2000;

export interface JobHooks {
  onProgress?: (fraction: number) => void;
  /** Aborting sets the shared cancel flag; the search stops at its next check (about every 50 ms). */
  signal?: AbortSignal;
  /** Monte Carlo threads (the setting tallywise.monteCarloThreads); 0 or absent: automatic. Any count gives the same p. */
  threads?: number;
}

/**
 * Runs `analyze` (or, for a table already read, `analyzeCountTable`) in a worker thread (the bundled
 * dist/analysisWorker.js) and resolves with its result; Monte Carlo blocks spread over `hooks.threads`
 * further threads (dist/monteCarloPoolWorker.js, beside the worker). Never rejects for user input: a crashed worker
 * becomes an Issue.
 */
export function runAnalysisInWorker(workerFile: string, request: Omit<AnalyzeRequest, 'control'> | TableJob, hooks: JobHooks = {}): Promise<Result<Analysis>> {
  return new Promise((resolve) => {
    const cancelFlag = new SharedArrayBuffer(Int32Array.BYTES_PER_ELEMENT);
    const flag = new Int32Array(cancelFlag);
    const worker = new Worker(workerFile);
    let settled = false;
    let graceTimer: NodeJS.Timeout | undefined;
    const finish = (result: Result<Analysis>) => {
      if (settled) return;
      settled = true;
      if (graceTimer) clearTimeout(graceTimer);
      hooks.signal?.removeEventListener('abort', onAbort);
      void worker.terminate();
      resolve(result);
    };
    const onAbort = () => {
      // The buffer holds the one flag (core's CANCEL_INDEX); setting every slot needs no engine import.
      for (let index = 0; index < flag.length; index++) Atomics.store(flag, index, 1);
      graceTimer = setTimeout(() => finish({ ok: false, issue: { code: 'cancelled', message: 'The analysis was cancelled; nothing was changed.' } }), CANCEL_GRACE_MS);
    };
    hooks.signal?.addEventListener('abort', onAbort);
    worker.on('message', (message: WorkerToJob) => {
      if (message.type === 'progress') hooks.onProgress?.(message.fraction);
      else finish(message.result);
    });
    worker.on('error', (error) => finish({ ok: false, issue: { code: 'unreadable', message: `The analysis stopped unexpectedly (${error.message}). Please report it with the table.` } }));
    worker.on('exit', () => finish({ ok: false, issue: { code: 'cancelled', message: 'The analysis stopped before it finished; nothing was changed.' } }));
    const job: WorkerJob = 'kind' in request
      ? { type: 'analyzeTable', job: request, cancelFlag, threads: hooks.threads }
      : { type: 'analyze', request, cancelFlag, threads: hooks.threads };
    worker.postMessage(job);
    if (hooks.signal?.aborted) onAbort();
  });
}
