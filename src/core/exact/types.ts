/**
 * Contract for exact and simulated p-values. Every search runs under a budget and reports why it
 * stopped, so the engine can fall back (exact → Monte Carlo) and say so; nothing here hangs.
 */

export type ExactMethod =
  | 'fisher-2x2'
  | 'freeman-halton-network'
  | 'exact-multinomial'
  | 'monte-carlo-patefield'
  | 'monte-carlo-multinomial';

/** Limits for one computation. Checked often enough that a stop comes within ~50 ms of the limit. */
export interface Budget {
  /** Wall-clock limit in milliseconds. */
  timeMs: number;
  /** Memory cap for the search's own tables (hash maps, node lists), in bytes (default 256 MB). */
  memoryBytes: number;
  /** Polled during the search; true stops it with reason 'cancelled'. */
  isCancelled?: () => boolean;
  /** Fraction done in [0, 1], called at most every ~50 ms. */
  onProgress?: (fraction: number) => void;
}

export const DEFAULT_BUDGET: Budget = { timeMs: 5000, memoryBytes: 256 * 1024 * 1024 };

export type Stopped = { ok: false; reason: 'time' | 'memory' | 'cancelled'; elapsedMs: number };
export type Computed<T> = { ok: true; value: T } | Stopped;

export interface ExactPValue {
  method: ExactMethod;
  /** Two-sided p (tables no more probable than the observed one, within RELATIVE_TIE_TOLERANCE). */
  p: number;
  /** log10 of p where it is meaningful (exact methods); for Monte Carlo, log10 of the estimate. */
  log10p: number;
  elapsedMs: number;
  /** Monte Carlo only. */
  replicates?: number;
  seed?: number;
  /** Monte Carlo only: the uncertainty of p from simulation, e.g. a 99% Clopper–Pearson or Wilson interval on b/R. */
  interval?: { lower: number; upper: number; level: number };
}

/**
 * Tables whose probability is within this relative factor of the observed one count as "no more
 * probable", so tables tied with the observed one are not lost to floating-point noise (common
 * practice). 1e-7 is far above the summation error (~1e-13) and far below any real difference in
 * probability between two distinct tables of practical size. scipy 1.17.1's fisher_exact uses
 * 1 + 1e-14 (read in its installed source); no fixture table falls between the two rules.
 */
export const RELATIVE_TIE_TOLERANCE = 1e-7;
