import type { DocumentFormat } from '../core/analyze';
import { planInsertion, type InsertionPlan } from './planInsertion';

/** Where a planning paragraph belongs: below these lines of the notes, as they were when the plan was made. */
export interface PlanAnchor {
  /** 1-based first and last lines: the table planned from, or the cursor's line. */
  startLine: number;
  endLine: number;
  /** Those lines' text as it stood, joined with "\n". */
  text: string;
  format: DocumentFormat;
  /** How messages name the lines. */
  what: 'table' | 'line';
}

/**
 * The anchor for a paragraph below some lines of a document.
 *
 * @param documentText - the document when the plan is made
 * @param startLine - 1-based first line (a table's), or the cursor's line
 * @param endLine - 1-based last line (the same for the cursor's line)
 */
export function planAnchor(documentText: string, startLine: number, endLine: number, format: DocumentFormat, what: PlanAnchor['what']): PlanAnchor {
  const lines = documentText.split(/\r?\n/);
  const last = Math.min(Math.max(endLine, 1), lines.length);
  const first = Math.min(Math.max(startLine, 1), last);
  return { startLine: first, endLine: last, text: lines.slice(first - 1, last).join('\n'), format, what };
}

/**
 * Places a planning paragraph below its anchor with one blank line before and after it, keeping the
 * document's line endings. Lines added or removed above the anchor are followed (the copy of its text
 * nearest the old place wins); if its text is gone, or the document is a CSV or TSV file, the
 * insertion is refused with a message, so the paragraph never lands in the wrong place.
 *
 * @param documentText - the document now
 * @param anchor - the lines the paragraph goes below
 * @param paragraph - the text, without surrounding blank lines
 * @returns one insertion (one edit, one undo), or why not
 */
export function planParagraphInsertion(documentText: string, anchor: PlanAnchor, paragraph: string): InsertionPlan {
  const snapshot = { startLine: anchor.startLine, endLine: anchor.endLine, tableText: anchor.text, format: anchor.format, crossTabulated: false };
  const place = anchor.what === 'table' ? `the table that was on lines ${anchor.startLine}–${anchor.endLine}` : `line ${anchor.startLine}, where the cursor was,`;
  return planInsertion(documentText, snapshot, paragraph, {
    notInData: 'A paragraph inside a CSV or TSV file would break it as data. Use "Copy the paragraph" and paste it into your notes instead.',
    changed: () => `${capitalise(place)} has changed since the plan was made, so the paragraph could land in the wrong place. Plan again, or copy the paragraph and paste it.`,
  });
}

function capitalise(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}
