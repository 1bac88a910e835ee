import { PlanParameterError, formatValue } from './errors.js';

/** Largest truncation in items: the limits table and the exact curves grow with it (README "Limits"). */
export const MAX_TRUNCATION = 100_000;

/** Throws unless `value` is a finite number strictly between 0 and 1. */
export function checkProbability(parameter: string, value: unknown): asserts value is number {
  if (typeof value !== 'number' || !Number.isFinite(value) || value <= 0 || value >= 1) {
    throw new PlanParameterError(parameter, value, 'a number in (0, 1)');
  }
}

/** Throws unless `value` is a finite number greater than 0. */
export function checkPositive(parameter: string, value: unknown): asserts value is number {
  if (typeof value !== 'number' || !Number.isFinite(value) || value <= 0) {
    throw new PlanParameterError(parameter, value, 'a number greater than 0');
  }
}

/** The two qualities must be ordered: the rejectable one strictly worse than the acceptable one. */
export function checkOrdered(lowName: string, low: number, highName: string, high: number): void {
  if (!(high > low)) {
    throw new PlanParameterError(
      highName,
      high,
      `greater than ${lowName}`,
      `${highName} must be greater than ${lowName} (got ${lowName} = ${low}, ${highName} = ${high})`,
    );
  }
}

/** The common risk and truncation checks shared by every model. */
export function checkRisksAndTruncation(spec: {
  alpha: unknown;
  beta: unknown;
  truncation?: unknown;
  fit?: unknown;
}): void {
  checkProbability('alpha', spec.alpha);
  checkProbability('beta', spec.beta);
  if (spec.alpha + spec.beta >= 1) {
    throw new PlanParameterError(
      'beta',
      spec.beta,
      'such that alpha + beta < 1',
      `alpha + beta must be less than 1 (got alpha = ${spec.alpha}, beta = ${spec.beta})`,
    );
  }
  const truncation = spec.truncation;
  if (truncation !== undefined && truncation !== null) {
    if (typeof truncation !== 'number' || !Number.isInteger(truncation) || truncation < 1 || truncation > MAX_TRUNCATION) {
      throw new PlanParameterError('truncation', truncation, `an integer from 1 to ${MAX_TRUNCATION} or none`);
    }
  }
  if (spec.fit !== undefined && spec.fit !== 'wald' && spec.fit !== 'exact') {
    throw new PlanParameterError('fit', spec.fit, '"wald" or "exact"');
  }
}

/** Throws unless `value` is an integer >= min. */
export function checkInteger(parameter: string, value: unknown, min: number): asserts value is number {
  if (typeof value !== 'number' || !Number.isInteger(value) || value < min) {
    throw new PlanParameterError(parameter, value, `an integer >= ${min}`);
  }
}

export { formatValue };
