import type { PassFailSpec } from '../../spec.js';
import { linearCountModel } from '../linearCountModel.js';

/** A pass/fail item's result: 'fail' for a nonconforming item. */
export type PassFailObservation = 'pass' | 'fail';

/**
 * Pass/fail items: the cumulative count is the number of nonconforming items.
 *
 * Method: z = x ln(p1/p0) + (1-x) ln((1-p1)/(1-p0)) per item (passFailDefinition).
 * References: Wald, A. (1947), Sequential Analysis, ch. 5; NIST/SEMATECH e-Handbook §6.2.6.
 */
export const passFailModel = linearCountModel<PassFailSpec, PassFailObservation>('passfail', {
  labels: { title: 'pass/fail', quality: 'p', hypotheses: ['p0', 'p1'], entry: ['item', 'items'] },
  problem: (result) => (result === 'pass' || result === 'fail' ? null : `a passfail plan takes "pass" or "fail", not ${JSON.stringify(result)}`),
  count: (result) => (result === 'fail' ? 1 : 0),
  record: {
    modelLine: 'passfail (each item conforming or nonconforming; binomial SPRT)',
    qualityUnit: 'fraction nonconforming',
    counted: 'nonconforming',
    countedNoun: () => 'nonconforming',
    countUnit: 'items',
    resultText: (result) => (result === 'fail' ? 'nonconforming' : 'conforming'),
  },
});
