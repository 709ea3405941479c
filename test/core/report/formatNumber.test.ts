import assert from 'node:assert/strict';
import {
  formatExactP, formatFixed, formatNoLeadingZero, formatPValue, formatScientificFromLog10, formatSigned,
} from '../../../src/core/report/formatNumber';

// Reporting conventions (no leading zero for p and V, "p < .001", two or three decimals for p) are
// common practice in scientific reporting; the checks below pin our reading of them.
describe('formatNumber', () => {
  it('writes p without a leading zero, three decimals below .1 and two above', () => {
    assert.equal(formatPValue(0.0104), 'p = .010');
    assert.equal(formatPValue(0.0496), 'p = .050');
    assert.equal(formatPValue(0.43), 'p = .43');
    assert.equal(formatPValue(0.1), 'p = .10');
  });

  it('writes p below .001 as an inequality and p that rounds to 1 as p > .99', () => {
    assert.equal(formatPValue(0.000999), 'p < .001');
    assert.equal(formatPValue(0), 'p < .001');
    assert.equal(formatPValue(0.998), 'p > .99');
  });

  it('never prints NaN', () => {
    for (const text of [formatPValue(NaN), formatFixed(NaN, 2), formatSigned(Infinity, 2), formatExactP(NaN, NaN)]) {
      assert.ok(!text.includes('NaN'), text);
    }
  });

  it('uses a true minus sign and drops the sign of a value that rounds to zero', () => {
    assert.equal(formatFixed(-2.071, 2), '−2.07');
    assert.equal(formatFixed(-0.001, 2), '0.00');
    assert.equal(formatSigned(3.414, 2), '+3.41');
    assert.equal(formatNoLeadingZero(-0.054, 2), '−.05');
    assert.equal(formatNoLeadingZero(1, 2), '1.00');
  });

  it('writes tiny p from its log10, even below the smallest double', () => {
    assert.equal(formatScientificFromLog10(Math.log10(3.2e-8)), '3.2 × 10⁻⁸');
    assert.equal(formatScientificFromLog10(-1088.25), '5.6 × 10⁻¹⁰⁸⁹');
    assert.equal(formatScientificFromLog10(Math.log10(9.96e-5)), '1.0 × 10⁻⁴');
    assert.equal(formatExactP(0.01234, Math.log10(0.01234)), '.0123');
  });
});
