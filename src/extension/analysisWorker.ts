// Worker-thread entry (dist/analysisWorker.js): keeps long exact searches off the extension host's
// main thread. A browser build would host the same job in a Web Worker.
import { parentPort } from 'node:worker_threads';
import type { AnalyzeOptions, TableOrigin } from '../core/analysis';
import { CANCEL_INDEX, runAnalysisJob, type JobToWorker, type WorkerToJob } from '../core/analysisJob';
import { analyzeCountTable } from '../core/analyze';
import type { CountTable } from '../core/types';

/** A table that is already read (a merged table), to analyse as it is. */
export interface TableJob {
  kind: 'table';
  table: CountTable;
  origin: TableOrigin;
  fit?: string;
  options: AnalyzeOptions;
}

export type WorkerJob = JobToWorker | { type: 'analyzeTable'; job: TableJob; cancelFlag: SharedArrayBuffer };

function runTableJob(job: TableJob, cancelFlag: SharedArrayBuffer, post: (reply: WorkerToJob) => void): void {
  const flag = new Int32Array(cancelFlag);
  const result = analyzeCountTable(job.table, job.origin, job.fit, job.options, {
    isCancelled: () => Atomics.load(flag, CANCEL_INDEX) === 1,
    onProgress: (fraction) => post({ type: 'progress', fraction }),
  });
  post({ type: 'done', result });
}

parentPort?.on('message', (message: WorkerJob) => {
  const post = (reply: WorkerToJob) => parentPort?.postMessage(reply);
  if (message.type === 'analyzeTable') runTableJob(message.job, message.cancelFlag, post);
  else runAnalysisJob(message, post);
});
