const BYTE_ORDER_MARK = 0xfeff;

/**
 * Splits a document into lines the way editors number them: `\r\n`, `\r` and `\n` all end a line,
 * and a leading byte order mark is dropped so that it never shifts a column.
 *
 * @param text - the whole document
 * @returns the lines without their line endings; line N of the document is element N - 1
 */
export function splitLines(text: string): string[] {
  const body = text.charCodeAt(0) === BYTE_ORDER_MARK ? text.slice(1) : text;
  return body.split(/\r\n|\r|\n/);
}
