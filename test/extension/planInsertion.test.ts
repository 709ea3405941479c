import assert from 'node:assert/strict';
import { planInsertion, type InsertionSnapshot } from '../../src/extension/planInsertion';

// Invented greenhouse notes: seed trays by potting mix.
const TABLE = [
  '| Mix | Sprouted | Failed |',
  '| --- | --- | --- |',
  '| Peat | 40 | 10 |',
  '| Coir | 35 | 15 |',
];
const NOTES = ['# Greenhouse log', '', ...TABLE, '', 'Trays were checked on day 9.', ''].join('\n');
const SNAPSHOT: InsertionSnapshot = { startLine: 3, endLine: 6, tableText: TABLE.join('\n'), format: 'markdown', crossTabulated: false };
const PARAGRAPH = 'Sprouting did not differ by mix.';

function apply(text: string, plan: ReturnType<typeof planInsertion>): string {
  assert.ok(plan.ok, plan.ok ? '' : plan.message);
  if (!plan.ok) return text;
  const lines = text.split('\n');
  const offset = lines.slice(0, plan.line).reduce((sum, line) => sum + line.length + 1, 0) + plan.character;
  return text.slice(0, offset) + plan.text + text.slice(offset);
}

describe('planInsertion', () => {
  it('inserts the paragraph right after the table with one blank line before and after', () => {
    const plan = planInsertion(NOTES, SNAPSHOT, PARAGRAPH);
    assert.ok(plan.ok);
    assert.equal(plan.tableEndLine, 6);
    assert.equal(plan.relocated, false);
    assert.equal(apply(NOTES, plan), ['# Greenhouse log', '', ...TABLE, '', PARAGRAPH, '', 'Trays were checked on day 9.', ''].join('\n'));
  });

  it('adds the blank line after when text follows the table directly', () => {
    const text = [...TABLE, 'Checked on day 9.'].join('\n');
    const plan = planInsertion(text, { ...SNAPSHOT, startLine: 1, endLine: 4 }, PARAGRAPH);
    assert.equal(apply(text, plan), [...TABLE, '', PARAGRAPH, '', 'Checked on day 9.'].join('\n'));
  });

  it('handles a table that ends the document without a final line break', () => {
    const text = TABLE.join('\n');
    const plan = planInsertion(text, { ...SNAPSHOT, startLine: 1, endLine: 4 }, PARAGRAPH);
    assert.equal(apply(text, plan), [...TABLE, '', PARAGRAPH, ''].join('\n'));
  });

  it('follows the table when lines were added above it since the analysis', () => {
    const moved = ['# Greenhouse log', '', 'A new note.', 'Another.', '', ...TABLE, '', 'End.'].join('\n');
    const plan = planInsertion(moved, SNAPSHOT, PARAGRAPH);
    assert.ok(plan.ok);
    assert.equal(plan.relocated, true);
    assert.equal(plan.tableEndLine, 9);
    assert.equal(plan.line, 9);
  });

  it('picks the copy of the table nearest its old place when the table appears twice', () => {
    const twice = [...TABLE, '', 'x', '', ...TABLE, ''].join('\n');
    const plan = planInsertion(twice, { ...SNAPSHOT, startLine: 6, endLine: 9 }, PARAGRAPH);
    assert.ok(plan.ok);
    assert.equal(plan.tableEndLine, 11);
  });

  it('refuses, asking to re-run, when the table itself was edited', () => {
    const edited = NOTES.replace('| Peat | 40 | 10 |', '| Peat | 41 | 10 |');
    const plan = planInsertion(edited, SNAPSHOT, PARAGRAPH);
    assert.equal(plan.ok, false);
    assert.match(plan.ok ? '' : plan.message, /changed since it was analysed.*Run the analysis again/);
  });

  it('refuses to write prose into a CSV file or under a cross-tabulation', () => {
    const csv = 'mix,sprouted,failed\npeat,40,10\ncoir,35,15\n';
    const delimited = planInsertion(csv, { startLine: 1, endLine: 3, tableText: csv.trimEnd(), format: 'delimited', crossTabulated: false }, PARAGRAPH);
    assert.equal(delimited.ok, false);
    assert.match(delimited.ok ? '' : delimited.message, /Copy write-up/);
    const crossed = planInsertion(NOTES, { ...SNAPSHOT, crossTabulated: true }, PARAGRAPH);
    assert.equal(crossed.ok, false);
  });

  it('keeps Windows line endings in a CRLF document', () => {
    const crlf = NOTES.replace(/\n/g, '\r\n');
    const plan = planInsertion(crlf, SNAPSHOT, 'First line.\nSecond line.');
    assert.ok(plan.ok);
    assert.equal(plan.text, '\r\nFirst line.\r\nSecond line.\r\n');
  });

  it('inserts plain text unchanged in a plain-text note', () => {
    const text = ['Bus depot tally', '', 'route  late  on-time', 'A      12    40', 'B      9     51', '', 'end'].join('\n');
    const snapshot: InsertionSnapshot = { startLine: 3, endLine: 5, tableText: text.split('\n').slice(2, 5).join('\n'), format: 'text', crossTabulated: false };
    const plan = planInsertion(text, snapshot, 'Lateness did not differ by route (plain).');
    assert.ok(plan.ok);
    assert.equal(plan.text, '\nLateness did not differ by route (plain).\n');
    assert.equal(plan.line, 5);
  });
});
