/**
 * The one contract every data model fulfils. A model lives in its own folder under `models/` and
 * is listed once in `registry.ts`; everything generic (the run service, the CLI, the channels, the
 * record) reaches a model only through this contract.
 */
import type { Decision } from '../integerLines.js';
import { checkCurvePoints, type PlanWorkEstimate } from '../planWork.js';
import type { PlanSpec } from '../spec.js';
import type { RecordLines } from './recordLines.js';

/** Options every design takes; a model ignores the ones that do not apply to it. */
export interface DesignOptions {
  /** Number of qualities on the OC/ASN curve, 2..10001. Default 51. */
  curvePoints?: number;
  /** Runs per quality where a design simulates (graded beyond the exact recursion). */
  simulationRuns?: number;
  /** Seed of the simulation's generator. */
  seed?: number;
}

/** The decision on the evidence so far, with the rule that made it (null while continuing) and the LLR. */
export interface EvidenceDecision {
  readonly decision: Decision;
  readonly rule: string | null;
  /** The rule the decision rests on, also while continuing (where the evidence stands between the limits). */
  readonly standing: string;
  readonly llr: number;
  /** Entries counted (items, measurements, lifetime entries). */
  readonly n: number;
  /** The model's running total in natural units: nonconforming items, nonconformities, the sum of measurements, failures, demerits. */
  readonly total: number;
}

/** Words and symbols a model is shown with. */
export interface ModelLabels {
  /** Name of the model as the engineer reads it, e.g. "pass/fail". */
  readonly title: string;
  /** Symbol of the quality parameter the curves run over, e.g. "p", "lambda", "mu", "theta", "t". */
  readonly quality: string;
  /** Symbols of the acceptable and rejectable qualities, e.g. ["p0", "p1"]. */
  readonly hypotheses: readonly [string, string];
  /** What one entry is, singular and plural, e.g. ["item", "items"]. */
  readonly entry: readonly [string, string];
  /**
   * What the running total per entry is a rate of when totals of runs pool into one figure
   * ("fraction nonconforming", "nonconformities per item"); null when the total is no count of
   * nonconforming items (a sum of measurements, failures over test time, demerits).
   */
  readonly pooledRate: string | null;
}

/** The types one model works with, named once so the contract can be written for every model. */
export interface ModelShapes {
  spec: PlanSpec;
  /** The validated plan: the spec and every constant later calls use. */
  plan: { readonly spec: PlanSpec };
  /** The accumulated evidence in natural units (plain data, never changed in place). */
  evidence: { readonly n: number };
  /** One entry's result as the run service takes it. */
  observation: unknown;
  /** The evidence with its decision, as a run shows it. */
  state: EvidenceDecision;
  /** The state with its look-ahead: where a run is likely to go from here. */
  live: { readonly decision: Decision; readonly llr: number };
  /** One row of the limits table in natural units. */
  row: object;
  /** Everything shown about a plan, discriminated by `model`. */
  design: { readonly model: PlanSpec['model'] };
  /** What the evidence chart draws a run against: limits in natural units up to a horizon and the LLR limits in use. */
  frame: { readonly horizon: number; readonly lnA: number; readonly lnB: number };
}

/** One point of the evidence path after an entry: n against the running total, and for lifetime the test time. */
export interface EvidencePoint {
  readonly n: number;
  readonly total: number;
  readonly llr: number;
  /** Lifetime only: the accumulated test time (the point is failures = total against time). */
  readonly time?: number;
}

/** One typed input line as a result: the result, or a sentence saying what is wrong. */
export type EntryText<O> = { readonly result: O } | { readonly problem: string };

/**
 * One plan flag of the command line, as data: the CLI turns each kind into its flag reader
 * (`cli/planFlags.ts`). A flag two models share has one kind.
 */
