import { fail, ok, type Result } from '../types';
import { binomialLogPmf } from './binomialLogPmf';
import { binomialLogUpperTail } from './binomialLogUpperTail';
import { fitBinomialProbability } from './fitBinomialProbability';
import { fitPoissonMean } from './fitPoissonMean';
import type { FitRequest } from './fitRequest';
import { logPoissonProbability } from '../special/logPoissonProbability';
import { poissonLogUpperTail } from './poissonLogUpperTail';
import type { FitHypothesis } from './types';

/** Expected counts given in a table are "the same total" as N within this relative slack (rounding in the source). */
const TOTAL_RELATIVE_TOLERANCE = 1e-9;

export interface HypothesisProportions {
  /** One probability per category, summing to 1. */
  proportions: number[];
  hypothesis: FitHypothesis;
  /** Parameters estimated from the same counts (they cost degrees of freedom). */
  estimatedParameters: number;
}

/**
 * The category probabilities a goodness-of-fit hypothesis implies, fitting a Poisson mean or a
 * binomial probability from the counts where asked (Pearson 1900; Fisher 1924, "The conditions under
 * which χ² measures the discrepancy between observation and hypothesis", JRSS 87, 442–450, for the
 * lost degree of freedom per estimated parameter).
 *
 * Intuition: every hypothesis comes down to one probability per category; expected counts are those
 * probabilities times N.
 *
 * ## Method
 * Ratios and expected counts are divided by their total. Poisson and binomial: the parameter is fitted
 * by maximum likelihood (`fitPoissonMean`, `fitBinomialProbability`); categories below the top get
 * P(X = k), and the top category gets P(X ≥ K) whether or not its label is open-ended — values beyond
 * the last label are pooled into it (common practice), so the probabilities total 1.
 *
 * @param observed - the counts, one per category
 * @param request - the hypothesis
 * @returns the probabilities and the hypothesis as reported, or an issue when the hypothesis does not fit the counts
 * @example hypothesisProportions([315, 108, 101, 32], { kind: 'ratio', ratio: [9, 3, 3, 1], text: '9:3:3:1' }) // proportions [0.5625, 0.1875, 0.1875, 0.0625]
 */
export function hypothesisProportions(observed: number[], request: FitRequest): Result<HypothesisProportions> {
  const k = observed.length;
  const n = observed.reduce((sum, count) => sum + count, 0);
  const bad = (message: string) => fail<HypothesisProportions>({ code: 'bad-expected', message });
  switch (request.kind) {
    case 'equal':
      return ok({ proportions: new Array<number>(k).fill(1 / k), hypothesis: { kind: 'equal' }, estimatedParameters: 0 });
    case 'ratio':
    case 'proportions': {
      const parts = request.kind === 'ratio' ? request.ratio : request.proportions;
      if (parts.length !== k) return bad(`The expected pattern ${request.text} has ${parts.length} parts but there are ${k} categories; give one part per category.`);
      if (!parts.every((part) => part > 0 && Number.isFinite(part))) return bad(`Every part of ${request.text} must be a number greater than 0.`);
      const total = parts.reduce((sum, part) => sum + part, 0);
      const hypothesis: FitHypothesis = request.kind === 'ratio'
        ? { kind: 'ratio', ratio: request.ratio, text: request.text }
        : { kind: 'proportions', proportions: request.proportions, text: request.text };
      return ok({ proportions: parts.map((part) => part / total), hypothesis, estimatedParameters: 0 });
    }
    case 'expected-counts': {
      const { counts } = request;
      if (counts.length !== k) return bad(`There are ${counts.length} expected counts for ${k} categories; give one expected count per category.`);
      const offending = counts.findIndex((count) => !(count > 0 && Number.isFinite(count)));
      if (offending >= 0) return bad(`Expected count ${offending + 1} is ${counts[offending]}; every expected count must be greater than 0.`);
      const total = counts.reduce((sum, count) => sum + count, 0);
      const rescaled = Math.abs(total - n) > TOTAL_RELATIVE_TOLERANCE * n;
      return ok({ proportions: counts.map((count) => count / total), hypothesis: { kind: 'expected-counts', counts, rescaled }, estimatedParameters: 0 });
    }
    case 'poisson': {
      const values = checkValues(request.values, k);
      if (values) return values;
      const mean = fitPoissonMean(observed, request.openEnded);
      if (!mean.ok) return mean;
      const top = k - 1;
      const proportions = observed.map((_, value) =>
        Math.exp(value < top ? logPoissonProbability(value, mean.value) : poissonLogUpperTail(top, mean.value)));
      return ok({ proportions, hypothesis: { kind: 'poisson', mean: mean.value, openEnded: request.openEnded }, estimatedParameters: 1 });
    }
    case 'binomial': {
      const values = checkValues(request.values, k);
      if (values) return values;
      if (!(Number.isInteger(request.trials) && request.trials >= k - 1)) {
        return bad(`A binomial with ${request.trials} trials cannot produce the top category ${k - 1}; give at least binomial:${k - 1}.`);
      }
      const probability = fitBinomialProbability(observed, request.trials, request.openEnded);
      if (!probability.ok) return probability;
      const top = k - 1;
      const proportions = observed.map((_, value) =>
        Math.exp(value < top ? binomialLogPmf(value, request.trials, probability.value) : binomialLogUpperTail(top, request.trials, probability.value)));
      return ok({ proportions, hypothesis: { kind: 'binomial', trials: request.trials, probability: probability.value }, estimatedParameters: 1 });
    }
  }
}

function checkValues(values: number[], k: number): Result<HypothesisProportions> | undefined {
  if (values.length === k && values.every((value, index) => value === index)) return undefined;
  return fail({ code: 'bad-expected', message: `A distribution fit needs categories 0, 1, 2, … in order, one per count; got values ${values.join(', ')} for ${k} categories.` });
}
