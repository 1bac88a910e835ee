import { describe, expect, it } from 'vitest';
import { createDispatcher } from '../../src-main/api/dispatcher.js';
import { createHandlers } from '../../src-main/api/handlers/index.js';
import { ChannelFailure } from '../../src-main/api/result.js';

const dispatch = createDispatcher(createHandlers({ dataDirectory: '/nonexistent-tallyline-test' }));
const nistExample = { model: 'passfail', p0: 0.01, p1: 0.1, alpha: 0.05, beta: 0.1 };

describe('the channel dispatcher', () => {
  it('answers plan.limits with the NIST/SEMATECH e-Handbook §6.2.6 limits (h1 0.939, h2 1.205, s 0.0397; NIST/SEMATECH e-Handbook §6.2.6 (first-hand))', async () => {
    const result = await dispatch('plan.limits', nistExample);
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    const { boundaries } = result.value as { boundaries: { h1: number; h2: number; slope: number } };
    expect(boundaries.h1).toBeCloseTo(0.939, 3);
    expect(boundaries.h2).toBeCloseTo(1.205, 3);
    expect(boundaries.slope).toBeCloseTo(0.0397, 4);
  });

  it('refuses a channel that is not in the contract, naming it', async () => {
    const result = await dispatch('plan.delete-everything', {});
    expect(result).toMatchObject({ ok: false, code: 'unknown-channel' });
    expect(!result.ok && result.message).toContain('plan.delete-everything');
  });

  it('refuses a payload that does not match the schema and names the field', async () => {
    const result = await dispatch('plan.limits', { ...nistExample, p0: 'one percent' });
    expect(result).toMatchObject({ ok: false, code: 'invalid-payload', field: 'p0' });
  });

  it('turns the engine parameter error into invalid-parameter with the parameter as field', async () => {
    const result = await dispatch('plan.limits', { ...nistExample, alpha: 0.6, beta: 0.5 });
    expect(result).toMatchObject({ ok: false, code: 'invalid-parameter' });
    expect(!result.ok && result.message).toMatch(/alpha \+ beta/);
  });

  it('passes a deliberate ChannelFailure through with its code and field', async () => {
    const failing = createDispatcher({
      ...createHandlers({ dataDirectory: '/nonexistent' }),
      'plan.limits': () => {
        throw new ChannelFailure('not-found', 'No plan 7.', 'planId');
      },
    });
    expect(await failing('plan.limits', nistExample)).toEqual({ ok: false, code: 'not-found', message: 'No plan 7.', field: 'planId' });
  });
});
