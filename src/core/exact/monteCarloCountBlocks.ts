import type { MonteCarloBlockRunner } from './monteCarloBlockRunner';
import type { MonteCarloBlockHook, MonteCarloJobSpec } from './monteCarloJobSpec';
import type { MonteCarloBlockRange, MonteCarloComputed, MonteCarloCount } from './monteCarloOptions';
import { REPLICATES_PER_STREAM } from './random';
import { DEFAULT_BUDGET, type Budget } from './types';

/** The contract's cadence for progress calls and cancellation checks (types.ts: "~50 ms"). */
const PROGRESS_INTERVAL_MS = 50;

/**
 * Counts the replicates of a block range that are at least as extreme as the observed data, drawing
 * block j from stream j of the seed so the count of a range never depends on who computes it.
 *
 * Intuition: the work is split into fixed blocks of REPLICATES_PER_STREAM replicates, each with its
 * own generator, so a worker pool can take any partition of the blocks and the sum is the same.
 *
 * With `runBlocks` (a worker pool, see MonteCarloBlockHook) the blocks are handed to it; without it,
 * or when it declines them, they run here, in this thread, one after another.
 *
 * @param spec - the serialisable job
 * @param makeRunner - builds the in-thread runner (only called when there is no hook)
 * @param range - the blocks to simulate; defaults to all of them
 * @param budget - time, cancellation and progress (memory is checked by the caller)
 * @param runBlocks - optional hook that simulates the blocks elsewhere
 * @param startedAt - performance.now() when the caller began, so its set-up counts against the time budget
 * @returns the count b and the number of replicates simulated, or why it stopped
 */
export function monteCarloCountBlocks(
  spec: MonteCarloJobSpec,
  makeRunner: () => MonteCarloBlockRunner,
  range: MonteCarloBlockRange | undefined,
  budget: Partial<Budget> | undefined,
  runBlocks: MonteCarloBlockHook | undefined,
  startedAt: number,
): MonteCarloComputed<MonteCarloCount> {
  const start = startedAt;
  const limits: Budget = { ...DEFAULT_BUDGET, ...budget };
  const totalReplicates = spec.replicates;
  const blocks = Math.ceil(totalReplicates / REPLICATES_PER_STREAM);
  const firstBlock = range?.firstBlock ?? 0;
  const blockCount = range?.blockCount ?? blocks;
  if (!Number.isInteger(firstBlock) || !Number.isInteger(blockCount) || firstBlock < 0 || blockCount < 0 || firstBlock + blockCount > blocks) {
    throw new RangeError(`monteCarloCountBlocks: blocks ${firstBlock}..${firstBlock + blockCount - 1} are outside 0..${blocks - 1}`);
  }
  const endReplicate = Math.min(totalReplicates, (firstBlock + blockCount) * REPLICATES_PER_STREAM);
  const planned = Math.max(0, endReplicate - firstBlock * REPLICATES_PER_STREAM);
  const overTime = (now: number) => now - start > limits.timeMs;

  if (runBlocks) {
    const indices = Array.from({ length: blockCount }, (_, k) => firstBlock + k);
    let timedOut = false;
    const outcome = runBlocks(spec, indices, {
      isCancelled: () => {
        timedOut = overTime(performance.now());
        return timedOut || limits.isCancelled?.() === true;
      },
      onProgress: limits.onProgress,
    });
    const elapsedMs = performance.now() - start;
    if (outcome.ok) {
      if (outcome.extreme.length !== blockCount) throw new Error(`monteCarloCountBlocks: the block hook returned ${outcome.extreme.length} counts for ${blockCount} blocks`);
      const extreme = outcome.extreme.reduce((sum, count) => sum + count, 0);
      return { ok: true, value: { extreme, replicates: planned, elapsedMs } };
    }
    if (outcome.reason === 'failed') return { ok: false, reason: 'failed', message: outcome.message, elapsedMs };
    if (outcome.reason === 'cancelled') return { ok: false, reason: timedOut ? 'time' : 'cancelled', elapsedMs };
    // 'declined': the loop below runs the blocks here.
  }

  const runner = makeRunner();
  let extreme = 0;
  let done = 0;
  let lastReport = start;
  let stopped: 'time' | 'cancelled' | undefined;
  const poll = (doneInBlock: number): boolean => {
    const now = performance.now();
    if (overTime(now)) stopped = 'time';
    else if (now - lastReport >= PROGRESS_INTERVAL_MS) {
      lastReport = now;
      if (limits.isCancelled?.()) stopped = 'cancelled';
      else limits.onProgress?.((done + doneInBlock) / planned);
    }
    return stopped !== undefined;
  };
  for (let block = firstBlock; block < firstBlock + blockCount; block++) {
    const count = runner.countBlock(block, poll);
    if (count < 0 || (block < firstBlock + blockCount - 1 && poll(runner.blockReplicates(block)))) {
      return { ok: false, reason: stopped ?? 'cancelled', elapsedMs: performance.now() - start };
    }
    extreme += count;
    done += runner.blockReplicates(block);
  }
  return { ok: true, value: { extreme, replicates: done, elapsedMs: performance.now() - start } };
}
