/**
 * The registry of data models: one line per model. Everything outside `models/` reaches a model
 * through `planOf` (a checked spec bound to its model) or `designPlan`, never by its name.
 */
import { PlanParameterError } from '../errors.js';
import { checkCurvePoints, checkPlanWork, type PlanWorkEstimate } from '../planWork.js';
import type { ModelName, PlanSpec } from '../spec.js';
import { countModel } from './count/countModel.js';
import { gradedModel } from './graded/gradedModel.js';
import { lifetimeModel } from './lifetime/lifetimeModel.js';
import { measurementModel } from './measurement/measurementModel.js';
import { passFailModel } from './passfail/passFailModel.js';
import type { DesignOptions, EntryText, EvidencePoint, ModelFlags, ModelLabels, ModelShapes, SequentialModel } from './sequentialModel.js';
import type { RecordLines } from './recordLines.js';

const models = {
  passfail: passFailModel,
  count: countModel,
  measurement: measurementModel,
  lifetime: lifetimeModel,
  graded: gradedModel,
} as const satisfies { [M in ModelName]: SequentialModel<ModelShapes & { spec: Extract<PlanSpec, { model: M }> }> };

type Models = typeof models;
type ShapesOf<M extends ModelName> = Models[M] extends SequentialModel<infer T> ? T : never;

/** The design of a plan of model M (a union when M is). */
export type DesignOf<M extends ModelName> = M extends ModelName ? ShapesOf<M>['design'] : never;
/** The design of a plan of any model, discriminated by `model`. */
export type PlanDesign = DesignOf<ModelName>;
/** The evidence state (decision and statistic in natural units) of a run of any model. */
export type EvidenceState = { [M in ModelName]: ShapesOf<M>['state'] }[ModelName];
/** The live state (with look-ahead) of a run of any model; pass/fail and count carry no `model` field. */
export type PlanLiveState = { [M in ModelName]: ShapesOf<M>['live'] }[ModelName];
/** One row of the limits table of a plan of model M. */
export type LimitRowOf<M extends ModelName> = M extends ModelName ? ShapesOf<M>['row'] : never;
/** One result of a run of any model, as the run service takes it. */
export type Observation = { [M in ModelName]: ShapesOf<M>['observation'] }[ModelName];
/** What the evidence chart draws a run of any model against; pass/fail and count carry no `model` field. */
export type PlanFrame = { [M in ModelName]: ShapesOf<M>['frame'] }[ModelName];
/** The accumulated evidence of a run of any model (opaque outside the model). */
export type Evidence = { [M in ModelName]: ShapesOf<M>['evidence'] }[ModelName];

/** Every model's name, in the registry's order. */
export const modelNames = Object.keys(models) as ModelName[];

/** A model's labels (title, quality symbol, hypotheses' symbols, what an entry is). */
export function modelLabels(model: ModelName): ModelLabels {
  return models[model].labels;
}

/** A model's plan flags (which it takes, their help lines, its spec from them). */
export function modelFlags(model: ModelName): ModelFlags<PlanSpec> {
  return models[model].flags as ModelFlags<PlanSpec>;
}

/** The model of a spec, erased to the shapes every model shares. */
function modelOf(spec: PlanSpec): SequentialModel<ModelShapes> {
  if (spec === null || typeof spec !== 'object') throw new PlanParameterError('spec', spec, 'a plan specification object');
  const name = (spec as { model?: unknown }).model;
  if (typeof name !== 'string' || !Object.hasOwn(models, name)) {
    throw new PlanParameterError('model', name, `one of ${modelNames.join(', ')}`);
  }
  return models[name as ModelName] as unknown as SequentialModel<ModelShapes>;
}

/**
 * A checked plan of any model, bound to its model: the one way the run service, the CLI, the
 * channels and the record reach the model's evidence, decision, look-ahead and limits.
 */
