import { fail, ok, type Result } from '../types';
import type { FitRequest, FitSpec } from './fitRequest';

const WHOLE_NUMBER = /^\d+$/;
/** "5+", "5 +", "≥5", ">=5", "5 or more": the top category holds that value and everything above. */
const OPEN_ENDED = /^(?:(\d+)\s*\+|(?:≥|>=)\s*(\d+)|(\d+)\s+or\s+more)$/i;

/**
 * Completes a parsed hypothesis with what the category labels say: for Poisson and binomial fits the
 * category values 0, 1, 2, … and whether the last category is open-ended ("5+"); for the others, a
 * check that there is one part per category.
 *
 * Intuition: a distribution fit needs to know which count each category stands for, and the labels
 * are where the user wrote it.
 *
 * The values must run 0, 1, 2, … without gaps, because a fitted distribution gives every value a
 * probability and a missing one would leave expected counts that do not total N.
 *
 * @param spec - from `parseFitSpec`
 * @param labels - the category labels in table order
 * @returns the request, or a 'bad-expected' issue naming the label that does not fit
 * @example buildFitRequest({ kind: 'poisson' }, ['0', '1', '2', '3+']) // ok({ kind: 'poisson', values: [0, 1, 2, 3], openEnded: true })
 */
export function buildFitRequest(spec: FitSpec, labels: string[]): Result<FitRequest> {
  if (spec.kind === 'equal') return ok(spec);
  if (spec.kind === 'ratio' || spec.kind === 'proportions') {
    const parts = spec.kind === 'ratio' ? spec.ratio.length : spec.proportions.length;
    if (parts !== labels.length) {
      return fail({ code: 'bad-expected', message: `The expected pattern ${spec.text} has ${parts} parts but the table has ${labels.length} categories; give one part per category.` });
    }
    return ok(spec);
  }
  const distribution = spec.kind === 'poisson' ? 'Poisson' : 'binomial';
  const read = readCategoryValues(labels, distribution);
  if (!read.ok) return read;
  const { values, openEnded } = read.value;
  if (spec.kind === 'poisson') return ok({ kind: 'poisson', values, openEnded });
  const largest = values[values.length - 1];
  const trials = spec.trials ?? largest;
  if (trials < largest) {
    return fail({ code: 'bad-expected', message: `A binomial with ${trials} trials cannot produce ${largest}, the largest category; give at least binomial:${largest}.` });
  }
  if (trials < 1) {
    return fail({ code: 'bad-expected', message: 'A binomial fit needs categories beyond 0; the labels stop at 0.' });
  }
  return ok({ kind: 'binomial', values, trials, openEnded: openEnded && trials > largest });
}

function readCategoryValues(labels: string[], distribution: string): Result<{ values: number[]; openEnded: boolean }> {
  const values: number[] = [];
  let openEnded = false;
  for (const [index, raw] of labels.entries()) {
    const label = raw.trim();
    const isLast = index === labels.length - 1;
    const open = OPEN_ENDED.exec(label);
    let value: number;
    if (WHOLE_NUMBER.test(label)) {
      value = Number(label);
    } else if (open && isLast) {
      value = Number(open[1] ?? open[2] ?? open[3]);
      openEnded = true;
    } else {
      const where = open ? ' (only the last category can be open-ended)' : '';
      return fail({
        code: 'bad-expected',
        message: `A ${distribution} fit reads each category label as a whole number, 0, 1, 2, … with an optional open-ended last one such as "5+"; "${raw}" is not one${where}. Relabel the categories with the counts they stand for.`,
      });
    }
    if (value !== index) {
      const message = index === 0
        ? `A ${distribution} fit needs the categories to start at 0; the first label is "${raw}". Add a category 0 (with its count, even if 0).`
        : `A ${distribution} fit needs consecutive categories 0, 1, 2, …; after "${labels[index - 1].trim()}" comes "${raw}". Add the missing categories with count 0, in order.`;
      return fail({ code: 'bad-expected', message });
    }
    values.push(value);
  }
  return ok({ values, openEnded });
}
