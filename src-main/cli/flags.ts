/**
 * Flag parsing shared by every `tallyline` command. A command declares its flags as a table of
 * `Flag`s; `parseFlags` checks every value with zod and throws `UsageError` naming the flag and the
 * allowed range, which `runCommand` turns into one line on stderr and exit code 2.
 */
import { z } from 'zod';

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
}

type FlagTable = Record<string, Flag<unknown>>;
export type FlagValues<F extends FlagTable> = { [K in keyof F]?: F[K] extends Flag<infer T> ? T : never };

/** A decimal number as a user types it (sign, digits, point, exponent): what every number flag and input line accepts. */
export const NUMBER_TEXT = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;

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

/** Constructors for the usual kinds of flag; each states its allowed range in words. */
export const flag = {
  /** A number strictly between 0 and 1. */
  probability: (): Flag<number> => fromSchema('a number in (0, 1)', z.number().gt(0).lt(1), numeric),
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
  /** Any non-empty text, such as a file path ("-" for standard input where a command allows it). */
  text: (allowed = 'a non-empty text'): Flag<string> => fromSchema(allowed, z.string().min(1), (raw) => raw),
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
      throw new UsageError(arg, 'a flag', `unexpected argument ${JSON.stringify(arg)} (flags: ${flagList(table)})`);
    }
    const equals = arg.indexOf('=');
    const name = equals < 0 ? arg.slice(2) : arg.slice(2, equals);
    const definition = Object.hasOwn(table, name) ? table[name] : undefined;
    if (definition === undefined) {
      throw new UsageError(`--${name}`, flagList(table), `unknown flag --${name} (allowed: ${flagList(table)})`);
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
      raw = args[++i];
    }
    try {
      values[name] = definition.parse(raw);
    } catch (error) {
      if (!(error instanceof FlagValueError)) throw error;
      throw new UsageError(
        `--${name}`,
        definition.allowed,
        `--${name} must be ${definition.allowed} (got ${JSON.stringify(raw)})`,
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

function flagList(table: FlagTable): string {
  return Object.keys(table)
    .map((name) => `--${name}`)
    .join(', ');
}
