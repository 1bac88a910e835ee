/**
 * The pictures of a run, per model, for the Inspect and Records screens alike: the live look-ahead
 * from the model's live-state function, the evidence frame (limits in the model's natural units,
 * drawn up to one horizon rule) and each entry's point on the evidence path. Shapes per model are
 * described at the top of api/channels/inspectionChannels.ts.
 */
import {
  gradedBoundaries,
  gradedPlan,
  lifetimeBoundaries,
  lifetimePlan,
  measurementPlan,
  planOf,
  resolvePlan,
  type GradedLiveState,
  type LifetimeLiveState,
  type LimitRow,
  type LinearCountLiveState,
  type MeasurementLiveState,
  type PlanSpec,
} from '../engine/index.js';
import { RunEvidence } from './runEvidence.js';
import type { RunEntryView, RunState } from './runTypes.js';

/** A result with the statistics after it, for the evidence path; `after` is null for a voided entry. */
export interface InspectionEntry extends RunEntryView {
  readonly after: { readonly n: number; readonly total: number; readonly llr: number; /** lifetime only */ readonly time?: number } | null;
}

/**
 * What the evidence chart draws the run against: the acceptance and rejection numbers for item
 * counts 1..horizon (a row at the truncation holds the truncation rule) and the LLR limits of the
 * lines in use.
 */
export interface EvidenceFrame {
  readonly model?: undefined;
  readonly horizon: number;
  readonly limits: LimitRow[];
  readonly lnA: number;
  readonly lnB: number;
  readonly truncation: number | null;
}

/** Measurement: the limits of the running sum against n, in the plan's unit (the truncation row holds its rule). */
export interface MeasurementFrame {
  readonly model: 'measurement';
  readonly horizon: number;
  readonly limits: Array<{ n: number; accept: number; reject: number }>;
  /** The LLR limits in use (moved inward with the overshoot correction). */
  readonly lnA: number;
  readonly lnB: number;
  readonly truncation: number | null;
  /** 'above': reject at or above `reject`, accept at or below `accept`; 'below': mirrored. */
  readonly rejectWhen: 'above' | 'below';
  readonly unit: string | null;
}

/** Lifetime: per failure count, the accumulated test time that accepts and the latest failure time that rejects. */
export interface LifetimeFrame {
  readonly model: 'lifetime';
  /** The largest failure count drawn. */
  readonly horizon: number;
  readonly limits: Array<{ failures: number; acceptTime: number | null; rejectTime: number | null }>;
  readonly lnA: number;
  readonly lnB: number;
  readonly truncation: null;
  readonly maxTime: number | null;
  readonly maxFailures: number | null;
  readonly unit: string | null;
}

/** Graded: the demerit limits against n (accept null while acceptance is impossible). */
export interface GradedFrame {
  readonly model: 'graded';
  readonly horizon: number;
  readonly limits: LimitRow[];
  readonly lnA: number;
  readonly lnB: number;
  readonly truncation: number | null;
  /** Demerits per item of each class (the first class 0, the second 1). */
  readonly demerits: Array<{ className: string; demerits: number }>;
}

export type InspectionFrame = EvidenceFrame | MeasurementFrame | LifetimeFrame | GradedFrame;

/** The look-ahead of a run, from the model's live-state function. */
export type InspectionLive =
  | (LinearCountLiveState & { readonly model?: undefined })
  | (MeasurementLiveState & { readonly model: 'measurement' })
  | (LifetimeLiveState & { readonly model: 'lifetime' })
  | (GradedLiveState & { readonly model: 'graded' });


/** Items drawn beyond the furthest point the run can reach next, so the steps ahead stay in view (screens and record alike). */
const HORIZON_MARGIN = 1.25;
const MINIMUM_HORIZON = 10;
/** Failure counts drawn at least, for a lifetime chart. */
const MINIMUM_FAILURES = 3;

/** The look-ahead of a run in the state given, from the plan's model. */
export function runLive(spec: PlanSpec, state: RunState): InspectionLive {
  return planOf(spec).liveState(state);
}

/** Items to draw: far enough to show where the run is expected to end, never past the truncation. The one horizon rule. */
export function itemHorizon(n: number, expectedRemaining: number, truncation: number | null): number {
  const ahead = Math.max(MINIMUM_HORIZON, Math.ceil(HORIZON_MARGIN * (n + Math.max(1, expectedRemaining))));
  return truncation === null ? ahead : Math.min(truncation, Math.max(ahead, n));
}

/**
 * The limits the evidence chart draws, far enough ahead to show the earliest accept and reject
 * (pass/fail, count) or the expected end of the run (other models), never past the truncation.
 */
