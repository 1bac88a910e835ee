import { countNoun, countOf } from '../../countWords.js';
import type { CountSpec } from '../../spec.js';
import { poissonDraw } from '../../distributions/poisson.js';
import { linearCountFlags } from '../linearCountFlags.js';
import { linearCountModel } from '../linearCountModel.js';

/** The nonconformities counted on one unit. */
export type CountObservation = number;

/**
 * Nonconformities per unit: the cumulative count is the number of nonconformities.
 *
 * Method: z = x ln(lambda1/lambda0) - (lambda1 - lambda0) per unit (countDefinition).
 * References: Wald, A. (1947), Sequential Analysis, ch. 5 (Poisson case).
 */
export const countModel = linearCountModel<CountSpec, CountObservation>('count', {
  labels: { title: 'count', quality: 'lambda', hypotheses: ['lambda0', 'lambda1'], entry: ['unit', 'units'], pooledRate: 'nonconformities per item' },
  problem: (result) =>
    typeof result === 'number' && Number.isInteger(result) && result >= 0
      ? null
      : `a count plan takes a whole number of nonconformities (0 or more), not ${JSON.stringify(result)}`,
  count: (result) => result,
  draw: poissonDraw,
  parseText: (text) =>
    /^\d+$/.test(text) && Number.isSafeInteger(Number(text))
      ? { result: Number(text) }
      : { problem: `${JSON.stringify(text)} is not a whole number of nonconformities (0 or more)` },
  qualities: (spec) => `lambda0 = ${spec.lambda0}, lambda1 = ${spec.lambda1}`,
  countCanExceedItems: true,
  flags: linearCountFlags<CountSpec>(
    'count',
    [{ name: 'lambda0', kind: 'positive' }, { name: 'lambda1', kind: 'positive' }],
    '  --lambda0 L --lambda1 L    count: acceptable and rejectable nonconformities per unit, 0 < lambda0 < lambda1',
  ),
  record: {
    modelLine: 'count (nonconformities per item; Poisson SPRT)',
    qualityUnit: 'nonconformities per item',
    counted: 'nonconformities',
    countedNoun: (total) => countNoun(total, 'nonconformity', 'nonconformities'),
    countUnit: 'count',
    resultText: (result) => countOf(result, 'nonconformity', 'nonconformities'),
  },
});
