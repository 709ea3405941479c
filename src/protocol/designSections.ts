import type { DisplayTable } from './messages';

/**
 * What a study design adds to the results panel (paired, stratified, pairwise, trend): a titled
 * block of finished lines and an optional table. The host formats everything; the panel lays it out.
 */
export interface DesignSection {
  /** Stable id for tests and styles: 'paired', 'strata', 'pairwise', 'ordered'. */
  id: string;
  title: string;
  lines: string[];
  table?: DisplayTable;
}

/** Which analysis the view shows; paired and stratified views leave out the independence tables. */
export type ViewKind = 'independence' | 'goodness-of-fit' | 'paired' | 'stratified';

export function isDesignSections(value: unknown): value is DesignSection[] {
  return Array.isArray(value) && value.every((section) =>
    typeof section === 'object' && section !== null &&
    typeof (section as DesignSection).id === 'string' && typeof (section as DesignSection).title === 'string' &&
    Array.isArray((section as DesignSection).lines) && (section as DesignSection).lines.every((line) => typeof line === 'string'));
}
