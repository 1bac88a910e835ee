import { describe, expect, it } from 'vitest';
import { referenceSets } from './referenceValues.js';

// Each held value must be what the independent generator gives, rounded to the decimals it is written
// with: the difference may be at most half a unit in the last written place, either way.
describe('the check values the engine tests hold are re-derived by the reference generator', () => {
  for (const set of referenceSets) {
    describe(`${set.name} (${set.source})`, () => {
      it.each(set.values.map((value) => [value.label, value] as const))('%s', (_label, value) => {
        const computed = value.compute();
        const halfUnit = 0.5 * 10 ** -value.decimals;
        expect(Math.abs(computed - value.held)).toBeLessThanOrEqual(halfUnit * (1 + 1e-9));
      });
    });
  }
});
