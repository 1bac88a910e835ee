/**
 * A benchmark case: `test/bench/cases/<topic>.ts` exports `cases: BenchCase[]`; `run.ts` finds every
 * file there, so adding a case never touches the runner.
 */
export interface BenchCase<State = unknown> {
  /** Unique name, printed as "case"; the issue fixes some names (e.g. "exact-curve"). */
  name: string;
  /** What is measured, in one line. */
  description: string;
  /** Untimed preparation; its result is passed to every run. */
  setup?: () => State | Promise<State>;
  /** The timed work (awaited when it returns a promise); return something derived from the result so it cannot be optimised away. */
  run: (state: State) => unknown;
  /** Untimed clean-up after the last run. */
  teardown?: (state: State) => unknown;
  /** Timed repetitions (default 21) after `warmup` untimed ones (default 5). */
  repeat?: number;
  warmup?: number;
  /** Another case's name: its median is this case's floor, and the ratio of medians is printed as "ratioToFloor". */
  relativeTo?: string;
}

/** Declares a case with its state type inferred from `setup`. */
export function benchCase<State>(definition: BenchCase<State>): BenchCase<unknown> {
  return definition as BenchCase<unknown>;
}
