import { REPLICATES_PER_STREAM, createRandom, type Xoshiro128StarStar } from './random';
import type { MonteCarloBlockRange, MonteCarloCount } from './monteCarloOptions';
import { DEFAULT_BUDGET, type Budget, type Computed } from './types';

/** Replicates between clock readings: a few microseconds each, so polls stay far below 50 ms apart. */
const REPLICATES_PER_POLL = 64;
/** The contract's cadence for progress calls and cancellation checks (types.ts: "~50 ms"). */
const PROGRESS_INTERVAL_MS = 50;

/**
 * Counts the replicates of a block range that are at least as extreme as the observed data, drawing
 * block j from stream j of `seed` so the count of a range never depends on who computes it.
 *
 * Intuition: the work is split into fixed blocks of REPLICATES_PER_STREAM replicates, each with its
 * own generator, so a worker pool can take any partition of the blocks and the sum is the same.
 *
 * @param totalReplicates - R; the last block holds the remainder R − (blocks − 1)·REPLICATES_PER_STREAM
 * @param seed - the run's seed
 * @param range - the blocks to simulate; defaults to all of them
 * @param budget - time, cancellation and progress (memory is checked by the caller)
 * @param startedAt - performance.now() when the caller began, so its set-up counts against the time budget
 * @param isExtreme - simulates one replicate from `random` and says whether it is at least as extreme
 * @returns the count b and the number of replicates simulated, or why it stopped
 */
export function monteCarloCountBlocks(
  totalReplicates: number,
  seed: number,
  range: MonteCarloBlockRange | undefined,
  budget: Partial<Budget> | undefined,
  startedAt: number,
  isExtreme: (random: Xoshiro128StarStar) => boolean,
): Computed<MonteCarloCount> {
  const start = startedAt;
  const limits: Budget = { ...DEFAULT_BUDGET, ...budget };
  const blocks = Math.ceil(totalReplicates / REPLICATES_PER_STREAM);
  const firstBlock = range?.firstBlock ?? 0;
  const blockCount = range?.blockCount ?? blocks;
  if (!Number.isInteger(firstBlock) || !Number.isInteger(blockCount) || firstBlock < 0 || blockCount < 0 || firstBlock + blockCount > blocks) {
    throw new RangeError(`monteCarloCountBlocks: blocks ${firstBlock}..${firstBlock + blockCount - 1} are outside 0..${blocks - 1}`);
  }
  const firstReplicate = firstBlock * REPLICATES_PER_STREAM;
  const endReplicate = Math.min(totalReplicates, (firstBlock + blockCount) * REPLICATES_PER_STREAM);
  const planned = Math.max(0, endReplicate - firstReplicate);
  let extreme = 0;
  let done = 0;
  let lastReport = start;
  for (let block = firstBlock; block < firstBlock + blockCount; block++) {
    const random = createRandom(seed, block);
    const blockEnd = Math.min(totalReplicates, (block + 1) * REPLICATES_PER_STREAM);
    for (let replicate = block * REPLICATES_PER_STREAM; replicate < blockEnd; replicate++) {
      if (isExtreme(random)) extreme += 1;
      done += 1;
      if (done % REPLICATES_PER_POLL === 0) {
        const now = performance.now();
        if (now - start > limits.timeMs) return { ok: false, reason: 'time', elapsedMs: now - start };
        if (now - lastReport >= PROGRESS_INTERVAL_MS) {
          lastReport = now;
          if (limits.isCancelled?.()) return { ok: false, reason: 'cancelled', elapsedMs: now - start };
          limits.onProgress?.(done / planned);
        }
      }
    }
  }
  return { ok: true, value: { extreme, replicates: done, elapsedMs: performance.now() - start } };
}
