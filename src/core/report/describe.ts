/** Small prose helpers shared by the write-ups. */

const MAX_LISTED_LABELS = 6;

/** "A", "A and B", "A, B and C"; long lists become "8 groups (Line A to Line H)". */
export function listLabels(labels: string[], noun: string): string {
  if (labels.length > MAX_LISTED_LABELS) {
    return `${labels.length} ${noun} (${labels[0]} to ${labels[labels.length - 1]})`;
  }
  if (labels.length <= 1) return labels.join('');
  return `${labels.slice(0, -1).join(', ')} and ${labels[labels.length - 1]}`;
}

/** "and"-joined list of already formatted phrases. */
export function joinPhrases(phrases: string[]): string {
  if (phrases.length <= 1) return phrases.join('');
  return `${phrases.slice(0, -1).join(', ')} and ${phrases[phrases.length - 1]}`;
}

/**
 * Words for an effect of size w, by Cohen's (1988, Statistical Power Analysis for the Behavioral
 * Sciences, ch. 7) conventions for w: .10 small, .30 medium, .50 large.
 */
export function describeEffectSize(w: number): string {
  if (!(w >= 0.1)) return 'smaller than what Cohen (1988) calls a small effect';
  if (w < 0.3) return 'a small effect by Cohen\'s (1988) conventions';
  if (w < 0.5) return 'a medium effect by Cohen\'s (1988) conventions';
  return 'a large effect by Cohen\'s (1988) conventions';
}

/** Italic statistical symbols in Markdown, plain letters elsewhere. */
export function symbol(name: string, markup: 'markdown' | 'plain'): string {
  return markup === 'markdown' ? `*${name}*` : name;
}

/** Capitalise the first letter of a sentence. */
export function sentence(text: string): string {
  return text.length === 0 ? text : text[0].toUpperCase() + text.slice(1);
}
