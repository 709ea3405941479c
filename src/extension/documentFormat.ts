import type { DocumentFormat } from '../core/analyze';

/** The editor's language id (and file name) → how the engine looks for tables. */
export function documentFormat(languageId: string, fileName: string): DocumentFormat {
  if (languageId === 'markdown') return 'markdown';
  if (languageId === 'csv' || languageId === 'tsv' || /\.(csv|tsv|tab|psv)$/i.test(fileName)) return 'delimited';
  return 'text';
}
