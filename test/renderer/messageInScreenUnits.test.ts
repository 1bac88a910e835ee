import { describe, expect, it } from 'vitest';
import { messageInScreenUnits } from '../../src-renderer/src/places/plan/messageInScreenUnits.js';

describe('engine messages in the Plan place units', () => {
  it('states pass/fail qualities in percent, as they were typed', () => {
    expect(messageInScreenUnits('p1 must be greater than p0 (got p0 = 0.01, p1 = 0.005)', 'passfail')).toBe(
      'p1 must be greater than p0 (got p0 = 1 %, p1 = 0.5 %)',
    );
  });

  it('states the risks in percent for every model', () => {
    expect(messageInScreenUnits('alpha + beta must be less than 1 (got alpha = 0.6, beta = 0.5)', 'count')).toBe(
      'alpha + beta must be less than 100 % (got alpha = 60 %, beta = 50 %)',
    );
    expect(messageInScreenUnits('alpha must be a number in (0, 1) (got 0)', 'measurement')).toBe('alpha must be above 0 % and below 100 % (got 0 %)');
  });

  it('answers a value out of range in the percent that was typed', () => {
    // p1 typed as 100 (%) reaches the engine as 1; p0 typed as -1 (%) as -0.01.
    expect(messageInScreenUnits('p1 must be a number in (0, 1) (got 1)', 'passfail')).toBe('p1 must be above 0 % and below 100 % (got 100 %)');
    expect(messageInScreenUnits('p0 must be a number in (0, 1) (got -0.01)', 'passfail')).toBe('p0 must be above 0 % and below 100 % (got -1 %)');
  });

  it('leaves rates of the count model as they are', () => {
    expect(messageInScreenUnits('lambda1 must be greater than lambda0 (got lambda0 = 0.5, lambda1 = 0.2)', 'count')).toBe(
      'lambda1 must be greater than lambda0 (got lambda0 = 0.5, lambda1 = 0.2)',
    );
  });
});
