import type { Analysis } from './analysis';
import { analyze, type AnalyzeRequest } from './analyze';
import type { Result } from './types';

/**
 * Messages of a background analysis, the same whether a Node worker thread or a browser Web Worker
 * hosts it: the host adapts its own port (parentPort, self) and calls `runAnalysisJob`.
 */
export type JobToWorker = { type: 'analyze'; request: Omit<AnalyzeRequest, 'control'>; cancelFlag: SharedArrayBuffer };
export type WorkerToJob =
  | { type: 'progress'; fraction: number }
  | { type: 'done'; result: Result<Analysis> };

/** Index of the flag in the shared Int32Array; 1 means "stop". */
export const CANCEL_INDEX = 0;

/**
 * Runs one analysis for a worker. Cancellation is read from shared memory because the search is
 * synchronous: a "cancel" message could not be received until it had finished.
 */
export function runAnalysisJob(message: JobToWorker, post: (reply: WorkerToJob) => void): void {
  const flag = new Int32Array(message.cancelFlag);
  const result = analyze({
    ...message.request,
    control: {
      isCancelled: () => Atomics.load(flag, CANCEL_INDEX) === 1,
      onProgress: (fraction) => post({ type: 'progress', fraction }),
    },
  });
  post({ type: 'done', result });
}
