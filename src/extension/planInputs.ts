// Reading what a person types into the planning command's boxes. Each reader returns the value or a
// message that names the entry and the remedy; range rules (alpha, power, w, df) stay in the engine.

export type Typed<T> = { ok: true; value: T } | { ok: false; message: string };

const DECIMAL = /^[+-]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i;

/**
 * A number as typed: a decimal, or a percentage when `percent` allows it ("80%" → 0.8).
 *
 * @param text - the box's text
 * @param what - how the message names the value, e.g. "The target power"
 */
export function typedNumber(text: string, what: string, percent = false): Typed<number> {
  const entry = text.trim();
  const isPercent = percent && entry.endsWith('%');
  const digits = isPercent ? entry.slice(0, -1).trim() : entry;
  if (!DECIMAL.test(digits)) {
    return { ok: false, message: `${what}: "${entry}" is not a number; write it with digits and a decimal point, e.g. ${percent ? '0.8 or 80%' : '0.3'}.` };
  }
  const value = Number(digits);
  return { ok: true, value: isPercent ? value / 100 : value };
}

/**
 * An allocation between groups typed as a ratio, "2:1" (or "2, 1", "2 1"): one positive number per
 * group, in the groups' order.
 *
 * @param text - the box's text
 * @param groups - names of the groups, for the count and the message
 * @returns the weights, or what is wrong with them
 */
export function typedAllocation(text: string, groups: readonly string[]): Typed<number[]> {
  const parts = text.trim().split(/\s*[:,;/\s]\s*/).filter((part) => part !== '');
  const example = groups.map((_, i) => (i === 0 ? '2' : '1')).join(':');
  if (parts.length !== groups.length) {
    return {
      ok: false,
      message: `Give ${groups.length} numbers, one per group (${groups.join(' : ')}), separated by ":", e.g. ${example}; ${parts.length === 1 ? 'one was' : `${parts.length} were`} given.`,
    };
  }
  const weights: number[] = [];
  for (const [index, part] of parts.entries()) {
    if (!DECIMAL.test(part)) return { ok: false, message: `"${part}" (for ${groups[index]}) is not a number; write the ratio with numbers, e.g. ${example}.` };
    const value = Number(part);
    if (!(value > 0) || !Number.isFinite(value)) {
      return { ok: false, message: `Every part of the ratio must be a positive number: ${groups[index]} has ${part}. Use ${groups.map(() => '1').join(':')} for equal groups.` };
    }
    weights.push(value);
  }
  return { ok: true, value: weights };
}
