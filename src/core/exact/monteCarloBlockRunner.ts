import { monteCarloIndependenceExpected } from './monteCarloIndependenceExpected';
import type { MonteCarloGoodnessOfFitJob, MonteCarloIndependenceJob, MonteCarloJobSpec } from './monteCarloJobSpec';
import { monteCarloLogFactorials } from './monteCarloLogFactorials';
import { patefieldSampler } from './patefieldSampler';
import { REPLICATES_PER_STREAM, createRandom, type Xoshiro128StarStar } from './random';
import { randomMultinomialSampler } from './randomMultinomialSampler';

/** Replicates between polls: a few microseconds each, so polls stay far below 50 ms apart. */
export const REPLICATES_PER_POLL = 64;

/** Simulates whole blocks of one job; built once per thread and reused for every block it takes. */
export interface MonteCarloBlockRunner {
  /** Number of blocks in the job, ⌈R / REPLICATES_PER_STREAM⌉. */
  readonly blockCount: number;
  /** Replicates in block j (REPLICATES_PER_STREAM, or the remainder for the last block). */
  blockReplicates(block: number): number;
  /**
   * The number of extreme replicates in block j, drawn from stream j of the seed. `poll` is called
   * every REPLICATES_PER_POLL replicates with the replicates done so far in the block; returning
   * true abandons the block, and the result is then -1.
   */
  countBlock(block: number, poll?: (doneInBlock: number) => boolean): number;
}

/**
 * A block runner for a serialisable Monte Carlo job: the unit a worker pool runs. The same job and
 * block give the same count in any thread, because block j uses only stream j of the seed.
 *
 * @param spec - the job (margins or proportions, statistic, threshold, seed, R)
 * @param logFactorials - log k! for k = 0..N, when the caller has it already
 * @returns a runner reusing its sampler and work arrays
 */
export function monteCarloBlockRunner(spec: MonteCarloJobSpec, logFactorials?: Float64Array): MonteCarloBlockRunner {
  if (!Number.isSafeInteger(spec.replicates) || spec.replicates < 1) {
    throw new RangeError(`monteCarloBlockRunner: replicates must be a positive integer (got ${spec.replicates})`);
  }
  const isExtreme = spec.kind === 'independence' ? independenceReplicate(spec, logFactorials) : goodnessOfFitReplicate(spec, logFactorials);
  const blockCount = Math.ceil(spec.replicates / REPLICATES_PER_STREAM);
  const blockReplicates = (block: number): number => Math.min(spec.replicates, (block + 1) * REPLICATES_PER_STREAM) - block * REPLICATES_PER_STREAM;
  return {
    blockCount,
    blockReplicates,
    countBlock(block, poll) {
      if (!Number.isInteger(block) || block < 0 || block >= blockCount) {
        throw new RangeError(`monteCarloBlockRunner: block ${block} is outside 0..${blockCount - 1}`);
      }
      const random = createRandom(spec.seed, block);
      const size = blockReplicates(block);
      let extreme = 0;
      for (let done = 0; done < size; ) {
        const stop = Math.min(size, done + REPLICATES_PER_POLL);
        for (; done < stop; done++) if (isExtreme(random)) extreme += 1;
        if (poll && done < size && poll(done)) return -1;
      }
      return extreme;
    },
  };
}

function independenceReplicate(spec: MonteCarloIndependenceJob, given?: Float64Array): (random: Xoshiro128StarStar) => boolean {
  const total = spec.rowTotals.reduce((sum, value) => sum + value, 0);
  const logFactorials = given && given.length > total ? given : monteCarloLogFactorials(total);
  const sampler = patefieldSampler(spec.rowTotals, spec.columnTotals, logFactorials);
  const cellCount = spec.rowTotals.length * spec.columnTotals.length;
  const cells = new Int32Array(cellCount);
  const threshold = spec.threshold;
  if (spec.statistic === 'pearson') {
    const { expected, inverseExpected } = monteCarloIndependenceExpected(spec.rowTotals, spec.columnTotals);
    return (random) => {
      sampler.sample(random, cells);
      let sum = 0;
      for (let cell = 0; cell < cellCount; cell++) {
        const difference = cells[cell] - expected[cell];
        sum += difference * difference * inverseExpected[cell];
      }
      return sum >= threshold;
    };
  }
  return (random) => {
    sampler.sample(random, cells);
    let score = 0;
    for (let cell = 0; cell < cellCount; cell++) score += logFactorials[cells[cell]];
    return score >= threshold;
  };
}

function goodnessOfFitReplicate(spec: MonteCarloGoodnessOfFitJob, given?: Float64Array): (random: Xoshiro128StarStar) => boolean {
  const { total, proportions } = spec;
  const categories = proportions.length;
  const logFactorials = given && given.length > total ? given : monteCarloLogFactorials(total);
  const sampler = randomMultinomialSampler(proportions, total, logFactorials);
  const counts = new Int32Array(categories);
  const threshold = spec.threshold;
  if (spec.statistic === 'pearson') {
    const expected = Float64Array.from(proportions, (value) => value * total);
    const inverseExpected = Float64Array.from(expected, (value) => (value > 0 ? 1 / value : 0));
    return (random) => {
      sampler.sample(random, counts);
      let sum = 0;
      for (let j = 0; j < categories; j++) {
        const difference = counts[j] - expected[j];
        sum += difference * difference * inverseExpected[j];
      }
      return sum >= threshold;
    };
  }
  const logProportion = Float64Array.from(proportions, (value) => (value > 0 ? Math.log(value) : 0));
  return (random) => {
    sampler.sample(random, counts);
    let sum = 0;
    for (let j = 0; j < categories; j++) {
      const x = counts[j];
      if (x > 0) sum += logFactorials[x] - x * logProportion[j];
    }
    return sum >= threshold;
  };
}
