/**
 * The flags that describe a plan, shared by `plan`, `replay` and `run start`:
 * --model, --p0/--p1 or --lambda0/--lambda1, --alpha, --beta, --truncate, --fit.
 */
import type { PlanSpec, LinearCountSpec } from '../engine/index.js';
import { NUMBER_TEXT, UsageError, flag, rejectFlags, requireFlag } from './flags.js';
import type { Flag } from './flags.js';

export const planFlags = {
  model: flag.choice('passfail', 'count'),
  p0: flag.probability(),
  p1: flag.probability(),
  lambda0: flag.positive(),
  lambda1: flag.positive(),
  alpha: flag.probability(),
  beta: flag.probability(),
  truncate: flag.integer(1),
  fit: flag.choice('wald', 'exact'),
};

export const planFlagsUsage = [
  '  --model passfail|count     data model (required)',
  '  --p0 P --p1 P              passfail: acceptable and rejectable fraction nonconforming, 0 < p0 < p1 < 1',
  '  --lambda0 L --lambda1 L    count: acceptable and rejectable nonconformities per unit, 0 < lambda0 < lambda1',
  "  --alpha A --beta B         producer's and consumer's risk, each in (0, 1), alpha + beta < 1",
  '  --truncate N               decide at N items at the latest (accept iff LLR <= 0 there)',
  "  --fit wald|exact           Wald's lines (default) or lines fitted to the exact risks",
].join('\n');

/**
 * The plan spec from parsed plan flags; the engine then checks the relations (p0 < p1, alpha + beta < 1).
 *
 * @throws UsageError for a missing flag or one that belongs to the other model.
 */
function linearCountSpecFromFlags(values: Record<string, unknown>): LinearCountSpec {
  const model = requireFlag<LinearCountSpec['model']>(values, 'model', planFlags);
  const alpha = requireFlag<number>(values, 'alpha', planFlags);
  const beta = requireFlag<number>(values, 'beta', planFlags);
  const common = {
    alpha,
    beta,
    truncation: (values.truncate as number | undefined) ?? null,
    fit: (values.fit as 'wald' | 'exact' | undefined) ?? 'wald',
  };
  if (model === 'passfail') {
    rejectFlags(values, ['lambda0', 'lambda1'], 'belongs to --model count (use --p0 and --p1 for passfail)');
    return {
      model,
      p0: requireFlag<number>(values, 'p0', planFlags),
      p1: requireFlag<number>(values, 'p1', planFlags),
      ...common,
    };
  }
  rejectFlags(values, ['p0', 'p1'], 'belongs to --model passfail (use --lambda0 and --lambda1 for count)');
  return {
    model,
    lambda0: requireFlag<number>(values, 'lambda0', planFlags),
    lambda1: requireFlag<number>(values, 'lambda1', planFlags),
    ...common,
  };
}

// ---- Flags of the measurement, lifetime and graded models. ----


function numberFlag(name: string, allowed: string, accept: (value: number) => boolean): Flag<number> {
  return {
    takesValue: true,
    allowed,
    parse(raw) {
      const value = NUMBER_TEXT.test(raw.trim()) ? Number(raw) : Number.NaN;
      if (!Number.isFinite(value) || !accept(value)) throw new UsageError(`--${name}`, allowed, `--${name} must be ${allowed} (got ${JSON.stringify(raw)})`);
      return value;
    },
  };
}

/** A probability, or (graded) a comma-separated list of them; the model decides which it needs. */
function probabilitiesFlag(name: string): Flag<number | number[]> {
  const allowed = 'a number in (0, 1)';
  return {
    takesValue: true,
    allowed,
    parse(raw) {
      const parts = raw.split(',').map((part) => part.trim());
      const values = parts.map((part) => (NUMBER_TEXT.test(part) ? Number(part) : Number.NaN));
      if (values.some((value) => !(value > 0 && value < 1))) {
        const what = parts.length > 1 ? 'a comma-separated list of numbers, each in (0, 1)' : allowed;
        throw new UsageError(`--${name}`, what, `--${name} must be ${what} (got ${JSON.stringify(raw)})`);
      }
      return parts.length === 1 ? values[0] : values;
    },
  };
}

const classNamesFlag: Flag<string[]> = {
  takesValue: true,
  allowed: 'a comma-separated list of 2 to 10 distinct class names',
  parse(raw) {
    const names = raw.split(',').map((name) => name.trim());
    if (names.length < 2 || names.length > 10 || names.some((name) => name === '') || new Set(names).size !== names.length) {
      throw new UsageError('--classes', classNamesFlag.allowed, `--classes must be ${classNamesFlag.allowed} (got ${JSON.stringify(raw)})`);
    }
    return names;
  },
};

