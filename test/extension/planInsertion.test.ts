import assert from 'node:assert/strict';
import { typedAllocation, typedNumber } from '../../src/extension/planInputs';
import { planInsertion, type InsertionSnapshot } from '../../src/extension/planInsertion';
import { planAnchor, planParagraphInsertion } from '../../src/extension/planParagraphInsertion';

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

describe('planParagraphInsertion', () => {
  const anchorOnTable = planAnchor(NOTES, 3, 6, 'markdown', 'table');

  it('goes below the table with one blank line on each side, following the table when lines were added above', () => {
    assert.equal(anchorOnTable.text, TABLE.join('\n'));
    assert.equal(apply(NOTES, planParagraphInsertion(NOTES, anchorOnTable, PARAGRAPH)), ['# Greenhouse log', '', ...TABLE, '', PARAGRAPH, '', 'Trays were checked on day 9.', ''].join('\n'));
    const moved = `New line.\n${NOTES}`;
    const place = planParagraphInsertion(moved, anchorOnTable, PARAGRAPH);
    assert.ok(place.ok && place.relocated && place.tableEndLine === 7);
  });

  it('goes below the cursor line, keeping Windows line endings', () => {
    const text = 'a\r\nb\r\nc';
    const place = planParagraphInsertion(text, planAnchor(text, 1, 1, 'text', 'line'), 'P');
    assert.ok(place.ok);
    assert.deepEqual([place.line, place.character, place.text], [1, 0, '\r\nP\r\n\r\n']);
    const end = planParagraphInsertion('a', planAnchor('a', 1, 1, 'markdown', 'line'), 'P');
    assert.ok(end.ok);
    assert.deepEqual([end.line, end.character, end.text], [0, 1, '\n\nP\n']);
  });

  it('leaves exactly one blank line before the paragraph when the cursor was on an empty line', () => {
    // Cursor on the empty line 7 (after the table), and on the empty last line of the document.
    const below = apply(NOTES, planParagraphInsertion(NOTES, planAnchor(NOTES, 7, 7, 'markdown', 'line'), PARAGRAPH));
    assert.equal(below, ['# Greenhouse log', '', ...TABLE, '', PARAGRAPH, '', 'Trays were checked on day 9.', ''].join('\n'));
    const lastLine = NOTES.split('\n').length;
    const atEnd = apply(NOTES, planParagraphInsertion(NOTES, planAnchor(NOTES, lastLine, lastLine, 'markdown', 'line'), PARAGRAPH));
    assert.equal(atEnd, `${NOTES}\n${PARAGRAPH}\n`);
    assert.ok(!atEnd.includes('\n\n\n'), 'never two blank lines in a row');
  });

  it('refuses when the anchor\'s text is gone, and in a CSV file, naming the plan\'s own buttons', () => {
    const edited = NOTES.replace('| Coir | 35 | 15 |', '| Coir | 36 | 15 |');
    const changed = planParagraphInsertion(edited, anchorOnTable, PARAGRAPH);
    assert.equal(changed.ok, false);
    assert.match(changed.ok ? '' : changed.message, /^The table that was on lines 3–6 has changed since the plan was made.*Plan again/);
    const line = planParagraphInsertion('x\ny', planAnchor('a\nb', 2, 2, 'markdown', 'line'), PARAGRAPH);
    assert.match(line.ok ? '' : line.message, /^Line 2, where the cursor was, has changed/);
    const csv = planParagraphInsertion('a,b\n1,2', planAnchor('a,b\n1,2', 1, 2, 'delimited', 'table'), PARAGRAPH);
    assert.match(csv.ok ? '' : csv.message, /CSV or TSV.*"Copy the paragraph"/);
  });
});

describe('planInputs', () => {
  it('reads decimals and, where allowed, percentages; anything else gets a message naming the entry', () => {
    assert.deepEqual(typedNumber(' 0.05 ', 'The significance level'), { ok: true, value: 0.05 });
    assert.deepEqual(typedNumber('80%', 'The target power', true), { ok: true, value: 0.8 });
    const percentNotAllowed = typedNumber('5%', 'The effect size w');
    assert.equal(percentNotAllowed.ok, false);
    assert.match(percentNotAllowed.ok ? '' : percentNotAllowed.message, /^The effect size w: "5%" is not a number/);
    assert.equal(typedNumber('0x10', 'w').ok, false);
    assert.equal(typedNumber('1e-2', 'w').ok, true);
  });

  it('reads a ratio with one positive number per group', () => {
    assert.deepEqual(typedAllocation('2:1', ['A', 'B']), { ok: true, value: [2, 1] });
    assert.deepEqual(typedAllocation('1, 1.5, 2', ['A', 'B', 'C']), { ok: true, value: [1, 1.5, 2] });
    const zero = typedAllocation('0:1', ['Peat', 'Coir']);
    assert.match(zero.ok ? '' : zero.message, /positive number: Peat has 0\. Use 1:1 for equal groups/);
    const count = typedAllocation('2', ['Peat', 'Coir', 'Bark']);
    assert.match(count.ok ? '' : count.message, /^Give 3 numbers, one per group \(Peat : Coir : Bark\), separated by ":", e\.g\. 2:1:1; one was given\./);
  });
});
