import type { AnalyzeRequest, DocumentFormat } from '../core/analyze';

/** A selection as the editor reports it: 0-based lines and characters. */
export interface EditorSelection {
  start: { line: number; character: number };
  end: { line: number; character: number };
  active: { line: number; character: number };
  isEmpty: boolean;
}

/**
 * The engine request for what the person points at: the cursor's line, or the selected lines (a selection
 * that ends at the start of a line does not take that line, as editors select whole lines that way).
 *
 * @param text - the document's text
 * @param format - how to look for tables
 * @param selection - the editor's selection, or undefined for a line given by a CodeLens
 * @param line - 0-based line used when there is no selection
 * @returns the request (1-based lines), without options
 */
export function editorRequest(text: string, format: DocumentFormat, selection: EditorSelection | undefined, line = 0): Omit<AnalyzeRequest, 'control'> {
  if (!selection) return { text, format, line: line + 1 };
  if (selection.isEmpty) return { text, format, line: selection.active.line + 1 };
  const endLine = selection.end.character === 0 && selection.end.line > selection.start.line ? selection.end.line : selection.end.line + 1;
  return { text, format, line: selection.active.line + 1, selection: { startLine: selection.start.line + 1, endLine } };
}
