import { describe, expect, it } from 'vitest';
import { countOf, ruleText } from '../../src-renderer/src/lib/words.js';

describe('wording rules of the places', () => {
  it('puts the noun of a count in the right number', () => {
    expect(countOf(1, 'items')).toBe('1 item');
    expect(countOf(0, 'items')).toBe('0 items');
    expect(countOf(2, 'readings')).toBe('2 readings');
    expect(countOf(1, 'measurements')).toBe('1 measurement');
  });

  it('writes a rule with the proper signs instead of ASCII stand-ins', () => {
    expect(ruleText('accept: count 0 <= acceptance number 0 at n = 6')).toBe('accept: count 0 ≤ acceptance number 0 at n = 6');
    expect(ruleText('reject: count 3 >= rejection number 3 at n = 12')).toBe('reject: count 3 ≥ rejection number 3 at n = 12');
  });
});
