import * as path from 'node:path';
import type { ChartKind } from './analysisRecord';

/**
 * The file a saved chart goes to, beside the document: `<document name>-<table line>-<chart>.svg`.
 *
 * @param documentPath - the document's path (URI path, forward slashes)
 * @param tableLine - the table's first line (1-based)
 * @param chart - which chart
 * @returns the chart's path, and its name relative to the document's folder
 */
export function chartFilePath(documentPath: string, tableLine: number, chart: ChartKind): { path: string; relative: string } {
  const folder = path.posix.dirname(documentPath);
  const base = path.posix.basename(documentPath, path.posix.extname(documentPath)) || 'table';
  const relative = `${base}-${tableLine}-${chart}.svg`;
  return { path: path.posix.join(folder, relative), relative };
}

/**
 * How the write-up refers to a saved chart: a Markdown image, or the file name in plain text.
 * Destinations with spaces or parentheses go in angle brackets (CommonMark 0.31, link destination).
 */
export function chartReference(relative: string, chart: ChartKind, markdown: boolean): string {
  const description = chart === 'mosaic' ? 'Mosaic chart of the table' : 'Proportions chart of the table';
  if (!markdown) return `${description}: ${relative}`;
  const destination = /[\s()<>]/.test(relative) ? `<${relative.replace(/[<>]/g, '')}>` : relative;
  return `![${description}](${destination})`;
}

/** Only a plain SVG document from the panel is written: no scripts, no external references. */
export function isSafeSvg(svg: string): boolean {
  const start = svg.trimStart();
  return /^(<\?xml[^>]*>\s*)?<svg[\s>]/i.test(start) && !/<script|\son\w+\s*=|javascript:|<foreignObject/i.test(svg);
}
