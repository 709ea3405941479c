import type { DocumentFormat } from '../core/analyze';

/** What insertion needs to know about the analysed table, as it was when the analysis ran. */
export interface InsertionSnapshot {
  /** 1-based first and last lines of the table. */
  startLine: number;
  endLine: number;
  /** The table's lines as they stood, joined with "\n". */
  tableText: string;
  format: DocumentFormat;
  /** True when the table was cross-tabulated from raw observations (it is not in the document as a table). */
  crossTabulated: boolean;
}

export type InsertionPlan =
  | {
    ok: true;
    /** 0-based position to insert at. */
    line: number;
    character: number;
    text: string;
    /** 1-based last line of the table the text goes under, and whether the table had moved. */
    tableEndLine: number;
    relocated: boolean;
  }
  | { ok: false; message: string };

/** Why an insertion is refused, in the words of what is being inserted. */
export interface RefusalMessages {
  /** The document is a CSV or TSV file, or the table came from raw observations. */
  notInData: string;
  /** The block of lines was edited (or removed) since it was read. */
  changed(startLine: number, endLine: number): string;
}

const WRITE_UP_REFUSALS: RefusalMessages = {
  notInData: 'A paragraph inside a CSV or TSV file would break it as data. Use "Copy write-up" and paste it into your notes instead.',
  changed: (startLine, endLine) =>
    `The table that was on lines ${startLine}–${endLine} has changed since it was analysed, so the write-up could land in the wrong place. Run the analysis again, then insert.`,
};

/**
 * Decides where a write-up goes: under the analysed table as it stands now, with one blank line before
 * and after the inserted text. If the document changed, the same table text is looked for (the copy
 * nearest its old place wins); if it is gone, insertion is refused so nothing lands in the wrong place.
 *
 * @param documentText - the document's text now
 * @param snapshot - the table as analysed
 * @param content - the paragraph (and any tables or links) to insert, without surrounding blank lines
 * @param refusals - the messages when insertion is refused (the write-up's by default)
 * @returns the position and text to insert, or why not
 */
export function planInsertion(documentText: string, snapshot: InsertionSnapshot, content: string, refusals: RefusalMessages = WRITE_UP_REFUSALS): InsertionPlan {
  if (snapshot.format === 'delimited' || snapshot.crossTabulated) return { ok: false, message: refusals.notInData };
  const eol = documentText.includes('\r\n') ? '\r\n' : '\n';
  const lines = documentText.split(/\r?\n/);
  const tableLines = snapshot.tableText.split(/\r?\n/);
  const startIndex = findTable(lines, tableLines, snapshot.startLine - 1);
  if (startIndex < 0) return { ok: false, message: refusals.changed(snapshot.startLine, snapshot.endLine) };
  const endIndex = startIndex + tableLines.length - 1;
  const body = content.replace(/\r?\n/g, eol).replace(/\s+$/, '');
  const relocated = startIndex !== snapshot.startLine - 1;
  const tableEndLine = endIndex + 1;
  // A blank anchor line (a cursor on an empty line) is itself the blank line before the text.
  const before = lines[endIndex].trim() === '' ? '' : eol;
  if (endIndex === lines.length - 1) {
    // The anchor ends the document without a final line break.
    return { ok: true, line: endIndex, character: lines[endIndex].length, text: `${eol}${before}${body}${eol}`, tableEndLine, relocated };
  }
  // An existing blank line (or the document's end) already separates the text from what follows.
  const after = lines[endIndex + 1].trim() === '' ? '' : eol;
  return { ok: true, line: endIndex + 1, character: 0, text: `${before}${body}${eol}${after}`, tableEndLine, relocated };
}

/** Index of the table's first line: its old place if unchanged, else the nearest copy, else -1. */
function findTable(lines: readonly string[], tableLines: readonly string[], oldStart: number): number {
  const matchesAt = (start: number) => start >= 0 && start + tableLines.length <= lines.length &&
    tableLines.every((line, offset) => lines[start + offset] === line);
  if (matchesAt(oldStart)) return oldStart;
  let best = -1;
  for (let start = 0; start + tableLines.length <= lines.length; start++) {
    if (matchesAt(start) && (best < 0 || Math.abs(start - oldStart) < Math.abs(best - oldStart))) best = start;
  }
  return best;
}
