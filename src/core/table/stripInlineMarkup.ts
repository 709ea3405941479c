/**
 * Reduces a table cell's Markdown to the words a reader sees: `**Total**` -> `Total`,
 * `[North depot](depots.md)` -> `North depot`, `f\|oo` -> `f|oo`.
 *
 * Emphasis follows the CommonMark 0.29 delimiter-run rules (left/right flanking, intraword `_`
 * never emphasises), so `snake_case` and `5*` survive; unmatched delimiters stay as written.
 * Code spans keep their content literally; HTML tags are dropped, autolinks keep their address;
 * backslash escapes and common character references are decoded. As in a GFM table cell, `\|` is
 * a pipe even inside a code span.
 *
 * @param label - cell text as written in the document
 * @returns the visible text, trimmed
 */
export function stripInlineMarkup(label: string): string {
  if (!/[\\`*_~<[!&]/.test(label)) return label.trim();
  // GFM 4.10 unescapes `\|` in a cell before inline parsing, so it reads as `|` inside code spans too.
  return renderTokens(scanInline(label.replaceAll('\\|', '|'), 0)).trim();
}

/** Links nest (`[[a](b)](c)`); deeper than this the label is kept as written, so crafted input cannot exhaust the stack. */
const MAX_LINK_NESTING = 8;

type Token =
  | { kind: 'text'; value: string }
  | { kind: 'delimiter'; char: string; count: number; canOpen: boolean; canClose: boolean };

const ASCII_PUNCTUATION = /[!-/:-@[-`{-~]/;
const UNICODE_PUNCTUATION = /[\p{P}\p{S}]/u;
const HTML_TAG = /<\/?[A-Za-z][A-Za-z0-9-]*(?:\s[^<>]*)?\/?>/y;
const HTML_COMMENT = /<!--[\s\S]*?-->/y;
const URI_AUTOLINK = /<([A-Za-z][A-Za-z0-9+.-]{1,31}:[^<>\s]*)>/y;
const EMAIL_AUTOLINK = /<([^<>\s@]+@[^<>\s]+)>/y;
const CHARACTER_REFERENCE = /&(?:#[xX]([0-9A-Fa-f]{1,6})|#([0-9]{1,7})|([A-Za-z][A-Za-z0-9]{1,31}));/y;
const NAMED_REFERENCES: Record<string, string> = {
  amp: '&', lt: '<', gt: '>', quot: '"', apos: "'", nbsp: '\u00a0', thinsp: '\u2009', minus: '\u2212',
};
/** Highest Unicode code point; larger numeric references are invalid and left as written. */
const MAX_CODE_POINT = 0x10ffff;

function isWhitespace(char: string): boolean {
  return char === '' || /\s/.test(char);
}

function isPunctuation(char: string): boolean {
  return char !== '' && (ASCII_PUNCTUATION.test(char) || UNICODE_PUNCTUATION.test(char));
}

function matchAt(pattern: RegExp, text: string, index: number): RegExpExecArray | null {
  pattern.lastIndex = index;
  return pattern.exec(text);
}

function scanInline(text: string, depth: number): Token[] {
  const tokens: Token[] = [];
  let pairs: BracketPairs | undefined;
  let lastCommentEnd: number | undefined;
  let plain = '';
  const flush = (): void => {
    if (plain !== '') tokens.push({ kind: 'text', value: plain });
    plain = '';
  };
  let index = 0;
  while (index < text.length) {
    const char = text[index];
    if (char === '\\' && index + 1 < text.length && ASCII_PUNCTUATION.test(text[index + 1])) {
      plain += text[index + 1];
      index += 2;
    } else if (char === '`') {
      const run = runLength(text, index, '`');
      const close = findBacktickRun(text, index + run, run);
      if (close < 0) {
        plain += text.slice(index, index + run);
      } else {
        plain += codeSpanContent(text.slice(index + run, close));
        index = close;
      }
      index += run;
    } else if (char === '<') {
      lastCommentEnd ??= text.lastIndexOf('-->');
      index = scanAngle(text, index, lastCommentEnd, (literal) => { plain += literal; });
    } else if (char === '&') {
      const reference = matchAt(CHARACTER_REFERENCE, text, index);
      const decoded = reference ? decodeReference(reference) : undefined;
      plain += decoded ?? '&';
      index += decoded !== undefined && reference ? reference[0].length : 1;
    } else if (char === '[' || (char === '!' && text[index + 1] === '[')) {
      const start = char === '!' ? index + 1 : index;
      pairs ??= pairBrackets(text);
      const link = depth < MAX_LINK_NESTING ? matchLink(text, start, pairs) : undefined;
      if (link) {
        plain += renderTokens(scanInline(link.label, depth + 1)).trim();
        index = link.end;
      } else {
        plain += char;
        index += 1;
      }
    } else if (char === '*' || char === '_' || char === '~') {
      flush();
      const run = runLength(text, index, char);
      tokens.push(delimiterToken(text, index, run, char));
      index += run;
    } else {
      plain += char;
      index += 1;
    }
  }
  flush();
  return tokens;
}

function runLength(text: string, index: number, char: string): number {
  let end = index;
  while (end < text.length && text[end] === char) end += 1;
  return end - index;
}

function findBacktickRun(text: string, from: number, length: number): number {
  let index = text.indexOf('`', from);
  while (index >= 0) {
    const run = runLength(text, index, '`');
    if (run === length) return index;
    index = text.indexOf('`', index + run);
  }
  return -1;
}

function codeSpanContent(content: string): string {
  const flat = content.replace(/\r\n|\r|\n/g, ' ');
  if (flat.length >= 2 && flat.startsWith(' ') && flat.endsWith(' ') && flat.trim() !== '') {
    return flat.slice(1, -1);
  }
  return flat;
}

function scanAngle(text: string, index: number, lastCommentEnd: number, emit: (literal: string) => void): number {
  const comment = lastCommentEnd > index ? matchAt(HTML_COMMENT, text, index) : null;
  if (comment) return index + comment[0].length;
  const uri = matchAt(URI_AUTOLINK, text, index) ?? matchAt(EMAIL_AUTOLINK, text, index);
  if (uri) {
    emit(uri[1]);
    return index + uri[0].length;
  }
  const tag = matchAt(HTML_TAG, text, index);
  if (tag) return index + tag[0].length;
  emit('<');
  return index + 1;
}

function decodeReference(match: RegExpExecArray): string | undefined {
  const [, hex, decimal, name] = match;
  if (name !== undefined) return NAMED_REFERENCES[name];
  const codePoint = hex !== undefined ? parseInt(hex, 16) : parseInt(decimal, 10);
  if (codePoint === 0 || codePoint > MAX_CODE_POINT) return '\ufffd';
  return String.fromCodePoint(codePoint);
}

/** For every `[` and `(` its matching `]` and `)`, found in one pass so that unclosed brackets cost no rescans. */
interface BracketPairs {
  square: Map<number, number>;
  round: Map<number, number>;
}

function pairBrackets(text: string): BracketPairs {
  const pairs: BracketPairs = { square: new Map(), round: new Map() };
  const openSquare: number[] = [];
  const openRound: number[] = [];
  for (let index = 0; index < text.length; index += 1) {
    const char = text[index];
    if (char === '\\') index += 1;
    else if (char === '[') openSquare.push(index);
    else if (char === '(') openRound.push(index);
    else if (char === ']' && openSquare.length > 0) pairs.square.set(openSquare.pop()!, index);
    else if (char === ')' && openRound.length > 0) pairs.round.set(openRound.pop()!, index);
  }
  return pairs;
}

/** `[label](destination)` or `[label][reference]` starting at `open`; returns the label and the end index. */
function matchLink(text: string, open: number, pairs: BracketPairs): { label: string; end: number } | undefined {
  const close = pairs.square.get(open);
  if (close === undefined) return undefined;
  const label = text.slice(open + 1, close);
  const after = close + 1;
  const end = text[after] === '[' ? pairs.square.get(after) : text[after] === '(' ? pairs.round.get(after) : undefined;
  return end === undefined ? undefined : { label, end: end + 1 };
}

function delimiterToken(text: string, index: number, run: number, char: string): Token {
  const before = index > 0 ? text[index - 1] : '';
  const after = index + run < text.length ? text[index + run] : '';
  const leftFlanking = !isWhitespace(after) && (!isPunctuation(after) || isWhitespace(before) || isPunctuation(before));
  const rightFlanking = !isWhitespace(before) && (!isPunctuation(before) || isWhitespace(after) || isPunctuation(after));
  if (char === '~' && run > 2) return { kind: 'delimiter', char, count: run, canOpen: false, canClose: false };
  if (char === '_') {
    return {
      kind: 'delimiter', char, count: run,
      canOpen: leftFlanking && (!rightFlanking || isPunctuation(before)),
      canClose: rightFlanking && (!leftFlanking || isPunctuation(after)),
    };
  }
  return { kind: 'delimiter', char, count: run, canOpen: leftFlanking, canClose: rightFlanking };
}

function renderTokens(tokens: Token[]): string {
  const openers: Extract<Token, { kind: 'delimiter' }>[] = [];
  for (const token of tokens) {
    if (token.kind !== 'delimiter') continue;
    const runLengthAtStart = token.count;
    if (token.canClose) {
      while (token.count > 0) {
        const position = findOpener(openers, token, runLengthAtStart);
        if (position < 0) break;
        const opener = openers[position];
        const used = Math.min(opener.count, token.count);
        opener.count -= used;
        token.count -= used;
        openers.length = opener.count > 0 ? position + 1 : position;
      }
    }
    if (token.count > 0 && token.canOpen) openers.push(token);
  }
  return tokens.map((token) => (token.kind === 'text' ? token.value : token.char.repeat(token.count))).join('');
}

function findOpener(openers: Extract<Token, { kind: 'delimiter' }>[], closer: { char: string }, closerRun: number): number {
  for (let position = openers.length - 1; position >= 0; position -= 1) {
    const opener = openers[position];
    if (opener.char !== closer.char || opener.count === 0) continue;
    // GFM strikethrough pairs only runs of equal length (`~x~` or `~~x~~`).
    if (closer.char === '~' && opener.count !== closerRun) continue;
    return position;
  }
  return -1;
}
