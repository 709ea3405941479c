/** Where a planning paragraph goes: 0-based position and the text with its blank lines. */
export interface ParagraphInsertion {
  line: number;
  character: number;
  text: string;
}

/**
 * Places a paragraph below a given line with one blank line before and after it, keeping the
 * document's line endings; at the end of a document without a final line break it goes after the
 * last character.
 *
 * @param documentText - the document now
 * @param afterLine - 0-based line the paragraph goes below (the cursor's, or a table's last line)
 * @param paragraph - the text, without surrounding blank lines
 * @returns one insertion (one edit, one undo)
 */
export function planParagraphInsertion(documentText: string, afterLine: number, paragraph: string): ParagraphInsertion {
  const eol = documentText.includes('\r\n') ? '\r\n' : '\n';
  const lines = documentText.split(/\r?\n/);
  const line = Math.min(Math.max(afterLine, 0), lines.length - 1);
  const body = paragraph.replace(/\r?\n/g, eol).replace(/\s+$/, '');
  if (line === lines.length - 1) return { line, character: lines[line].length, text: `${eol}${eol}${body}${eol}` };
  const after = lines[line + 1].trim() === '' ? '' : eol;
  return { line: line + 1, character: 0, text: `${eol}${body}${eol}${after}` };
}
