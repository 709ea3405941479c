import type { Budget, Stopped } from '../types';

/** Progress is reported at most this often (the Budget contract asks for ~50 ms). */
const PROGRESS_INTERVAL_MS = 50;

function now(): number {
  return globalThis.performance?.now() ?? Date.now();
}

/**
 * The budget of one exact search: wall clock, memory of its own tables, cancellation and progress.
 * Searches call `check` every few thousand steps, which keeps a stop within a few ms of the limit.
 */
export class SearchGuard {
  private readonly startedAt = now();
  private lastProgressAt = -Infinity;

  constructor(private readonly budget: Budget) {}

  elapsedMs(): number {
    return now() - this.startedAt;
  }

  /** A memory stop if `bytes` (what the search is about to hold) is over the cap; nothing else is polled. */
  memoryExceeded(bytes: number): Stopped | undefined {
    return bytes > this.budget.memoryBytes ? { ok: false, reason: 'memory', elapsedMs: this.elapsedMs() } : undefined;
  }

  /**
   * @param memoryBytes - Bytes the search's tables hold now.
   * @param fraction - Rough fraction of the work done, in [0, 1].
   * @returns Why the search must stop, or undefined to go on.
   */
  check(memoryBytes: number, fraction: number): Stopped | undefined {
    const elapsedMs = this.elapsedMs();
    if (this.budget.isCancelled?.()) return { ok: false, reason: 'cancelled', elapsedMs };
    if (memoryBytes > this.budget.memoryBytes) return { ok: false, reason: 'memory', elapsedMs };
    if (elapsedMs > this.budget.timeMs) return { ok: false, reason: 'time', elapsedMs };
    if (this.budget.onProgress && elapsedMs - this.lastProgressAt >= PROGRESS_INTERVAL_MS) {
      this.lastProgressAt = elapsedMs;
      this.budget.onProgress(Math.min(1, Math.max(0, fraction)));
    }
    return undefined;
  }
}
