/**
 * How quality is written for each data model: pass/fail as percent nonconforming, counts as
 * nonconformities per unit or per 100 units. The engine always takes fractions and rates per unit.
 */
import { percentText } from '../../lib/percent';
import type { PlanSpec } from '../../../../src-main/engine/index';

export type ModelName = PlanSpec['model'];
export type CountUnit = 'perUnit' | 'per100';

export interface QualityScale {
  /** Shown after a quality input. */
  unit: string;
  /** Short form for sentences and table headers. */
  short: string;
  /** Displayed value = engine value x factor. */
  factor: number;
  /** Axis title for charts over quality. */
  axisTitle: string;
  /** Symbols of the two quality levels. */
  symbols: [string, string];
}

export function qualityScale(model: ModelName, countUnit: CountUnit): QualityScale {
  if (model === 'passfail') {
    return { unit: '% nonconforming', short: '%', factor: 100, axisTitle: 'Quality (% nonconforming)', symbols: ['p0', 'p1'] };
  }
  if (model !== 'count') {
    // Measurements, times and grades are written in their own units by their own inputs.
    return { unit: '', short: '', factor: 1, axisTitle: 'Quality', symbols: ['H0', 'H1'] };
  }
  if (countUnit === 'per100') {
    return {
      unit: 'nonconformities per 100 units',
      short: 'per 100 units',
      factor: 100,
      axisTitle: 'Quality (nonconformities per 100 units)',
      symbols: ['λ0', 'λ1'],
    };
  }
  return { unit: 'nonconformities per unit', short: 'per unit', factor: 1, axisTitle: 'Quality (nonconformities per unit)', symbols: ['λ0', 'λ1'] };
}

/** A quality level in the practitioner's unit, with sensible digits. */
export function qualityText(value: number, scale: QualityScale): string {
  if (scale.short === '%') return percentText(value);
  const shown = value * scale.factor;
  const digits = shown >= 10 ? 1 : shown >= 1 ? 2 : 3;
  const text = Number(shown.toFixed(digits)).toString();
  return scale.short === '%' ? `${text} %` : `${text} ${scale.short}`;
}
