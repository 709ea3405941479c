import type { CountTable, Result } from '../types';

export interface CrossTabulateOptions {
  /** Header names of the row variable and the column variable; default: the first two categorical columns. */
  columns?: [string, string];
  /** Header name of a column holding how many observations each row stands for; default: each row counts once. */
  weight?: string;
  /** Header name of a column whose values split the rows into strata (site, shift...); each stratum gets its own table. */
  stratum?: string;
  /** One character separating fields; default: detected from the header line among `,` tab `;` `|`. */
  delimiter?: string;
  /** Document line of the text's first line, so locations point into the whole document (default 1). */
  firstLine?: number;
}

/** One stratum's counts, on the same row and column labels, in the same order, as the whole table. */
export interface StratumCounts {
  label: string;
  observed: number[][];
}

export type CrossTabulation = CountTable & {
  columnsUsed: [string, string];
  weightColumn?: string;
  /** With the `stratum` option: the stratum column's name. */
  stratumColumn?: string;
  /** With the `stratum` option: one table per stratum value, in order of first appearance; they add up to `observed`. */
  strata?: StratumCounts[];
  /** Data rows read below the header, blank lines included. */
  rowsRead: number;
  /** Rows among `rowsRead` passed over without counting: blank lines, and rows with an empty stratum value. */
  rowsSkipped: number;
};

export interface CrossTabulator {
  /** Feeds the next piece of text; pieces may split the text anywhere. */
  push(chunk: string): void;
  /** Ends the text and returns the table, or the first problem found. */
  finish(): Result<CrossTabulation>;
}
