import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { isSha256Hex, isUtcOffset, isUtcTime } from '../../src-main/store/journal/format.js';

// The entry's text shapes are checked character by character on the reload path; the regular
// expressions they replace are the independent oracle here (the journal format's own definition).
const utcTime = /^\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d\.\d{3}Z$/;
const utcOffset = /^[+-]\d\d:\d\d$/;
const sha256Hex = /^[0-9a-f]{64}$/;

/** Strings near each shape: the valid form with characters swapped for digits, letters, signs, separators, non-ASCII digits. */
function nearShape(template: string): fc.Arbitrary<string> {
  const alphabet = fc.constantFrom(...'0123456789abcdefABCDEF+-:.TZz ±٣'.split(''), '\n');
  return fc
    .tuple(fc.array(fc.tuple(fc.nat(template.length), alphabet), { maxLength: 3 }), fc.integer({ min: -1, max: 1 }))
    .map(([changes, lengthChange]) => {
      const characters = template.split('');
      for (const [index, character] of changes) characters[Math.min(index, characters.length - 1)] = character;
      if (lengthChange < 0) characters.pop();
      if (lengthChange > 0) characters.push('0');
      return characters.join('');
    });
}

describe('the journal entry shape checks', () => {
  it('isUtcTime accepts exactly what the UTC time pattern accepts', () => {
    fc.assert(fc.property(fc.oneof(nearShape('2026-12-05T09:14:03.120Z'), fc.string()), (text) => isUtcTime(text) === utcTime.test(text)), { numRuns: 5000 });
    expect(isUtcTime('2026-12-05T09:14:03.120Z')).toBe(true);
  });

  it('isUtcOffset accepts exactly what the offset pattern accepts', () => {
    fc.assert(fc.property(fc.oneof(nearShape('+01:00'), nearShape('-05:30'), fc.string()), (text) => isUtcOffset(text) === utcOffset.test(text)), { numRuns: 5000 });
    expect([isUtcOffset('+01:00'), isUtcOffset('-05:30'), isUtcOffset('01:00')]).toEqual([true, true, false]);
  });

  it('isSha256Hex accepts exactly lower-case hex of 64 characters', () => {
    const hex = '0123456789abcdef'.repeat(4);
    fc.assert(fc.property(fc.oneof(nearShape(hex), fc.string()), (text) => isSha256Hex(text) === sha256Hex.test(text)), { numRuns: 5000 });
    expect([isSha256Hex(hex), isSha256Hex(hex.toUpperCase())]).toEqual([true, false]);
  });
});
