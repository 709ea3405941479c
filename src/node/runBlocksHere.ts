import { monteCarloBlockRunner } from '../core/exact/monteCarloBlockRunner';
import type { MonteCarloBlockControl, MonteCarloBlockOutcome, MonteCarloJobSpec } from '../core/exact/monteCarloJobSpec';

/** How often (ms) a run in this thread checks cancellation and reports progress, as the pool does. */
const POLL_INTERVAL_MS = 50;

/**
 * Below this many cell-replicates (replicates × cells) a simulation takes well under 0.1 s in one
 * thread, less than starting the pool's threads costs (30–150 ms measured), so it runs here.
 */
export const POOL_MIN_CELL_REPLICATES = 2_000_000;

/** Whether a job is big enough for the pool's threads to pay for their start. */
export function worthSpreading(spec: MonteCarloJobSpec): boolean {
  const cells = spec.kind === 'independence' ? spec.rowTotals.length * spec.columnTotals.length : spec.proportions.length;
  return spec.replicates * cells >= POOL_MIN_CELL_REPLICATES;
}

/**
 * The block hook's work done in the calling thread with the core's block runner: the same counts
 * the pool's workers would return, since block j only ever uses stream j of the seed.
 */
export function runBlocksHere(spec: MonteCarloJobSpec, blocks: readonly number[], control: MonteCarloBlockControl): MonteCarloBlockOutcome {
  const runner = monteCarloBlockRunner(spec);
  const total = blocks.reduce((sum, block) => sum + runner.blockReplicates(block), 0);
  const extreme: number[] = [];
  let done = 0;
  let lastPoll = performance.now();
  for (const block of blocks) {
    const count = runner.countBlock(block, (doneInBlock) => {
      const now = performance.now();
      if (now - lastPoll < POLL_INTERVAL_MS) return false;
      lastPoll = now;
      if (control.isCancelled?.()) return true;
      control.onProgress?.((done + doneInBlock) / total);
      return false;
    });
    if (count < 0) return { ok: false, reason: 'cancelled' };
    extreme.push(count);
    done += runner.blockReplicates(block);
  }
  return { ok: true, extreme };
}
