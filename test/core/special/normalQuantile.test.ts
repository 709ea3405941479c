import assert from 'node:assert/strict';
import { normalQuantile } from '../../../src/core/special/normalQuantile';
import { normalUpperTail } from '../../../src/core/special/normalUpperTail';
import { assertClose } from '../../helpers/assertClose';
import { readMpmathFixture } from './mpmathFixture';

const fixture = readMpmathFixture<{ p: number }, string>('normalQuantile');

describe('normalQuantile', () => {
  it('matches mpmath to 1e-13 relative from p = 1e-300 to 1 − 1e-10', () => {
    for (const c of fixture.cases) assertClose(normalQuantile(c.input.p), Number(c.expected), c.tolerance, c.input);
  });

  it('inverts the normal upper tail', () => {
    for (const p of [1e-200, 1e-9, 0.003, 0.2, 0.5]) assertClose(normalUpperTail(-normalQuantile(p)), p, 1e-13, { p });
  });

  it('gives ±Infinity at 0 and 1 and NaN outside [0, 1]', () => {
    assert.equal(normalQuantile(0), -Infinity);
    assert.equal(normalQuantile(1), Infinity);
    assert.ok(Number.isNaN(normalQuantile(1.2)));
    assert.ok(Number.isNaN(normalQuantile(-0.1)));
  });
});
