import { monteCarloLogFactorials } from './monteCarloLogFactorials';
import { DEFAULT_BUDGET, RELATIVE_TIE_TOLERANCE, type Budget, type Computed, type ExactPValue, type Stopped } from './types';

/** Children visited between clock readings (each costs well under a microsecond). */
const STEPS_PER_POLL = 4096;
/** The contract's cadence for progress calls and cancellation checks (types.ts: "~50 ms"). */
const PROGRESS_INTERVAL_MS = 50;
/** Subtrees this deep or shallower report their probability mass as progress when finished. */
const PROGRESS_DEPTH = 2;
/** A tail sum stops when the bound on what is left falls below this share of it: one rounding unit. */
const NEGLIGIBLE_SHARE = 2 ** -53;
/** Bytes per entry of the log-factorial table and of the per-category bound tables (Float64Array). */
const BYTES_PER_ENTRY = 8;
/** Weights closer than 2⁻³⁰ share a memo entry: far below the tie tolerance, far above rounding noise. */
const MEMO_KEY_SCALE = 2 ** 30;
/** Rough cost of one memo entry (Map slot plus two array elements), for the memory budget. */
const MEMO_ENTRY_BYTES = 80;

/**
 * The exact multinomial goodness-of-fit test: the probability, under the hypothesised proportions,
 * of all outcomes (k counts summing to N) no more probable than the observed one, within
 * RELATIVE_TIE_TOLERANCE (the criterion of Fisher's and the Freeman–Halton test, applied to one
 * multinomial; common practice). The search borrows the bounds of Mehta & Patel's network algorithm
 * ("A network algorithm for performing Fisher's exact test in r×c contingency tables", JASA 78,
 * 427–434, 1983).
 *
 * Intuition: instead of trusting the chi-square approximation, add up exactly the chance of every
 * outcome at least as surprising as the one seen; whole families of outcomes are added or skipped
 * at once when a bound shows they are all in or all out.
 *
 * ## Method
 * Outcomes are enumerated category by category, depth first; a node is (categories fixed so far,
 * count n left, its log weight v = Σ (x_i log π_i − log x_i!)). An outcome counts when its total
 * weight is at most the observed one's plus log(1 + tol). For the categories still open:
 * - the heaviest completion of n (the multinomial mode) comes from a greedy table: x log π − log x!
 *   is concave in x, so adding one observation at a time where it gains most is optimal;
 * - the lightest completion puts all n in the least probable category (a concave function on the
 *   simplex is smallest at a vertex);
 * - all completions together weigh (Σ π_i)ⁿ/n! (multinomial theorem).
 * If even the heaviest completion counts, the subtree is added in closed form; if even the lightest
 * does not, it is dropped; else it is expanded. With two categories left the weight of x is
 * unimodal in x, so the counted outcomes form two tails; their ends are found by galloping from
 * the previous pair's ends and bisecting, and their sums read from per-n tables of tail-to-term
 * ratios (or, when those tables would not fit in the memory budget, summed outward until what is
 * left is below a rounding unit). Subtree sums are memoised by (category, n, weight), so outcomes
 * that permute counts among equal proportions (the common "all equally likely" hypothesis) are
 * summed once. Terms are scaled by P(observed), so nothing that matters underflows, and
 * log p = log(sum) + log P(observed); sums are compensated (Neumaier). Proportions are normalised;
 * a category of proportion zero must be empty (else p = 0: the observed outcome is impossible)
 * and is then left out.
 *
 * @param observed - counts per category (nonnegative integers)
 * @param expectedProportions - hypothesised proportions, same length, nonnegative, positive sum (any scale)
 * @param budget - time, memory, cancellation and progress limits (defaults DEFAULT_BUDGET)
 * @returns method 'exact-multinomial' with p and log10 p, or why the budget stopped it
 * @example exactMultinomial([3, 0, 0], [1, 1, 1]) // p = 3/27 = 0.111…
 */