export type PlanFlag =
  | { readonly name: string; readonly kind: 'probability' | 'probabilities' | 'positive' | 'finite' | 'switch' | 'classNames' }
  | { readonly name: string; readonly kind: 'integer'; readonly min: number }
  | { readonly name: string; readonly kind: 'choice'; readonly values: readonly [string, ...string[]] }
  | { readonly name: string; readonly kind: 'text'; readonly what: string; readonly limit: number };

/** How a model's spec reads its flags; the CLI supplies it and its errors. */
export interface PlanFlagReader {
  /** The value of a required flag (throws, naming the flag and what it takes, when missing). */
  need<V>(name: string): V;
  /** The value of an optional flag, undefined when not given. */
  given<V>(name: string): V | undefined;
  /** Refuses a flag's value with a sentence; never returns. */
  refuse(name: string, allowed: string, message: string): never;
}

/** A model's plan flags: which it takes, their help lines, and its spec from them. */
export interface ModelFlags<S> {
  /** The flags this model takes besides --model (in the order the help lists them). */
  readonly own: readonly PlanFlag[];
  /** Help lines for these flags, each starting with two spaces. */
  readonly usage: readonly string[];
  /** The spec from the flags given; the model's checks then check the relations. */
  spec(read: PlanFlagReader): S;
}

/** How a terminal shows a model's runs and plans (`run show`, `replay`, `plan`). */
export interface ModelTerminalText<T extends ModelShapes> {
  /** One result as typed back: pass/fail, a count, a value, `time T`, `fail [T]` or a class name. */
  result(observation: T['observation']): string;
  /** The evidence in words for the state line of `run show`, e.g. "n = 12, sum = 121.3". */
  evidence(state: T['state']): string;
  /** The heading of `replay`'s evidence column. */
  readonly evidenceColumn: string;
  /** The evidence after a line, for `replay`'s table. */
  evidenceCell(state: T['state']): string;
  /** How far the run went, for `replay`'s decision line, e.g. "after 12 items, total 1". */
  reached(state: T['state']): string;
  /** The readable form of the plan's design (`plan` without --json). */
  design(spec: T['spec'], design: T['design']): string;
}

/**
 * The model's fields of the JSON the CLI prints (README "Command line"; station scripts read them,
 * so the keys and their order never change).
 */
export interface ModelJsonFields<T extends ModelShapes> {
  /** Added to `{decision, n, total, llr}` in `run show --json`'s state: measurement {sum, mean}, lifetime {time, failures}, graded {counts, demerits}. */
  state(state: T['state']): Record<string, unknown>;
  /** Between decision and llr in `replay --json`: {n, total}, measurement {n, sum}, lifetime {time, failures}, graded {n, counts}. */
  summary(state: T['state']): Record<string, unknown>;
}

/**
 * A data model: spec check → plan; evidence per observation; decision; live state with look-ahead;
 * limits in natural units; the design with Wald's and the exact (or simulated) figures; labels.
 */
