/**
 * Flag parsing shared by every `tallyline` command. A command declares its flags as a table of
 * `Flag`s; `parseFlags` checks every value with zod and throws `UsageError` naming the flag and the
 * allowed range, which `runCommand` turns into one line on stderr and exit code 2.
 */
import { z } from 'zod';
import { NUMBER_TEXT } from '../engine/numberText.js';
import { idSchema } from '../store/ids.js';
import { noteText, SHORT_TEXT_LIMIT, shortText, visibleText } from '../store/textFields.js';

/** A bad flag or value: exit 2 with one line naming the flag and what is allowed. */
export class UsageError extends Error {
  readonly flag: string;
  readonly allowed: string;

  constructor(flag: string, allowed: string, message?: string) {
    super(message ?? `${flag} must be ${allowed}`);
    this.name = 'UsageError';
    this.flag = flag;
    this.allowed = allowed;
  }
}

/** One declared flag: whether it takes a value, what is allowed, and how to read it. */
export interface Flag<T> {
  readonly takesValue: boolean;
  readonly allowed: string;
  /** Reads the raw text (or true for a switch); throws UsageError through `parseFlags`. */
  parse(raw: string): T;
  /** What is allowed, said in the unit of what was typed (a percent answered in percent). */
  allowedFor?(raw: string): string;
}

export type FlagTable = Record<string, Flag<unknown>>;
export type FlagValues<F extends FlagTable> = { [K in keyof F]?: F[K] extends Flag<infer T> ? T : never };


/** Thrown inside a flag's parse when the text fails its schema; parseFlags adds the flag name. */
class FlagValueError extends Error {}

function fromSchema<T>(allowed: string, schema: z.ZodType<T>, toInput: (raw: string) => unknown): Flag<T> {
  return {
    takesValue: true,
    allowed,
    parse(raw) {
      const result = schema.safeParse(toInput(raw));
      if (!result.success) throw new FlagValueError(raw);
      return result.data;
    },
  };
}

const numeric = (raw: string): unknown => (NUMBER_TEXT.test(raw.trim()) ? Number(raw) : Number.NaN);

/** Whether a proportion was typed as a percent ("1%", "1 %"). */
export const typedAsPercent = (raw: string): boolean => /%\s*$/.test(raw);

/**
 * A proportion as a script may write it: a fraction (0.01) or a percent (1%); NaN for anything else.
 * Fractions stay the machine form (JSON out, plan files); the percent form is for people typing.
 */
export function proportionFromText(raw: string): number {
  const text = raw.trim();
  if (typedAsPercent(text)) {
    const number = text.replace(/%\s*$/, '').trim();
    return NUMBER_TEXT.test(number) ? Number(number) / 100 : Number.NaN;
  }
  return NUMBER_TEXT.test(text) ? Number(text) : Number.NaN;
}

/**
 * An engine message ("p1 must be greater than p0 (got p0 = 0.01, p1 = 0.005)") with the values of
 * the proportions typed in percent written back in percent, so the answer uses the user's unit.
 */
export function messageInTypedUnits(message: string, args: readonly string[]): string {
  let rewritten = message;
  for (let i = 0; i + 1 < args.length; i += 1) {
    const name = /^--(p0|p1|alpha|beta)$/.exec(args[i])?.[1];
    if (name === undefined || !typedAsPercent(args[i + 1]) || args[i + 1].includes(',')) continue;
    rewritten = rewritten.replace(new RegExp(`\\b${name} = (-?[0-9.]+(?:e-?[0-9]+)?)`, 'g'), (_, value: string) => `${name} = ${Number((Number(value) * 100).toPrecision(6))}%`);
  }
  return rewritten;
}

export const PROPORTION_ALLOWED = 'a fraction in (0, 1) or a percent in (0%, 100%), e.g. 0.01 or 1%';
/** The allowed range of a proportion in the unit it was typed in. */
export const proportionAllowedFor = (raw: string): string => (typedAsPercent(raw) ? 'a percent above 0% and below 100%' : 'a fraction above 0 and below 1 (or a percent such as 1%)');

