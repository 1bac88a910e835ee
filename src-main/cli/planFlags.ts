/**
 * The flags that describe a plan, shared by `plan`, `replay` and `run start`: --model and each
 * model's own flags, as the model declares them (`flags` in its folder under engine/models). This
 * file turns those declarations into flag readers and reads a spec through the model; it knows no
 * model by name.
 */
import { modelFlags, modelLabels, modelNames, NUMBER_TEXT, type ModelName, type PlanFlag, type PlanFlagReader, type PlanSpec } from '../engine/index.js';
import { PROPORTION_ALLOWED, UsageError, flag, proportionAllowedFor, proportionFromText, rejectFlags, requireFlag } from './flags.js';
import type { Flag, FlagTable } from './flags.js';

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

/** A probability, or a comma-separated list of them; the model decides which it needs. */
function probabilitiesFlag(name: string): Flag<number | number[]> {
  return {
    takesValue: true,
    allowed: PROPORTION_ALLOWED,
    parse(raw) {
      const parts = raw.split(',').map((part) => part.trim());
      const values = parts.map(proportionFromText);
      if (values.some((value) => !(value > 0 && value < 1))) {
        const each = proportionAllowedFor(raw);
        const what = parts.length > 1 ? `a comma-separated list, each ${each}` : each;
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

/** The flag reader of a declared plan flag. */
function flagOf(declared: PlanFlag): Flag<unknown> {
  switch (declared.kind) {
    case 'probability':
      return flag.probability();
    case 'probabilities':
      return probabilitiesFlag(declared.name);
    case 'positive':
      return flag.positive();
    case 'finite':
      return numberFlag(declared.name, 'a finite number', () => true);
    case 'switch':
      return flag.switch();
    case 'classNames':
      return classNamesFlag;
    case 'integer':
      return flag.integer(declared.min);
    case 'choice':
      return flag.choice(...declared.values);
    case 'text':
      return flag.text(declared.what, declared.limit);
  }
}

/** The plan flags of every model: --model, then each model's own in the registry's order (a shared flag once). */
function planFlagTable(): Record<string, Flag<unknown>> {
  const table: Record<string, Flag<unknown>> = { model: flag.choice(...(modelNames as [ModelName, ...ModelName[]])) };
  const kinds = new Map<string, string>();
  for (const model of modelNames) {
    for (const declared of modelFlags(model).own) {
      const kind = JSON.stringify({ ...declared, name: undefined });
      const before = kinds.get(declared.name);
      if (before !== undefined && before !== kind) throw new Error(`the plan flag --${declared.name} is declared as two kinds (${before}, ${kind})`);
      if (before === undefined) table[declared.name] = flagOf(declared);
      kinds.set(declared.name, kind);
    }
  }
  return table;
}

export const planFlags = planFlagTable();

/** The help lines of the plan flags: --model, each model's own lines, then the lines several models share (once). */
function planFlagsHelp(): string {
  const lines = modelNames.flatMap((model) => modelFlags(model).usage);
  const shared = (line: string) => lines.indexOf(line) !== lines.lastIndexOf(line);
  return [`  --model ${modelNames.join('|')}   data model (required)`, ...lines.filter((line) => !shared(line)), ...new Set(lines.filter(shared))].join('\n');
}

export const planFlagsUsage = planFlagsHelp();

/** The models that name `flagName` as one of their hypotheses (e.g. --lambda0 for count). */
function hypothesisOf(flagName: string): ModelName[] {
  return modelNames.filter((model) => modelLabels(model).hypotheses.includes(flagName));
}

/**
 * The plan spec of any model from parsed plan flags (other flags of the command are ignored);
 * the engine then checks the relations (p0 < p1, alpha + beta < 1).
 *
 * @throws UsageError for a missing flag or one that belongs to another model.
 */
export function planSpecFromFlags(values: Record<string, unknown>): PlanSpec {
  const model = requireFlag<ModelName>(values, 'model', planFlags);
  const { own, spec } = modelFlags(model);
  const ownNames = new Set(own.map((declared) => declared.name));
  for (const name of Object.keys(planFlags)) {
    if (name === 'model' || ownNames.has(name) || values[name] === undefined) continue;
    const owners = hypothesisOf(name);
    const [h0, h1] = modelLabels(model).hypotheses;
    rejectFlags(values, [name], owners.length > 0 ? `belongs to --model ${owners.join(' or ')} (use --${h0} and --${h1} for ${model})` : `does not apply to --model ${model}`);
  }
  const read: PlanFlagReader = {
    need: <V>(name: string) => requireFlag<V>(values, name, planFlags),
    given: <V>(name: string) => values[name] as V | undefined,
    refuse(name, allowed, message) {
      throw new UsageError(`--${name}`, allowed, message);
    },
  };
  return spec(read);
}

/** A command's own flags with the plan flags added (typed by the command's own and --model; the rest are read by planSpecFromFlags). */
export function withPlanFlags<F extends FlagTable>(own: F): F & { model: Flag<ModelName> } {
  return { ...planFlags, ...own } as F & { model: Flag<ModelName> };
}