export interface SequentialModel<T extends ModelShapes> {
  readonly name: T['spec']['model'];
  readonly labels: ModelLabels;
  /**
   * Checks a spec once and returns the plan every other call takes.
   * @throws PlanParameterError naming the parameter, its value and what is allowed.
   */
  plan(spec: T['spec']): T['plan'];
  /** The evidence before the first entry. */
  emptyEvidence(plan: T['plan']): T['evidence'];
  /** A sentence saying what is wrong with a result for this model, or null when it fits. */
  observationProblem(plan: T['plan'], observation: unknown, evidence: T['evidence']): string | null;
  /** The result as the journal keeps it (a graded class spelled as the plan spells it); checked first. */
  canonical(plan: T['plan'], observation: T['observation']): T['observation'];
  /** The evidence after one more result (checked with observationProblem first). */
  observe(plan: T['plan'], evidence: T['evidence'], observation: T['observation']): T['evidence'];
  /** The LLR one result adds to the evidence given. */
  llrStep(plan: T['plan'], evidence: T['evidence'], observation: T['observation']): number;
  /** The decision on the evidence and its statistic in natural units; cheap enough for every entry. */
  state(plan: T['plan'], evidence: T['evidence']): T['state'];
  /**
   * The look-ahead from a state (as `state` gave it) under H0, H1 and the current estimate; a run
   * that went past its truncation (entries after an override) is looked ahead without it.
   */
  liveState(plan: T['plan'], state: T['state']): T['live'];
  /** Rows of the limits table up to `horizon` (items, or failure counts for lifetime), none past the plan's truncation. */
  limitRows(plan: T['plan'], horizon: number): T['row'][];
  /**
   * The size of the plan's runs and of its design with `curvePoints` qualities, from the spec alone
   * and cheaply (no exact figure is computed); checkPlanWork holds it to PLAN_LIMITS.
   * @throws PlanParameterError for a spec the model's own checks refuse.
   */
  estimateWork(spec: T['spec'], curvePoints: number): PlanWorkEstimate;
  /**
   * Designs the plan: lines, Wald's figures, the exact (integral-equation, recursion or simulated)
   * figures, the limits table and the OC/ASN curves.
   * @throws PlanParameterError for an invalid spec or options.
   */
  design(spec: T['spec'], options?: DesignOptions): T['design'];
  /** What a decision record prints of the plan, in the model's words and natural units (recordLines.ts). */
  recordLines(plan: T['plan']): RecordLines<T>;
  /** What the evidence chart draws the run against, up to the horizon `frameHorizon` gives from the look-ahead. */
  frame(plan: T['plan'], live: T['live']): T['frame'];
  /** The point of the evidence path after a state. */
  point(state: T['state']): EvidencePoint;
  /** One typed line (`feed`, `replay`) as a result of this model, before observationProblem checks it against the run. */
  parseEntryText(plan: T['plan'], text: string): EntryText<T['observation']>;
  /**
   * One result drawn at `quality` (the model's quality parameter, labels.quality) after the evidence
   * given, from uniforms on [0, 1): for simulated runs such as the demo.
   */
  drawObservation(plan: T['plan'], evidence: T['evidence'], quality: number, uniform: () => number): T['observation'];
  readonly flags: ModelFlags<T['spec']>;
  readonly text: ModelTerminalText<T>;
  readonly json: ModelJsonFields<T>;
}

/** Items (failures for lifetime) drawn beyond the furthest point the run can reach next, so the steps ahead stay in view. */
export const HORIZON_MARGIN = 1.25;

/**
 * The one horizon rule of every evidence chart (screens and record alike): far enough to show
 * `reach` (where the run can next decide or is expected to end) with a margin, at least `minimum`,
 * never past `limit` (the truncation) unless the run already stands there (`reached`).
 */
export function frameHorizon(reach: { readonly reached: number; readonly reach: number; readonly minimum: number; readonly limit: number | null }): number {
  const ahead = Math.max(reach.minimum, Math.ceil(HORIZON_MARGIN * reach.reach));
  return reach.limit === null ? ahead : Math.min(reach.limit, Math.max(ahead, reach.reached));
}

/** Items drawn at least by a chart against items. */
export const MINIMUM_ITEM_HORIZON = 10;

/** Items to draw for a run that went `n` items and may go `expectedRemaining` more (at least one): the horizon rule in items. */
export function itemHorizon(n: number, expectedRemaining: number, truncation: number | null): number {
  return frameHorizon({ reached: n, reach: n + Math.max(1, expectedRemaining), minimum: MINIMUM_ITEM_HORIZON, limit: truncation });
}

/** Throws unless curvePoints is an integer from 2 to 10001; returns it (default 51). */
export function curvePointsOf(options: DesignOptions): number {
  return checkCurvePoints(options.curvePoints ?? 51);
}

/** A spec whose truncation the run has gone past (entries after an override), without that truncation. */
export function withoutPassedTruncation<Spec extends { truncation?: number | null }>(spec: Spec, n: number): Spec {
  return spec.truncation != null && n > spec.truncation ? { ...spec, truncation: null } : spec;
}
