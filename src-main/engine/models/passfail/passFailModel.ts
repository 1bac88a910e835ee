import type { PassFailSpec } from '../../spec.js';
import { linearCountFlags } from '../linearCountFlags.js';
import { linearCountModel } from '../linearCountModel.js';

const PASS_FAIL_WORDS: Readonly<Record<string, PassFailObservation>> = { pass: 'pass', fail: 'fail', '0': 'pass', '1': 'fail' };

/** A pass/fail item's result: 'fail' for a nonconforming item. */
export type PassFailObservation = 'pass' | 'fail';

/**
 * Pass/fail items: the cumulative count is the number of nonconforming items.
 *
 * Method: z = x ln(p1/p0) + (1-x) ln((1-p1)/(1-p0)) per item (passFailDefinition).
 * References: Wald, A. (1947), Sequential Analysis, ch. 5; NIST/SEMATECH e-Handbook §6.2.6.
 */
export const passFailModel = linearCountModel<PassFailSpec, PassFailObservation>('passfail', {
  labels: { title: 'pass/fail', quality: 'p', hypotheses: ['p0', 'p1'], entry: ['item', 'items'], pooledRate: 'fraction nonconforming' },
  problem: (result) => (result === 'pass' || result === 'fail' ? null : `a passfail plan takes "pass" or "fail", not ${JSON.stringify(result)}`),
  count: (result) => (result === 'fail' ? 1 : 0),
  draw: (quality, uniform) => (uniform() < quality ? 'fail' : 'pass'),
  parseText(text) {
    const result = Object.hasOwn(PASS_FAIL_WORDS, text.toLowerCase()) ? PASS_FAIL_WORDS[text.toLowerCase()] : undefined;
    return result === undefined ? { problem: `${JSON.stringify(text)} is not pass, fail, 0 or 1` } : { result };
  },
  qualities: (spec) => `p0 = ${spec.p0}, p1 = ${spec.p1}`,
  countCanExceedItems: false,
  flags: linearCountFlags<PassFailSpec>(
    'passfail',
    [{ name: 'p0', kind: 'probabilities' }, { name: 'p1', kind: 'probabilities' }],
    '  --p0 P --p1 P              passfail: acceptable and rejectable fraction nonconforming, 0 < p0 < p1 < 1',
  ),
  record: {
    modelLine: 'passfail (each item conforming or nonconforming; binomial SPRT)',
    qualityUnit: 'fraction nonconforming',
    counted: 'nonconforming',
    countedNoun: () => 'nonconforming',
    countUnit: 'items',
    resultText: (result) => (result === 'fail' ? 'nonconforming' : 'conforming'),
  },
});
