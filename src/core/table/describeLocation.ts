import type { SourceLocation } from '../types';

/**
 * The words that open every parser message, so a person can find the cell: "line 7, column 12".
 *
 * @param location - a 1-based document position
 * @returns the position in words
 */
export function describeLocation(location: SourceLocation): string {
  return `line ${location.line}, column ${location.column}`;
}
