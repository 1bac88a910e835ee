import { describe, expect, it } from 'vitest';
import { estimateText, intervalText, percentText } from '../../src-renderer/src/lib/percent.js';

describe('proportions written for people', () => {
  it('writes a fraction in percent with the sign', () => {
    expect(percentText(0.01)).toBe('1 %');
    expect(percentText(0.065823)).toBe('6.58 %');
    expect(percentText(0.5)).toBe('50 %');
    expect(percentText(1)).toBe('100 %');
    expect(percentText(0)).toBe('0 %');
  });

  it('never writes a tiny share as 0 % nor a share just below one as 100 %', () => {
    expect(percentText(0.0001)).toBe('0.01 %');
    expect(percentText(0.0000123)).toBe('0.0012 %');
    expect(percentText(0.99996)).toBe('99.99 %');
  });

  it('writes a dash for what does not exist', () => {
    expect(percentText(null)).toBe('–');
    expect(percentText(Number.NaN)).toBe('–');
  });

  it('writes a fraction nonconforming in percent and a rate per unit as it is', () => {
    expect(estimateText(0.09503, 'fraction nonconforming')).toBe('9.5 % nonconforming');
    expect(estimateText(0.25, 'nonconformities per item')).toBe('0.25 nonconformities per item');
  });
});

describe('intervals written for people', () => {
  it('writes both ends of a fraction interval in percent and a rate interval with its unit once', () => {
    expect(intervalText(0, 0.06582, 'fraction nonconforming')).toBe('0 % to 6.58 %');
    expect(intervalText(0.01, 0.25, 'nonconformities per item')).toBe('0.01 to 0.25 nonconformities per item');
  });
});
