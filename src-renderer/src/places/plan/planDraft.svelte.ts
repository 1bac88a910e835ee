/**
 * What the engineer has typed on the Plan place, kept as text so nothing typed is ever lost, and
 * the plan it stands for once every field reads as a number. Ranges (p0 < p1, alpha + beta < 1)
 * are the engine's to judge; this only reads the units.
 */
import type { PlanSpec } from '../../../../src-main/engine/index';
import { decimalText, parseDecimal } from '../../lib/decimalText';
import { readGraded, readLifetime, readMeasurement, type GradeRow, type LifetimeTexts, type MeasurementTexts, type ModelField } from './modelDrafts';
import { qualityScale, type CountUnit, type ModelName } from './qualityScale';

export type DraftField = 'acceptable' | 'rejectable' | 'producerRisk' | 'consumerRisk' | 'truncation' | ModelField;
export type TruncationMode = 'none' | 'fixed' | 'suggested';
export type FitMode = 'wald' | 'exact';

/** A plan the engine may be asked about, or the first field that is not yet a number. */
export type DraftReading =
  | { ok: true; spec: PlanSpec; suggestTruncation: boolean }
  | { ok: false; field: DraftField; message: string };

/** Which input an engine parameter name belongs to. */
export const fieldOfParameter: Record<string, DraftField> = {
  p0: 'acceptable',
  lambda0: 'acceptable',
  p1: 'rejectable',
  lambda1: 'rejectable',
  alpha: 'producerRisk',
  beta: 'consumerRisk',
  truncation: 'truncation',
  mu0: 'mu0',
  mu1: 'mu1',
  sigma: 'sigma',
  theta0: 'theta0',
  theta1: 'theta1',
  maxTime: 'maxTime',
  maxFailures: 'maxFailures',
  classes: 'classes',
};

/** The graded model's parameters are all about its table of classes. */
export function fieldOfProblem(model: ModelName, parameter: string): DraftField {
  if (model === 'graded' && ['p0', 'p1', 'classes'].includes(parameter)) return 'classes';
  return fieldOfParameter[parameter] ?? (parameter as DraftField);
}

/** The typed form as plain data, as kept between visits and reloads. */
export interface PlanDraftTexts {
  name: string;
  model: ModelName;
  countUnit: CountUnit;
  quality: { passfail: { acceptable: string; rejectable: string }; count: { acceptable: string; rejectable: string } };
  measurement: MeasurementTexts;
  lifetime: LifetimeTexts;
  grades: GradeRow[];
  producerRisk: string;
  consumerRisk: string;
  truncationMode: TruncationMode;
  truncationItems: string;
  fit: FitMode;
}

export class PlanDraft {
  /** The name the plan is saved under. */
  name = $state('');
  model = $state<ModelName>('passfail');
  countUnit = $state<CountUnit>('perUnit');
  /** Quality texts per model, so switching the model and back keeps both. */
  quality = $state({ passfail: { acceptable: '1', rejectable: '10' }, count: { acceptable: '0.5', rejectable: '2' } });
  measurement = $state<MeasurementTexts>({ mu0: '10', mu1: '10.05', sigma: '0.04', unit: 'mm', overshootCorrection: false });
  lifetime = $state<LifetimeTexts>({ theta0: '1000', theta1: '500', maxTime: '', maxFailures: '' });
  grades = $state<GradeRow[]>([
    { name: 'conforming', p0: '95', p1: '85' },
    { name: 'minor', p0: '4', p1: '10' },
    { name: 'major', p0: '1', p1: '5' },
  ]);
  producerRisk = $state('5');
  consumerRisk = $state('10');
  truncationMode = $state<TruncationMode>('none');
  truncationItems = $state('');
  fit = $state<FitMode>('wald');

  readonly scale = $derived(qualityScale(this.model, this.countUnit));

  /** Everything typed, as plain data (reading it tracks every field). */
  snapshot(): PlanDraftTexts {
    return {
      name: this.name,
      model: this.model,
      countUnit: this.countUnit,
      quality: $state.snapshot(this.quality),
      measurement: $state.snapshot(this.measurement),
      lifetime: $state.snapshot(this.lifetime),
      grades: $state.snapshot(this.grades),
      producerRisk: this.producerRisk,
      consumerRisk: this.consumerRisk,
      truncationMode: this.truncationMode,
      truncationItems: this.truncationItems,
      fit: this.fit,
    };
  }

  /** Puts back what `snapshot` took. */
  restore(texts: PlanDraftTexts): void {
    Object.assign(this, texts);
  }
  readonly reading: DraftReading = $derived(this.read());

