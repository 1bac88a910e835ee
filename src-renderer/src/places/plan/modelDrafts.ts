/**
 * The typed inputs of the three models whose quality is not a fraction or a rate (measurements,
 * time to failure, graded items), kept as text, and how each reads as a plan. Ranges (mu0 ≠ mu1,
 * theta1 < theta0, shares that are probabilities) are the engine's to judge, except the class
 * shares summing to 100 %, which is said here in the engineer's words before the engine is asked.
 */
import type { GradedSpec, LifetimeSpec, MeasurementSpec } from '../../../../src-main/engine/index';
import { parseDecimal } from '../../lib/decimalText';

export interface MeasurementTexts {
  mu0: string;
  mu1: string;
  sigma: string;
  unit: string;
  overshootCorrection: boolean;
}

export interface LifetimeTexts {
  theta0: string;
  theta1: string;
  maxTime: string;
  maxFailures: string;
}

export interface GradeRow {
  name: string;
  /** Share of items in this class at acceptable quality, percent. */
  p0: string;
  /** Share at rejectable quality, percent. */
  p1: string;
}

export const minimumClasses = 2;
export const maximumClasses = 5;

export type ModelField = 'mu0' | 'mu1' | 'sigma' | 'theta0' | 'theta1' | 'maxTime' | 'maxFailures' | 'classes';

type Risks = { alpha: number; beta: number; truncation: number | null };
export type ModelReading<Spec> = { ok: true; spec: Spec } | { ok: false; field: ModelField; message: string };

function numbers<Key extends string>(fields: [Key, string, string][]): { ok: true; values: Record<Key, number> } | { ok: false; field: Key; message: string } {
  const values = {} as Record<Key, number>;
  for (const [field, text, message] of fields) {
    const value = parseDecimal(text);
    if (value === null) return { ok: false, field, message };
    values[field] = value;
  }
  return { ok: true, values };
}

export function readMeasurement(texts: MeasurementTexts, risks: Risks): ModelReading<MeasurementSpec> {
  const read = numbers<'mu0' | 'mu1' | 'sigma'>([
    ['mu0', texts.mu0, 'The acceptable mean μ0 must be a number in the measurement unit, e.g. 10.00.'],
    ['mu1', texts.mu1, 'The rejectable mean μ1 must be a number in the measurement unit, e.g. 10.05.'],
    ['sigma', texts.sigma, 'The standard deviation σ must be a number above 0 in the measurement unit, e.g. 0.04.'],
  ]);
  if (!read.ok) return read;
  const unit = texts.unit.trim();
  return {
    ok: true,
    spec: {
      model: 'measurement',
      ...read.values,
      ...risks,
      overshootCorrection: texts.overshootCorrection,
      ...(unit === '' ? {} : { unit }),
    },
  };
}

/** A whole number of 1 or more, null for an empty text, undefined when it is neither. */
function optionalWhole(text: string): number | null | undefined {
  if (text.trim() === '') return null;
  const value = parseDecimal(text);
  return value !== null && Number.isInteger(value) && value >= 1 ? value : undefined;
}

export function readLifetime(texts: LifetimeTexts, risks: Omit<Risks, 'truncation'>): ModelReading<LifetimeSpec> {
  const read = numbers<'theta0' | 'theta1'>([
    ['theta0', texts.theta0, 'The acceptable MTBF θ0 must be a number of hours, e.g. 1000.'],
    ['theta1', texts.theta1, 'The rejectable MTBF θ1 must be a number of hours below θ0, e.g. 500.'],
  ]);
  if (!read.ok) return read;
  let maxTime: number | null = null;
  if (texts.maxTime.trim() !== '') {
    const value = parseDecimal(texts.maxTime);
    if (value === null || value <= 0) return { ok: false, field: 'maxTime', message: 'The maximum test time must be a number of hours above 0, or empty for none.' };
    maxTime = value;
  }
  const maxFailures = optionalWhole(texts.maxFailures);
  if (maxFailures === undefined) return { ok: false, field: 'maxFailures', message: 'The maximum number of failures must be a whole number, 1 or more, or empty for none.' };
  return { ok: true, spec: { model: 'lifetime', ...read.values, ...risks, maxTime, maxFailures, unit: 'hours' } };
}

/** The two shares summed, for the table's foot. */
export function shareSums(rows: readonly GradeRow[]): [number | null, number | null] {
  const sum = (key: 'p0' | 'p1') =>
    rows.reduce<number | null>((total, row) => {
      const value = parseDecimal(row[key]);
      return total === null || value === null ? null : total + value;
    }, 0);
  return [sum('p0'), sum('p1')];
}

const sumsTo100 = (sum: number) => Math.abs(sum - 100) <= 1e-6;

export function readGraded(rows: readonly GradeRow[], risks: Risks): ModelReading<GradedSpec> {
  const names = rows.map((row) => row.name.trim());
  if (names.some((name) => name === '')) return { ok: false, field: 'classes', message: 'Every class needs a name, e.g. conforming, minor, major.' };
  if (new Set(names).size !== names.length) return { ok: false, field: 'classes', message: 'Two classes have the same name; give each its own.' };
  const p0: number[] = [];
  const p1: number[] = [];
  for (const row of rows) {
    const at0 = parseDecimal(row.p0);
    const at1 = parseDecimal(row.p1);
    if (at0 === null || at1 === null) {
      return { ok: false, field: 'classes', message: `The shares of “${row.name.trim()}” must be numbers in percent, e.g. 4.5.` };
    }
    p0.push(at0 / 100);
    p1.push(at1 / 100);
  }
  const [sum0, sum1] = shareSums(rows);
  if (sum0 !== null && !sumsTo100(sum0)) {
    return { ok: false, field: 'classes', message: `The shares at acceptable quality add up to ${Number(sum0.toPrecision(6))} %; they must add up to 100 %.` };
  }
  if (sum1 !== null && !sumsTo100(sum1)) {
    return { ok: false, field: 'classes', message: `The shares at rejectable quality add up to ${Number(sum1.toPrecision(6))} %; they must add up to 100 %.` };
  }
  return { ok: true, spec: { model: 'graded', classes: names, p0, p1, ...risks } };
}
