/**
 * The sequential model of a linear-count definition (pass/fail, count): its evidence is the item
 * count n and the cumulative count, decided on the integer acceptance and rejection numbers.
 */
import { linearCountLimitRows, designLinearCountPlan } from '../linearCountDesign.js';
import type { LinearCountDesign, LimitRow } from '../planDesignTypes.js';
import { decideLinearCount, linearCountLiveState, type LinearCountLiveState } from '../linearCountLiveState.js';
import { linearCountWork } from './linearCountWork.js';
import { resolvePlan, type ResolvedPlan } from '../resolvePlan.js';
import type { LinearCountSpec } from '../spec.js';
import { linearCountEvidenceText, readableLinearCountPlan } from './linearCountText.js';
import { frameHorizon, MINIMUM_ITEM_HORIZON, type EntryText, type EvidenceDecision, type ModelFlags, type ModelLabels, type SequentialModel } from './sequentialModel.js';
import { linearCountRecordLines, type LinearCountRecordWords } from './linearCountRecordLines.js';

/** n items and their cumulative count (nonconforming items or nonconformities). */
export interface LinearCountEvidence {
  readonly n: number;
  readonly total: number;
}

/** The decision on a pass/fail or count run (no `model` field: the shape the run service has always shown). */
export interface LinearCountEvidenceState extends EvidenceDecision {
  readonly model?: undefined;
}

/**
 * What the evidence chart draws a pass/fail or count run against: the acceptance and rejection
 * numbers for item counts 1..horizon (a row at the truncation holds the truncation rule) and the
 * LLR limits of the lines in use.
 */
export interface LinearCountFrame {
  readonly model?: undefined;
  readonly horizon: number;
  readonly limits: LimitRow[];
  readonly lnA: number;
  readonly lnB: number;
  readonly truncation: number | null;
}

export interface LinearCountShapes<S extends LinearCountSpec, O> {
  spec: S;
  plan: ResolvedPlan;
  evidence: LinearCountEvidence;
  observation: O;
  state: LinearCountEvidenceState;
  live: LinearCountLiveState;
  row: LimitRow;
  design: LinearCountDesign;
  frame: LinearCountFrame;
}

/** What a linear-count model adds to the shared integer-line machinery: its labels and how a result counts. */
export interface LinearCountEntry<S extends LinearCountSpec, O> {
  labels: ModelLabels;
  /** The sentence for a result this model does not take, or null. */
  problem(observation: unknown): string | null;
  /** What one result adds to the cumulative count. */
  count(observation: O): number;
  /** One result drawn at quality theta from uniforms on [0, 1). */
  draw(quality: number, uniform: () => number): O;
  /** One typed line as a result (`feed`, `replay`). */
  parseText(text: string): EntryText<O>;
  /** The hypotheses in words for the readable design, e.g. "p0 = 0.01, p1 = 0.1". */
  qualities(spec: S): string;
  /** True when one item can carry more than one count, so a rejection number above n is possible. */
  readonly countCanExceedItems: boolean;
  readonly flags: ModelFlags<S>;
  /** How its decision record names the count and the results. */
  record: LinearCountRecordWords<O>;
}

/**
 * Builds the sequential model of a linear-count spec from its entry rules.
 *
 * Method: LLR = countWeight total - itemOffset n; decision and look-ahead on the integer lines
 * (decideLinearCount, linearCountLiveState), design by designLinearCountPlan.
 * References: Wald, A. (1947), Sequential Analysis, ch. 3 and 5; NIST/SEMATECH e-Handbook §6.2.6.
 */
export function linearCountModel<S extends LinearCountSpec, O>(
  name: S['model'],
  entry: LinearCountEntry<S, O>,
): SequentialModel<LinearCountShapes<S, O>> {
  return {
    name,
    labels: entry.labels,
    plan: (spec) => resolvePlan(spec),
    emptyEvidence: () => ({ n: 0, total: 0 }),
    observationProblem: (_plan, observation) => entry.problem(observation),
    canonical: (_plan, observation) => observation,
    observe: (_plan, evidence, observation) => ({ n: evidence.n + 1, total: evidence.total + entry.count(observation) }),
    llrStep: (plan, _evidence, observation) => plan.countWeight * entry.count(observation) - plan.itemOffset,
    state(plan, evidence) {
      const decided = decideLinearCount(plan.spec, evidence.n, evidence.total);
      return {
        decision: decided.decision,
        n: evidence.n,
        total: evidence.total,
        llr: decided.llr,
        rule: decided.decision === 'continue' ? null : decided.rule,
        standing: decided.rule,
      };
    },
    liveState: (plan, state) => linearCountLiveState(plan.spec, state.n, state.total),
    limitRows: (plan, horizon) => linearCountLimitRows(plan.lines, plan.lines.truncation === null ? horizon : Math.min(horizon, plan.lines.truncation)),
    estimateWork: (spec, curvePoints) => linearCountWork(spec, curvePoints),
    design: (spec, options = {}) => designLinearCountPlan(spec, options),
    frame(plan, live) {
      const { lines, countWeight } = plan;
      // Far enough ahead to show the earliest accept and the earliest reject.
      const reach = live.n + Math.max(live.itemsToEarliestAccept ?? 0, live.itemsToEarliestReject ?? 0);
      const horizon = frameHorizon({ reached: live.n, reach, minimum: MINIMUM_ITEM_HORIZON, limit: lines.truncation });
      return {
        horizon,
        limits: linearCountLimitRows(lines, horizon),
        // ln A and ln B of the lines in use (the fitted ones when the plan fits exact risks).
        lnA: lines.h2 * countWeight,
        lnB: -lines.h1 * countWeight,
        truncation: lines.truncation,
      };
    },
    point: (state) => ({ n: state.n, total: state.total, llr: state.llr }),
    parseEntryText: (_plan, text) => entry.parseText(text),
    drawObservation: (_plan, _evidence, quality, uniform) => entry.draw(quality, uniform),
    flags: entry.flags,
    text: {
      result: (observation) => String(observation),
      ...linearCountEvidenceText,
      design: (spec, design) => readableLinearCountPlan(spec, design, entry.qualities(spec), entry.countCanExceedItems),
    },
    json: {
      state: () => ({}),
      summary: (state) => ({ n: state.n, total: state.total }),
    },
    recordLines: (plan) => linearCountRecordLines(plan, entry.labels, entry.record),
  };
}
