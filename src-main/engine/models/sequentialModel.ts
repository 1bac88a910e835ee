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
}

/** Throws unless curvePoints is an integer from 2 to 10001; returns it (default 51). */
export function curvePointsOf(options: DesignOptions): number {
  return checkCurvePoints(options.curvePoints ?? 51);
}

/** A spec whose truncation the run has gone past (entries after an override), without that truncation. */
export function withoutPassedTruncation<Spec extends { truncation?: number | null }>(spec: Spec, n: number): Spec {
  return spec.truncation != null && n > spec.truncation ? { ...spec, truncation: null } : spec;
}