export interface SequentialPlan<M extends ModelName = ModelName> {
  readonly model: M;
  readonly spec: Extract<PlanSpec, { model: M }>;
  readonly labels: ModelLabels;
  emptyEvidence(): Evidence;
  /** A sentence saying what is wrong with a result for this plan, or null when it fits. */
  observationProblem(observation: unknown, evidence: Evidence): string | null;
  /** The result as the journal keeps it (a graded class spelled as the plan spells it); checked first. */
  canonical(observation: Observation): Observation;
  /** The evidence after one more result (checked with observationProblem first). */
  observe(evidence: Evidence, observation: Observation): Evidence;
  /** The LLR one result adds to the evidence given. */
  llrStep(evidence: Evidence, observation: Observation): number;
  /** The decision and the statistic in natural units. */
  state(evidence: Evidence): EvidenceState;
  /** The look-ahead from a state (as `state` gave it) under H0, H1 and the current estimate. */
  liveState(state: EvidenceState): PlanLiveState;
  /** Rows of the limits table up to `horizon` (items, or failure counts for lifetime), none past the truncation. */
  limitRows(horizon: number): LimitRowOf<M>[];
  /** What the evidence chart draws the run against, from its look-ahead (as `liveState` gave it). */
  frame(live: PlanLiveState): PlanFrame;
  /** The point of the evidence path after a state. */
  point(state: EvidenceState): EvidencePoint;
  /** One typed line (trimmed, not blank) as a result of this plan, or what is wrong with it. */
  parseEntryText(text: string): EntryText<Observation>;
  /** One result drawn at `quality` after the evidence given, from uniforms on [0, 1) (simulated runs, the demo). */
  drawObservation(evidence: Evidence, quality: number, uniform: () => number): Observation;
  /** How a terminal shows the plan's runs and design. */
  readonly text: {
    result(observation: Observation): string;
    evidence(state: EvidenceState): string;
    readonly evidenceColumn: string;
    evidenceCell(state: EvidenceState): string;
    reached(state: EvidenceState): string;
    design(design: PlanDesign): string;
  };
  /** The model's fields of the CLI's JSON (`run show` state, `replay` summary). */
  readonly json: {
    state(state: EvidenceState): Record<string, unknown>;
    summary(state: EvidenceState): Record<string, unknown>;
  };
  /** What a decision record prints of the plan, in the model's words and natural units. */
  recordLines(): RecordLines<{ design: DesignOf<M>; state: EvidenceState; observation: Observation; row: LimitRowOf<M> }>;
}

/**
 * Checks a spec with its model and binds the plan to it.
 *
 * Method: lookup of spec.model in the registry; the model's own check (its `plan`).
 * References: none (plumbing).
 *
 * @throws PlanParameterError naming the parameter, its value and what is allowed.
 */
export function planOf<S extends PlanSpec>(spec: S): SequentialPlan<S['model']> {
  checkPlanSpec(spec);
  const model = modelOf(spec);
  const plan = model.plan(spec);
  return {
    model: spec.model,
    spec: spec as unknown as Extract<PlanSpec, { model: S["model"] }>,
    labels: model.labels,
    emptyEvidence: () => model.emptyEvidence(plan) as Evidence,
    observationProblem: (observation, evidence) => model.observationProblem(plan, observation, evidence),
    canonical: (observation) => model.canonical(plan, observation) as Observation,
    observe: (evidence, observation) => model.observe(plan, evidence, observation) as Evidence,
    llrStep: (evidence, observation) => model.llrStep(plan, evidence, observation),
    state: (evidence) => model.state(plan, evidence) as EvidenceState,
    liveState: (state) => model.liveState(plan, state) as PlanLiveState,
    limitRows: (horizon) => model.limitRows(plan, horizon) as LimitRowOf<S['model']>[],
    frame: (live) => model.frame(plan, live) as PlanFrame,
    point: (state) => model.point(state),
    drawObservation: (evidence, quality, uniform) => model.drawObservation(plan, evidence, quality, uniform) as Observation,
    parseEntryText: (text) => model.parseEntryText(plan, text) as EntryText<Observation>,
    text: {
      result: (observation) => model.text.result(observation),
      evidence: (state) => model.text.evidence(state),
      evidenceColumn: model.text.evidenceColumn,
      evidenceCell: (state) => model.text.evidenceCell(state),
      reached: (state) => model.text.reached(state),
      design: (design) => model.text.design(spec, design),
    },
    json: model.json,
    recordLines: () => model.recordLines(plan) as unknown as ReturnType<SequentialPlan<S['model']>['recordLines']>,
  };
}

/**
 * Checks a spec without designing it, in well under a millisecond: its model's own checks (ranges,
 * truncation and failure bounds), then the size of its runs and of its design (checkPlanWork). The
 * one check for the CLI, the channels, plan files, restore and journal replay.
 *
 * @param options.curvePoints the qualities the design will compute (default 51).
 * @throws PlanParameterError naming the parameter, its value and what is allowed.
 */
export function checkPlanSpec(spec: PlanSpec, options: DesignOptions = {}): void {
  checkPlanWork(spec, estimatePlanWork(spec, options.curvePoints ?? 51));
}

/**
 * The size of a spec's runs and of its design with `curvePoints` qualities, as its model estimates it.
 *
 * @throws PlanParameterError for a spec its model refuses or a bad curvePoints.
 */
export function estimatePlanWork(spec: PlanSpec, curvePoints = 51): PlanWorkEstimate {
  return modelOf(spec).estimateWork(spec, checkCurvePoints(curvePoints));
}

/**
 * Designs a plan of any model: lines, Wald's figures, the exact (or simulated) figures, the limits
 * table and the curves, as the model's `design` gives them.
 *
 * Method: the model's design; each keeps its own Method and References.
 * References: see the model's design function.
 *
 * @throws PlanParameterError for an invalid spec or options.
 */
export function designPlan<S extends PlanSpec>(spec: S, options: DesignOptions = {}): DesignOf<S['model']> {
  checkPlanSpec(spec, options);
  return modelOf(spec).design(spec, options) as DesignOf<S['model']>;
}