export function evidenceFrame(spec: PlanSpec, live: InspectionLive): InspectionFrame {
  if (spec.model === 'measurement' && live.model === 'measurement') {
    const plan = measurementPlan(spec);
    const horizon = itemHorizon(live.n, Math.max(live.expectedRemainingH0, live.expectedRemainingH1), plan.truncation);
    return {
      model: 'measurement',
      horizon,
      limits: planOf(spec).limitRows(horizon),
      lnA: plan.rejectLimit,
      lnB: plan.acceptLimit,
      truncation: plan.truncation,
      rejectWhen: plan.shift > 0 ? 'above' : 'below',
      unit: spec.unit ?? null,
    };
  }
  if (spec.model === 'lifetime' && live.model === 'lifetime') {
    const plan = lifetimePlan(spec);
    const reach = live.failures + Math.max(1, live.failuresToReject ?? 0);
    const ahead = Math.max(MINIMUM_FAILURES, lifetimeBoundaries(plan).firstRejectFailures, Math.ceil(HORIZON_MARGIN * reach));
    const horizon = plan.maxFailures === null ? ahead : Math.min(plan.maxFailures, Math.max(ahead, live.failures));
    return {
      model: 'lifetime',
      horizon,
      limits: planOf(spec).limitRows(horizon),
      lnA: plan.lnA,
      lnB: plan.lnB,
      truncation: null,
      maxTime: plan.maxTime,
      maxFailures: plan.maxFailures,
      unit: spec.unit ?? null,
    };
  }
  if (spec.model === 'graded' && live.model === 'graded') {
    const plan = gradedPlan(spec);
    const boundaries = gradedBoundaries(plan);
    // Far enough to show where acceptance first becomes possible, so both lines are in view.
    const firstAcceptance = Math.ceil(boundaries.h1 / boundaries.slope);
    const horizon = itemHorizon(live.n, Math.max(live.expectedRemainingH0, live.expectedRemainingH1, firstAcceptance - live.n), plan.truncation);
    return {
      model: 'graded',
      horizon,
      limits: planOf(spec).limitRows(horizon),
      lnA: plan.lnA,
      lnB: plan.lnB,
      truncation: plan.truncation,
      demerits: boundaries.demerits,
    };
  }
  if ((spec.model === 'passfail' || spec.model === 'count') && live.model === undefined) return linearFrame(spec, live);
  throw new Error(`the run's look-ahead does not match its ${spec.model} plan`);
}

function linearFrame(spec: Parameters<typeof resolvePlan>[0], live: LinearCountLiveState): InspectionFrame {
  const { lines, countWeight } = resolvePlan(spec);
  const reach = live.n + Math.max(live.itemsToEarliestAccept ?? 0, live.itemsToEarliestReject ?? 0);
  const ahead = Math.max(MINIMUM_HORIZON, Math.ceil(HORIZON_MARGIN * reach));
  const horizon = lines.truncation === null ? ahead : Math.min(lines.truncation, Math.max(ahead, live.n));
  return {
    horizon,
    limits: planOf(spec).limitRows(horizon),
    // ln A and ln B of the lines in use (the fitted ones when the plan fits exact risks).
    lnA: lines.h2 * countWeight,
    lnB: -lines.h1 * countWeight,
    truncation: lines.truncation,
  };
}

/** The point of the evidence path after a state: n against total, and for lifetime the test time. */
export function pointOf(state: RunState): NonNullable<InspectionEntry['after']> {
  const point = { n: state.n, total: state.total, llr: state.llr };
  return state.model === 'lifetime' ? { ...point, time: state.time } : point;
}

/** Each counted result with the statistics after it: the points of the evidence path. */
export function withStatistics(spec: PlanSpec, entries: readonly RunEntryView[]): InspectionEntry[] {
  const evidence = new RunEvidence(spec);
  return entries.map((entry) => {
    if (entry.voided) return { ...entry, after: null };
    evidence.add(entry.result);
    return { ...entry, after: pointOf(evidence.state()) };
  });
}

/** A run's picture: each entry with the statistics after it, and the frame it is drawn in (the screens and the record alike). */
export function runPicture(spec: PlanSpec, results: readonly RunEntryView[], state: RunState): { entries: InspectionEntry[]; frame: InspectionFrame } {
  return { entries: withStatistics(spec, results), frame: evidenceFrame(spec, runLive(spec, state)) };
}

/** The points of the evidence path: the start of the run, then the statistics after each counted entry. */
export function evidencePathPoints(spec: PlanSpec, entries: readonly InspectionEntry[]): Array<NonNullable<InspectionEntry['after']>> {
  const plan = planOf(spec);
  return [pointOf(plan.state(plan.emptyEvidence())), ...entries.flatMap((entry) => (entry.after === null ? [] : [entry.after]))];
}
