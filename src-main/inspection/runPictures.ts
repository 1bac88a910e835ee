/**
 * The pictures of a run, for the Inspect and Records screens alike: the live look-ahead, the
 * evidence frame (limits in the model's natural units, drawn up to the one horizon rule,
 * `frameHorizon`) and each entry's point on the evidence path, all from the plan's model
 * (`planOf(spec)`). Shapes per model are described at the top of api/channels/inspectionChannels.ts.
 */
import { planOf, type EvidencePoint, type PlanFrame, type PlanLiveState, type PlanSpec } from '../engine/index.js';
import { RunEvidence } from './runEvidence.js';
import type { RunEntryView, RunState } from './runTypes.js';

/** The horizon rule in items, for the record's chart. */
export { itemHorizon } from '../engine/index.js';
export type { GradedFrame, LifetimeFrame, LinearCountFrame as EvidenceFrame, MeasurementFrame } from '../engine/index.js';

/** A result with the statistics after it, for the evidence path; `after` is null for a voided entry. */
export interface InspectionEntry extends RunEntryView {
  readonly after: EvidencePoint | null;
}

/** What the evidence chart draws the run against, per model. */
export type InspectionFrame = PlanFrame;

/** The look-ahead of a run, from the model's live-state function (pass/fail and count without a `model` field). */
export type InspectionLive = PlanLiveState;

/** The look-ahead of a run in the state given, from the plan's model. */
export function runLive(spec: PlanSpec, state: RunState): InspectionLive {
  return planOf(spec).liveState(state);
}

/**
 * The limits the evidence chart draws, far enough ahead to show the earliest accept and reject
 * (pass/fail, count) or the expected end of the run (other models), never past the truncation.
 */
export function evidenceFrame(spec: PlanSpec, live: InspectionLive): InspectionFrame {
  return planOf(spec).frame(live);
}

/** The point of the evidence path after a state: n against total, and for lifetime the test time. */
export function pointOf(spec: PlanSpec, state: RunState): EvidencePoint {
  return planOf(spec).point(state);
}

/** Each counted result with the statistics after it: the points of the evidence path. */
export function withStatistics(spec: PlanSpec, entries: readonly RunEntryView[]): InspectionEntry[] {
  const evidence = new RunEvidence(spec);
  const plan = planOf(spec);
  return entries.map((entry) => {
    if (entry.voided) return { ...entry, after: null };
    evidence.add(entry.result);
    return { ...entry, after: plan.point(evidence.state()) };
  });
}

/** A run's picture: each entry with the statistics after it, and the frame it is drawn in (the screens and the record alike). */
export function runPicture(spec: PlanSpec, results: readonly RunEntryView[], state: RunState): { entries: InspectionEntry[]; frame: InspectionFrame } {
  return { entries: withStatistics(spec, results), frame: evidenceFrame(spec, runLive(spec, state)) };
}

/** The points of the evidence path: the start of the run, then the statistics after each counted entry. */
export function evidencePathPoints(spec: PlanSpec, entries: readonly InspectionEntry[]): Array<NonNullable<InspectionEntry['after']>> {
  const plan = planOf(spec);
  return [plan.point(plan.state(plan.emptyEvidence())), ...entries.flatMap((entry) => (entry.after === null ? [] : [entry.after]))];
}