/** Plan flags for `plan` and `replay`: every model, including measurement, lifetime and graded. */
export const modelPlanFlags = {
  ...planFlags,
  model: flag.choice('passfail', 'count', 'measurement', 'lifetime', 'graded'),
  p0: probabilitiesFlag('p0'),
  p1: probabilitiesFlag('p1'),
  mu0: numberFlag('mu0', 'a finite number', () => true),
  mu1: numberFlag('mu1', 'a finite number', () => true),
  sigma: flag.positive(),
  'correct-overshoot': flag.switch(),
  theta0: flag.positive(),
  theta1: flag.positive(),
  'max-time': flag.positive(),
  'max-failures': flag.integer(1),
  classes: classNamesFlag,
  unit: flag.text('A unit (e.g. mm or unit-hours)', 40),
};

export const modelPlanFlagsUsage = [
  '  --model measurement        normal measurements, sigma known:',
  '     --mu0 M --mu1 M --sigma S [--correct-overshoot]   (mu1 above or below mu0; the correction pulls both limits in by 0.5826 |mu1-mu0|/sigma)',
  '  --model lifetime           exponential times to failure:',
  '     --theta0 T --theta1 T [--max-time T] [--max-failures R]   (theta1 < theta0, MTBF in your time unit)',
  '  --model graded             items graded into classes:',
  '     --classes a,b,c --p0 P,P,P --p1 P,P,P   (each list sums to 1; the first class is the reference)',
  '  --unit TEXT                measurement and lifetime: the unit of the values or test time, for display',
].join('\n');

const OWN_FLAGS: Record<string, readonly string[]> = {
  passfail: ['p0', 'p1'],
  count: ['lambda0', 'lambda1'],
  measurement: ['mu0', 'mu1', 'sigma', 'correct-overshoot', 'truncate', 'unit'],
  lifetime: ['theta0', 'theta1', 'max-time', 'max-failures', 'unit'],
  graded: ['classes', 'p0', 'p1', 'truncate'],
};

/** `{ unit }` when --unit was given, else nothing (the spec then has no unit key). */
function unitOf(values: Record<string, unknown>): { unit?: string } {
  return typeof values.unit === 'string' ? { unit: values.unit } : {};
}

/**
 * The plan spec of any model from parsed `modelPlanFlags`; the engine then checks the relations.
 *
 * @throws UsageError for a missing flag or one that belongs to another model.
 */
export function planSpecFromFlags(values: Record<string, unknown>): PlanSpec {
  const model = requireFlag<PlanSpec['model']>(values, 'model', modelPlanFlags);
  if (model === 'passfail' || model === 'count') {
    rejectFlags(values, ['mu0', 'mu1', 'sigma', 'correct-overshoot', 'theta0', 'theta1', 'max-time', 'max-failures', 'classes', 'unit'], `does not apply to --model ${model}`);
    for (const name of ['p0', 'p1']) {
      if (Array.isArray(values[name])) throw new UsageError(`--${name}`, 'a number in (0, 1)', `--${name} must be a number in (0, 1) for --model ${model} (got a list)`);
    }
    return linearCountSpecFromFlags(values);
  }
  const own = new Set([...OWN_FLAGS[model], 'model', 'alpha', 'beta', 'points', 'json', 'results']);
  const foreign = Object.keys(values).filter((name) => values[name] !== undefined && !own.has(name));
  rejectFlags(values, foreign, `does not apply to --model ${model}`);
  const alpha = requireFlag<number>(values, 'alpha', modelPlanFlags);
  const beta = requireFlag<number>(values, 'beta', modelPlanFlags);
  const need = <T>(name: keyof typeof modelPlanFlags): T => requireFlag<T>(values, name, modelPlanFlags);
  if (model === 'measurement') {
    return {
      model,
      mu0: need<number>('mu0'),
      mu1: need<number>('mu1'),
      sigma: need<number>('sigma'),
      alpha,
      beta,
      truncation: (values.truncate as number | undefined) ?? null,
      overshootCorrection: values['correct-overshoot'] === true,
      ...unitOf(values),
    };
  }
  if (model === 'lifetime') {
    return {
      model,
      theta0: need<number>('theta0'),
      theta1: need<number>('theta1'),
      alpha,
      beta,
      maxTime: (values['max-time'] as number | undefined) ?? null,
      maxFailures: (values['max-failures'] as number | undefined) ?? null,
      ...unitOf(values),
    };
  }
  const classes = need<string[]>('classes');
  const vector = (name: 'p0' | 'p1'): number[] => {
    const allowed = `${classes.length} probabilities, comma-separated, one per class of --classes, summing to 1`;
    const value = values[name];
    if (value === undefined) throw new UsageError(`--${name}`, allowed, `--${name} is required for --model graded: ${allowed}`);
    if (!Array.isArray(value) || value.length !== classes.length) {
      throw new UsageError(`--${name}`, allowed, `--${name} must be ${allowed} (got ${Array.isArray(value) ? value.length : 1})`);
    }
    return value as number[];
  };
  return { model, classes, p0: vector('p0'), p1: vector('p1'), alpha, beta, truncation: (values.truncate as number | undefined) ?? null };
}
