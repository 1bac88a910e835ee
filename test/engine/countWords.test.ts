import { describe, expect, it } from 'vitest';
import { countNoun, countOf } from '../../src-main/engine/index.js';

describe('count words', () => {
  it('countOf says "1 failure" for one and "0 failures" or "2 failures" otherwise', () => {
    expect(countOf(1, 'failure')).toBe('1 failure');
    expect(countOf(0, 'failure')).toBe('0 failures');
    expect(countOf(2, 'item')).toBe('2 items');
  });

  it('countNoun takes an irregular plural when given', () => {
    expect(countNoun(1, 'nonconformity', 'nonconformities')).toBe('nonconformity');
    expect(countNoun(3, 'nonconformity', 'nonconformities')).toBe('nonconformities');
  });
});