export function exactMultinomial(observed: readonly number[], expectedProportions: readonly number[], budget?: Partial<Budget>): Computed<ExactPValue> {
  const start = performance.now();
  const limits: Budget = { ...DEFAULT_BUDGET, ...budget };
  const weightSum = expectedProportions.reduce((sum, value) => sum + value, 0);
  if (
    observed.length === 0 ||
    expectedProportions.length !== observed.length ||
    observed.some((count) => !Number.isSafeInteger(count) || count < 0) ||
    expectedProportions.some((value) => !(value >= 0) || !Number.isFinite(value)) ||
    !(weightSum > 0 && Number.isFinite(weightSum))
  ) {
    throw new RangeError('exactMultinomial: needs nonnegative integer counts and as many nonnegative proportions with a positive sum');
  }
  const result = (logP: number): Computed<ExactPValue> => {
    const clamped = Math.min(0, logP);
    return { ok: true, value: { method: 'exact-multinomial', p: Math.exp(clamped), log10p: clamped / Math.LN10, elapsedMs: performance.now() - start } };
  };
  if (observed.some((count, j) => count > 0 && expectedProportions[j] === 0)) return result(-Infinity);

  const kept = observed.map((_, j) => j).filter((j) => expectedProportions[j] > 0);
  const k = kept.length;
  const counts = kept.map((j) => observed[j]);
  const logPi = Float64Array.from(kept, (j) => Math.log(expectedProportions[j] / weightSum));
  const total = counts.reduce((sum, count) => sum + count, 0);
  if (k === 1 || total === 0) return result(0);
  if ((total + 1) * (k + 1) * BYTES_PER_ENTRY > limits.memoryBytes) return { ok: false, reason: 'memory', elapsedMs: performance.now() - start };

  const lf = monteCarloLogFactorials(total);
  // Tail quantities for the open categories j..k−1: log Σ π_i, min log π_i, and the heaviest completion per n.
  const logTailSum = new Float64Array(k);
  const minLogPi = new Float64Array(k);
  const heaviest: Float64Array[] = new Array(k);
  for (let j = k - 1; j >= 0; j--) {
    logTailSum[j] = j === k - 1 ? logPi[j] : logAddExp(logPi[j], logTailSum[j + 1]);
    minLogPi[j] = j === k - 1 ? logPi[j] : Math.min(logPi[j], minLogPi[j + 1]);
  }
  // Only categories 1..k−2 open a child node that needs the bound; each table costs O(k·N), so the clock is read between them.
  for (let j = 1; j <= k - 2; j++) {
    heaviest[j] = greedyHeaviest(j);
    if (performance.now() - start > limits.timeMs) return { ok: false, reason: 'time', elapsedMs: performance.now() - start };
  }

  const a = k - 2;
  const b = k - 1;
  const pairValue = (x: number, n: number): number => x * logPi[a] - lf[x] + ((n - x) * logPi[b] - lf[n - x]);
  let observedPath = 0;
  for (let j = 0; j < a; j++) observedPath += counts[j] * logPi[j] - lf[counts[j]];
  observedPath += pairValue(counts[a], counts[a] + counts[b]);
  const threshold = observedPath + Math.log1p(RELATIVE_TIE_TOLERANCE);
  const logObserved = lf[total] + observedPath;
  const pairShareA = Math.exp(logPi[a] - logAddExp(logPi[a], logPi[b]));
  const oddsA = Math.exp(logPi[a] - logPi[b]);

  const progress = { massDone: 0, steps: 0, lastReport: start };
  let stopped: Stopped | undefined;
  const poll = (): void => {
    const now = performance.now();
    if (now - start > limits.timeMs) {
      stopped = { ok: false, reason: 'time', elapsedMs: now - start };
    } else if (now - progress.lastReport >= PROGRESS_INTERVAL_MS) {
      progress.lastReport = now;
      if (limits.isCancelled?.()) stopped = { ok: false, reason: 'cancelled', elapsedMs: now - start };
      else limits.onProgress?.(Math.min(1, progress.massDone));
    }
  };

  /**
   * Per n, the pair's tail sums as multiples of their last term: c(x) = Σ_{t≤x} w(t) / w(x) below
   * the mode and Σ_{t≥x} w(t) / w(x) above it, w(x) = exp(pairValue(x, n)). They obey
   * c(x) = 1 + c(x ∓ 1)·w(x ∓ 1)/w(x): a division per entry and no over- or underflow (1 ≤ c ≤ n + 1).
   */
  const pairRows: (Float64Array | undefined)[] | undefined = pairTableBytes(total) <= limits.memoryBytes / 2 ? new Array(total + 1) : undefined;
  const pairRow = (rows: (Float64Array | undefined)[], n: number, mode: number): Float64Array => {
    const existing = rows[n];
    if (existing !== undefined) return existing;
    const row = new Float64Array(n + 1);
    if (mode > 0) row[0] = 1;
    for (let x = 1; x < mode; x++) row[x] = 1 + (row[x - 1] * x) / ((n - x + 1) * oddsA);
    if (mode < n) row[n] = 1;
    for (let x = n - 1; x > mode; x--) row[x] = 1 + (row[x + 1] * (n - x) * oddsA) / (x + 1);
    rows[n] = row;
    return row;
  };

  /** Without the tables: sums the pair's terms from x outward (direction ∓1) until the rest is negligible. */
  const sumTail = (from: number, n: number, v: number, direction: -1 | 1): number => {
    let term = Math.exp(v + pairValue(from, n) - observedPath);
    let tail = term;
    for (let x = from; direction < 0 ? x > 0 : x < n; x += direction) {
      const ratio = direction < 0 ? x / ((n - x + 1) * oddsA) : ((n - x) * oddsA) / (x + 1);
      term *= ratio;
      tail += term;
      if (ratio < 1 && (term * ratio) / (1 - ratio) <= tail * NEGLIGIBLE_SHARE) break;
    }
    return tail;
  };

  /** Where the previous pair's tails ended: neighbouring pairs have nearby boundaries. */
  const hint = { left: 0, right: 0 };

  /** Scaled probability of the counted outcomes of the last two categories, n left and weight v so far. */
  const visitPair = (n: number, v: number): number => {
    const mode = Math.min(n, Math.floor((n + 1) * pairShareA));
    if (v + pairValue(mode, n) <= threshold) return Math.exp(v + n * logTailSum[a] - lf[n] - observedPath);
    const row = pairRows === undefined ? undefined : pairRow(pairRows, n, mode);
    const limit = threshold - v;
    let found = 0;
    if (mode > 0 && pairValue(0, n) <= limit) {
      // The weight rises on [0, mode]: find the last counted x by galloping from the hint, then bisecting.
      let yes = 0;
      let no = mode;
      const guess = Math.min(Math.max(hint.left, 0), mode - 1);
      if (pairValue(guess, n) <= limit) {
        yes = guess;
        for (let step = 1; yes + step < mode; step *= 2) {
          if (pairValue(yes + step, n) > limit) {
            no = yes + step;
            break;
          }
          yes += step;
        }
      } else {
        no = guess;
        for (let step = 1; no - step > 0; step *= 2) {
          if (pairValue(no - step, n) <= limit) {
            yes = no - step;
            break;
          }
          no -= step;
        }
      }
      while (no - yes > 1) {
        const middle = (yes + no) >>> 1;
        if (pairValue(middle, n) <= limit) yes = middle;
        else no = middle;
      }
      hint.left = yes;
      found += row === undefined ? sumTail(yes, n, v, -1) : Math.exp(v + pairValue(yes, n) - observedPath) * row[yes];
    }
    if (mode < n && pairValue(n, n) <= limit) {
      // The weight falls on [mode, n]: find the first counted x the same way.
      let yes = n;
      let no = mode;
      const guess = Math.min(Math.max(hint.right, mode + 1), n);
      if (pairValue(guess, n) <= limit) {
        yes = guess;
        for (let step = 1; yes - step > mode; step *= 2) {
          if (pairValue(yes - step, n) > limit) {
            no = yes - step;
            break;
          }
          yes -= step;
        }
      } else {
        no = guess;
        for (let step = 1; no + step < n; step *= 2) {
          if (pairValue(no + step, n) <= limit) {
            yes = no + step;
            break;
          }
          no += step;
        }
      }
      while (yes - no > 1) {
        const middle = (yes + no) >>> 1;
        if (pairValue(middle, n) <= limit) yes = middle;
        else no = middle;
      }
      hint.right = yes;
      found += row === undefined ? sumTail(yes, n, v, 1) : Math.exp(v + pairValue(yes, n) - observedPath) * row[yes];
    }
    return found;
  };

  /**
   * Subtree sums already computed, per (category, n), keyed by the weight v rounded to 2⁻³⁰:
   * outcomes that permute counts among equal proportions reach the same node with the same
   * weight, so the subtree below is summed once (with the key's weight; the difference is a
   * rounding error, far inside RELATIVE_TIE_TOLERANCE).
   */
  const memo: (Map<number, number> | undefined)[] = new Array(k * (total + 1));
  const memoWeights: number[] = [];
  const memoSums: number[] = [];
  const memoCapacity = Math.floor(limits.memoryBytes / 4 / MEMO_ENTRY_BYTES);

  /** Scaled probability of the counted outcomes below node (category j open, n left, weight v). */
  const visit = (j: number, n: number, v: number): number => {
    const key = Math.round(v * MEMO_KEY_SCALE);
    const slot = j * (total + 1) + n;
    const usable = j > 0 && Math.abs(key) < Number.MAX_SAFE_INTEGER;
    if (usable) {
      const index = memo[slot]?.get(key);
      if (index !== undefined) return memoSums[index] * Math.exp(v - memoWeights[index]);
    }
    const child = j + 1;
    const childBound = heaviest[child];
    const childMin = minLogPi[child];
    const childLogSum = logTailSum[child];
    let found = 0;
    let compensation = 0;
    for (let x = 0; x <= n && stopped === undefined; x++) {
      const rest = n - x;
      const childValue = v + x * logPi[j] - lf[x];
      let term = 0;
      let finished = true;
      if (childValue + childBound[rest] <= threshold) {
        term = Math.exp(childValue + rest * childLogSum - lf[rest] - observedPath);
      } else if (childValue + rest * childMin - lf[rest] <= threshold) {
        if (child === a) term = visitPair(rest, childValue);
        else {
          term = visit(child, rest, childValue);
          finished = child === PROGRESS_DEPTH;
        }
      }
      const next = found + term;
      compensation += found >= term ? found - next + term : term - next + found;
      found = next;
      if (finished && child <= PROGRESS_DEPTH) progress.massDone += Math.exp(lf[total] + childValue + rest * childLogSum - lf[rest]);
      progress.steps += 1;
      if (progress.steps % STEPS_PER_POLL === 0) poll();
    }
    found += compensation;
    if (usable && stopped === undefined && memoSums.length < memoCapacity) {
      let map = memo[slot];
      if (map === undefined) memo[slot] = map = new Map();
      map.set(key, memoSums.length);
      memoWeights.push(v);
      memoSums.push(found);
    }
    return found;
  };

  const scaledSum = k === 2 ? visitPair(total, 0) : visit(0, total, 0);
  if (stopped !== undefined) return stopped;
  return result(Math.log(scaledSum) + logObserved);

  function greedyHeaviest(first: number): Float64Array {
    const bound = new Float64Array(total + 1);
    const placed = new Int32Array(k);
    for (let n = 1; n <= total; n++) {
      let best = first;
      let bestGain = -Infinity;
      for (let i = first; i < k; i++) {
        const gain = logPi[i] - (lf[placed[i] + 1] - lf[placed[i]]);
        if (gain > bestGain) {
          bestGain = gain;
          best = i;
        }
      }
      placed[best] += 1;
      let value = 0;
      for (let i = first; i < k; i++) value += placed[i] * logPi[i] - lf[placed[i]];
      bound[n] = value;
    }
    return bound;
  }
}

/** Bytes of the pair tables for every n ≤ total: Σ (n + 1) doubles. */
function pairTableBytes(total: number): number {
  return (((total + 1) * (total + 2)) / 2) * BYTES_PER_ENTRY;
}

/** log(e^x + e^y) without overflow. */
function logAddExp(x: number, y: number): number {
  const larger = Math.max(x, y);
  return larger + Math.log1p(Math.exp(Math.min(x, y) - larger));
}
