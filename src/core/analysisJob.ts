import type { Analysis } from './analysis';
import { analyze, type AnalyzeRequest } from './analyze';
import type { SearchControl } from './exact/choosePValue';
import type { MonteCarloBlockHook } from './exact/monteCarloJobSpec';
import type { Result } from './types';

/**
 * Messages of a background analysis, the same whether a Node worker thread or a browser Web Worker
 * hosts it: the host adapts its own port (parentPort, self) and calls `runAnalysisJob`.
 * `threads` is the host's Monte Carlo thread setting (0 or absent: automatic); the core never reads it,
 * the host turns it into a block hook (src/node/monteCarloPool.ts in Node).
 */
export type JobToWorker = { type: 'analyze'; request: Omit<AnalyzeRequest, 'control'>; cancelFlag: SharedArrayBuffer; threads?: number };
export type WorkerToJob =
  | { type: 'progress'; fraction: number }
  | { type: 'done'; result: Result<Analysis> };

/** Index of the flag in the shared Int32Array; 1 means "stop". */
export const CANCEL_INDEX = 0;

/**
 * The search control of a background job. Cancellation is read from shared memory because the
 * search is synchronous: a "cancel" message could not be received until it had finished.
 *
 * @param cancelFlag - the job's shared flag (CANCEL_INDEX)
 * @param post - sends progress to the host
 * @param runBlocks - optional Monte Carlo block hook (a worker pool); absent, blocks run in this thread
 * @returns the control to pass to the engine
 */
export function jobControl(cancelFlag: SharedArrayBuffer, post: (reply: WorkerToJob) => void, runBlocks?: MonteCarloBlockHook): SearchControl {
  const flag = new Int32Array(cancelFlag);
  return {
    isCancelled: () => Atomics.load(flag, CANCEL_INDEX) === 1,
    onProgress: (fraction) => post({ type: 'progress', fraction }),
    ...(runBlocks ? { runBlocks } : {}),
  };
}

/** Runs one analysis for a worker and posts its progress and result. */
export function runAnalysisJob(message: JobToWorker, post: (reply: WorkerToJob) => void, runBlocks?: MonteCarloBlockHook): void {
  const result = analyze({ ...message.request, control: jobControl(message.cancelFlag, post, runBlocks) });
  post({ type: 'done', result });
}
