import type { MonteCarloJobSpec } from '../core/exact/monteCarloJobSpec';

/**
 * Below this many cell-replicates (replicates × cells) a simulation takes well under 0.1 s in one
 * thread, less than starting the pool's threads costs (30–150 ms measured), so the pool declines it
 * and the engine runs it in the calling thread.
 */
export const POOL_MIN_CELL_REPLICATES = 2_000_000;

/** Whether a job is big enough for the pool's threads to pay for their start. */
export function worthSpreading(spec: MonteCarloJobSpec): boolean {
  const cells = spec.kind === 'independence' ? spec.rowTotals.length * spec.columnTotals.length : spec.proportions.length;
  return spec.replicates * cells >= POOL_MIN_CELL_REPLICATES;
}
