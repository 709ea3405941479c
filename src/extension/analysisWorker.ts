// Worker-thread entry (dist/analysisWorker.js): keeps long exact searches off the extension host's
// main thread, and spreads Monte Carlo blocks over a pool of further threads (src/node/monteCarloPool.ts)
// while this thread sleeps on shared memory. A browser build would host the same job in a Web Worker.
import { parentPort } from 'node:worker_threads';
import type { AnalyzeOptions, TableOrigin } from '../core/analysis';
import { jobControl, runAnalysisJob, type JobToWorker, type WorkerToJob } from '../core/analysisJob';
import { analyzeCountTable } from '../core/analyze';
import type { CountTable } from '../core/types';
import { monteCarloThreadCount } from '../node/monteCarloThreadCount';
import { searchControlWithPool } from '../node/searchControlWithPool';

/** A table that is already read (a merged table), to analyse as it is. */
export interface TableJob {
  kind: 'table';
  table: CountTable;
  origin: TableOrigin;
  fit?: string;
  options: AnalyzeOptions;
}

export type WorkerJob = JobToWorker | { type: 'analyzeTable'; job: TableJob; cancelFlag: SharedArrayBuffer; threads?: number };

parentPort?.on('message', (message: WorkerJob) => {
  const post = (reply: WorkerToJob) => parentPort?.postMessage(reply);
  const pooled = searchControlWithPool({}, monteCarloThreadCount(message.threads));
  try {
    if (message.type === 'analyzeTable') {
      const { job } = message;
      const result = analyzeCountTable(job.table, job.origin, job.fit, job.options, jobControl(message.cancelFlag, post, pooled.control.runBlocks));
      post({ type: 'done', result });
    } else {
      runAnalysisJob(message, post, pooled.control.runBlocks);
    }
  } finally {
    void pooled.close();
  }
});