  /** Changes the count unit and rewrites the typed rates so they keep their meaning. */
  setCountUnit(unit: CountUnit): void {
    if (unit === this.countUnit) return;
    const ratio = qualityScale('count', unit).factor / qualityScale('count', this.countUnit).factor;
    for (const key of ['acceptable', 'rejectable'] as const) {
      const value = parseDecimal(this.quality.count[key]);
      if (value !== null) this.quality.count[key] = decimalText(value * ratio);
    }
    this.countUnit = unit;
  }

  /** Fills the form from a saved or imported plan. */
  load(spec: PlanSpec, name: string): void {
    this.name = name;
    this.model = spec.model;
    this.producerRisk = decimalText(spec.alpha * 100);
    this.consumerRisk = decimalText(spec.beta * 100);
    if (spec.model === 'lifetime') {
      const optional = (value: number | null | undefined) => (value === null || value === undefined ? '' : decimalText(value));
      this.lifetime = { theta0: decimalText(spec.theta0), theta1: decimalText(spec.theta1), maxTime: optional(spec.maxTime), maxFailures: optional(spec.maxFailures) };
      return;
    }
    this.truncationMode = spec.truncation ? 'fixed' : 'none';
    this.truncationItems = spec.truncation ? String(spec.truncation) : '';
    if (spec.model === 'measurement') {
      this.measurement = {
        mu0: decimalText(spec.mu0),
        mu1: decimalText(spec.mu1),
        sigma: decimalText(spec.sigma),
        unit: spec.unit ?? '',
        overshootCorrection: spec.overshootCorrection ?? false,
      };
    } else if (spec.model === 'graded') {
      this.grades = spec.classes.map((className, k) => ({ name: className, p0: decimalText(spec.p0[k] * 100), p1: decimalText(spec.p1[k] * 100) }));
    } else {
      const scale = qualityScale(spec.model, this.countUnit);
      const [low, high] = spec.model === 'passfail' ? [spec.p0, spec.p1] : [spec.lambda0, spec.lambda1];
      this.quality[spec.model] = { acceptable: decimalText(low * scale.factor), rejectable: decimalText(high * scale.factor) };
      this.fit = spec.fit ?? 'wald';
    }
  }

  /** The plan of one of the models read by `modelDrafts`, once the risks and truncation are numbers. */
  private readExtended(risks: { alpha: number; beta: number }, truncation: number | null): DraftReading {
    const reading =
      this.model === 'measurement'
        ? readMeasurement(this.measurement, { ...risks, truncation })
        : this.model === 'lifetime'
          ? readLifetime(this.lifetime, risks)
          : readGraded(this.grades, { ...risks, truncation });
    return reading.ok ? { ok: true, spec: reading.spec, suggestTruncation: false } : reading;
  }

  private read(): DraftReading {
    const scale = this.scale;
    const model = this.model;
    const linear = model === 'passfail' || model === 'count';
    const unitHint = model === 'passfail' ? 'in percent, e.g. 1.5' : `as nonconformities ${scale.short}, e.g. 0.5`;
    const numbers: Partial<Record<DraftField, number>> = {};
    const fields: [DraftField, string, string][] = [
      ['producerRisk', this.producerRisk, "Producer's risk α must be a number in percent, e.g. 5."],
      ['consumerRisk', this.consumerRisk, "Consumer's risk β must be a number in percent, e.g. 10."],
    ];
    if (linear) {
      const texts = this.quality[model];
      fields.unshift(
        ['acceptable', texts.acceptable, `Acceptable quality ${scale.symbols[0]} must be a number ${unitHint}.`],
        ['rejectable', texts.rejectable, `Rejectable quality ${scale.symbols[1]} must be a number ${unitHint}.`],
      );
    }
    for (const [field, text, message] of fields) {
      const value = parseDecimal(text);
      if (value === null) return { ok: false, field, message };
      numbers[field] = value;
    }
    let truncation: number | null = null;
    if (this.truncationMode === 'fixed' && model !== 'lifetime') {
      const items = parseDecimal(this.truncationItems);
      if (items === null || !Number.isInteger(items) || items < 1) {
        return { ok: false, field: 'truncation', message: 'Truncation must be a whole number of items, 1 or more (or choose no truncation).' };
      }
      truncation = items;
    }
    const risks = { alpha: numbers.producerRisk! / 100, beta: numbers.consumerRisk! / 100 };
    if (!linear) return this.readExtended(risks, truncation);
    const low = numbers.acceptable! / scale.factor;
    const high = numbers.rejectable! / scale.factor;
    const common = { ...risks, truncation, fit: this.fit };
    const spec: PlanSpec =
      model === 'passfail' ? { model: 'passfail', p0: low, p1: high, ...common } : { model: 'count', lambda0: low, lambda1: high, ...common };
    return { ok: true, spec, suggestTruncation: this.truncationMode === 'suggested' };
  }
}
