import assert from 'node:assert/strict';
import fc from 'fast-check';
import { stripInlineMarkup } from '../../../src/core/table/stripInlineMarkup';

describe('stripInlineMarkup', () => {
  const cases: [string, string][] = [
    ['**Total**', 'Total'],
    ['__Night shift__', 'Night shift'],
    ['*Rye*', 'Rye'],
    ['_Spelt_', 'Spelt'],
    ['***Grand total***', 'Grand total'],
    ['~~Kiln 2~~ Kiln 3', 'Kiln 2 Kiln 3'],
    ['`T4`', 'T4'],
    ['`` a`b ``', 'a`b'],
    ['[North depot](depots.md#north)', 'North depot'],
    ['![Blue run](blue.png)', 'Blue run'],
    ['[**East** bed][beds]', 'East bed'],
    ['<b>Late</b> <br/>arrivals', 'Late arrivals'],
    ['<!-- hidden -->Slope', 'Slope'],
    ['<https://example.org/depot>', 'https://example.org/depot'],
    ['f\\|oo', 'f|oo'],
    ['b `\\|` az', 'b | az'],
    ['\\*not emphasis\\*', '*not emphasis*'],
    ['Basil &amp; mint', 'Basil & mint'],
    ['1&nbsp;204', '1\u00a0204'],
    ['  padded  ', 'padded'],
  ];
  for (const [input, expected] of cases) {
    it(`reduces ${JSON.stringify(input)} to ${JSON.stringify(expected)}`, () => {
      assert.equal(stripInlineMarkup(input), expected);
    });
  }

  it('keeps intraword underscores, lone asterisks and comparison signs that are not markup', () => {
    assert.equal(stripInlineMarkup('route_7_late'), 'route_7_late');
    assert.equal(stripInlineMarkup('5*'), '5*');
    assert.equal(stripInlineMarkup('2 * 3'), '2 * 3');
    assert.equal(stripInlineMarkup('<5'), '<5');
    assert.equal(stripInlineMarkup('≥ 65'), '≥ 65');
    assert.equal(stripInlineMarkup('[draft]'), '[draft]');
    assert.equal(stripInlineMarkup('```'), '```');
  });

  it('does not exhaust the stack or time on deeply nested links and unclosed brackets', () => {
    let nested = 'Kiln';
    for (let depth = 0; depth < 20000; depth += 1) nested = `[${nested}](k.md)`;
    assert.equal(typeof stripInlineMarkup(nested), 'string');
    assert.equal(stripInlineMarkup('[[**Kiln**](a)](b)'), 'Kiln');
    assert.equal(stripInlineMarkup('['.repeat(50000)), '['.repeat(50000));
  });

  it('never throws and is idempotent on text without markup characters', () => {
    fc.assert(fc.property(fc.string({ unit: 'binary', maxLength: 100 }), (text) => {
      const once = stripInlineMarkup(text);
      assert.equal(typeof once, 'string');
      if (!/[\\`*_~<[!&]/.test(text)) assert.equal(once, text.trim());
    }), { numRuns: 2000 });
  });

  it('removes the emphasis that a property-generated label was wrapped in', () => {
    const word = fc.stringMatching(/^[A-Za-z][A-Za-z ]{0,10}[A-Za-z]$/);
    fc.assert(fc.property(word, fc.constantFrom('**', '__', '*', '_', '~~', '`'), (label, marker) => {
      assert.equal(stripInlineMarkup(`${marker}${label}${marker}`), label);
    }));
  });
});