/** Constructors for the usual kinds of flag; each states its allowed range in words. */
export const flag = {
  /** A number strictly between 0 and 1. */
  probability: (): Flag<number> => ({ ...fromSchema(PROPORTION_ALLOWED, z.number().gt(0).lt(1), proportionFromText), allowedFor: proportionAllowedFor }),
  /** A finite number greater than 0. */
  positive: (): Flag<number> => fromSchema('a number greater than 0', z.number().gt(0).finite(), numeric),
  /** An integer in [min, max]. */
  integer: (min: number, max = Number.MAX_SAFE_INTEGER): Flag<number> =>
    fromSchema(
      max === Number.MAX_SAFE_INTEGER ? `an integer >= ${min}` : `an integer from ${min} to ${max}`,
      z.number().int().min(min).max(max),
      numeric,
    ),
  /** One of a fixed set of words. */
  choice: <const T extends string>(...values: [T, ...T[]]): Flag<T> =>
    fromSchema(`one of ${values.join(', ')}`, z.enum(values) as unknown as z.ZodType<T>, (raw) => raw),
  /** A file or folder path ("-" for standard input where a command allows it): not blank, no control characters. */
  path: (allowed = 'a file path'): Flag<string> => fromSchema(allowed, shortText('A path', 'A path cannot be blank.', 4096), (raw) => raw),
  /** Text stored in a record (lot, names): the channels' rule, trimmed, printable, at most 120 characters. */
  text: (what: string, limit = SHORT_TEXT_LIMIT): Flag<string> =>
    fromSchema(`${what.charAt(0).toLowerCase()}${what.slice(1)}: printable text, 1 to ${limit} characters`, shortText(what, undefined, limit), (raw) => raw),
  /** A free-text note: printable apart from tabs and line breaks, at most 2000 characters. */
  note: (): Flag<string> => fromSchema('a note: printable text, at most 2000 characters', noteText('A note', 2000), (raw) => raw),
  /** The id of a stored run, plan or source: the store's one id pattern. */
  id: (kind: 'run' | 'plan' | 'source'): Flag<string> =>
    fromSchema(`a ${kind} id (letters, digits, ".", "_" or "-", at most 80)`, idSchema(kind), (raw) => raw),
  /** A switch without a value. */
  switch: (): Flag<boolean> => ({ takesValue: false, allowed: 'no value', parse: () => true }),
};

/**
 * Parses `--name value`, `--name=value` and switches against a flag table.
 *
 * @throws UsageError for an unknown flag, a missing value, a repeated flag or a value out of range.
 */
export function parseFlags<F extends FlagTable>(args: readonly string[], table: F): FlagValues<F> {
  const values: Record<string, unknown> = {};
  for (let i = 0; i < args.length; i++) {
    const arg = args[i];
    if (!arg.startsWith('--')) {
      throw new UsageError(arg, 'a flag', `unexpected argument ${shown(arg)} (flags: ${flagList(table)})`);
    }
    const equals = arg.indexOf('=');
    const name = equals < 0 ? arg.slice(2) : arg.slice(2, equals);
    const definition = Object.hasOwn(table, name) ? table[name] : undefined;
    if (definition === undefined) {
      throw new UsageError(`--${name}`, flagList(table), `unknown flag ${visibleText(`--${name}`.slice(0, 60))} (allowed: ${flagList(table)})`);
    }
    if (Object.hasOwn(values, name)) {
      throw new UsageError(`--${name}`, 'given once', `--${name} is given more than once`);
    }
    let raw: string;
    if (!definition.takesValue) {
      if (equals >= 0) throw new UsageError(`--${name}`, 'no value', `--${name} takes no value`);
      raw = '';
    } else if (equals >= 0) {
      raw = arg.slice(equals + 1);
    } else {
      if (i + 1 >= args.length) {
        throw new UsageError(`--${name}`, definition.allowed, `--${name} needs a value: ${definition.allowed}`);
      }
      // "--run --data-dir X": the next word is a flag, not this flag's value.
      if (args[i + 1].startsWith('--')) {
        throw new UsageError(`--${name}`, definition.allowed, `--${name} needs a value: ${definition.allowed} (got the flag ${shown(args[i + 1])})`);
      }
      raw = args[++i];
    }
    try {
      values[name] = definition.parse(raw);
    } catch (error) {
      if (!(error instanceof FlagValueError)) throw error;
      throw new UsageError(
        `--${name}`,
        definition.allowed,
        `--${name} must be ${definition.allowedFor?.(raw) ?? definition.allowed} (got ${shown(raw)})`,
      );
    }
  }
  return values as FlagValues<F>;
}

/** The value of a required flag, or a UsageError saying it is missing and what it takes. */
export function requireFlag<T>(values: Record<string, unknown>, name: string, table: FlagTable): T {
  const value = values[name];
  if (value === undefined) {
    throw new UsageError(`--${name}`, table[name].allowed, `--${name} is required: ${table[name].allowed}`);
  }
  return value as T;
}

/** Throws if a flag that does not apply here was given. */
export function rejectFlags(values: Record<string, unknown>, names: readonly string[], reason: string): void {
  for (const name of names) {
    if (values[name] !== undefined) throw new UsageError(`--${name}`, reason, `--${name} ${reason}`);
  }
}

/** A value the user typed, quoted for a one-line message: control characters escaped, long values cut. */
export function shown(raw: string): string {
  const quoted = JSON.stringify(raw.length > 60 ? `${raw.slice(0, 60)}...` : raw);
  return `${visibleText(quoted)}${raw.length > 60 ? ` (${raw.length} characters)` : ''}`;
}

function flagList(table: FlagTable): string {
  return Object.keys(table)
    .map((name) => `--${name}`)
    .join(', ');
}
