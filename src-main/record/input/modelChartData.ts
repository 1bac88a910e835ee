/**
 * The evidence chart of a measurement, lifetime or graded run in its natural units: running sum
 * against n, failures against accumulated test time, demerits against n, with the plan's
 * acceptance and rejection lines. Points are computed here; modelEvidenceChart.ts draws them.
 */
import {
  acceptTime,
  gradedBoundaries,
  gradedPlan,
  lifetimePlan,
  measurementBoundaries,
  measurementPlan,
  type GradedSpec,
  type LifetimeSpec,
  type MeasurementSpec,
} from '../../engine/index.js';
import { RunEvidence, type RunEntryView, type RunState } from '../../inspection/index.js';
import { formatNumber } from '../pdf/format.js';
import type { ChartPoint, ModelRecordDetail } from './decisionRecordInput.js';

/** A plan whose record shows its lines and evidence in natural units (no acceptance numbers). */
type ModelPartsSpec = MeasurementSpec | LifetimeSpec | GradedSpec;

/** Items drawn past the last one, so the lines just ahead stay in view. */
const HORIZON_MARGIN = 1.1;
const MINIMUM_ITEMS = 10;

function itemSpan(n: number, truncation: number | null | undefined): number {
  const ahead = Math.max(MINIMUM_ITEMS, Math.ceil(HORIZON_MARGIN * n));
  return truncation == null ? ahead : Math.max(n, Math.min(truncation, ahead));
}

/** The chart of a run whose evidence is `state` after the counted `results`. */
export function modelChart(spec: ModelPartsSpec, results: readonly RunEntryView[], state: RunState): ModelRecordDetail['chart'] {
  const counted = results.filter((entry) => !entry.voided);
  const evidence = new RunEvidence(spec);
  const states = [evidence.state(), ...counted.map((entry) => (evidence.add(entry.result), evidence.state()))];
  if (spec.model === 'measurement') {
    const plan = measurementPlan(spec);
    const boundaries = measurementBoundaries(plan);
    const span = itemSpan(state.n, plan.truncation);
    const sign = boundaries.rejectWhen === 'above' ? 1 : -1;
    // Drawn as the sum of deviations from mu0, S - n mu0: the same lines and crossings as the plain
    // sum, but without the common slope mu0 that would squeeze lines and path into one stroke.
    const lineSlope = boundaries.slope - spec.mu0;
    const line = (offset: number): ChartPoint[] => [0, span].map((n): ChartPoint => [n, lineSlope * n + offset]);
    const unit = spec.unit ? ` (${spec.unit})` : '';
    return {
      xTitle: 'Measurements, n',
      yTitle: `Running sum less n mu0, S - ${formatNumber(spec.mu0)} n${unit}`,
      evidenceLabel: 'running sum less n mu0',
      pathStyle: 'line',
      path: states.map((at): ChartPoint => [at.n, at.total - at.n * spec.mu0]),
      accept: line(-sign * boundaries.h1),
      reject: line(sign * boundaries.h2),
      alt: `Chart of the running sum of ${state.n} measurements less n mu0 against n, drawn against the plan's acceptance and rejection lines.`,
    };
  }
  if (spec.model === 'lifetime') {
    const plan = lifetimePlan(spec);
    const points = states.map((at): ChartPoint => [at.model === 'lifetime' ? at.time : 0, at.model === 'lifetime' ? at.failures : 0]);
    const [lastTime, lastFailures] = points[points.length - 1];
    const span = Math.max(HORIZON_MARGIN * lastTime, acceptTime(plan, lastFailures), acceptTime(plan, 0) * HORIZON_MARGIN);
    const failuresAt = (limit: number, time: number) => (limit + time * plan.llrPerTime) / plan.llrPerFailure;
    const unit = spec.unit ?? 'time units';
    return {
      xTitle: `Accumulated test time, T (${unit})`,
      yTitle: 'Failures, r',
      evidenceLabel: 'failures',
      pathStyle: 'time-steps',
      path: points,
      accept: [
        [acceptTime(plan, 0), 0],
        [span, failuresAt(plan.lnB, span)],
      ],
      reject: [
        [0, failuresAt(plan.lnA, 0)],
        [span, failuresAt(plan.lnA, span)],
      ],
      alt: `Chart of ${lastFailures} failures against ${lastTime} ${unit} of accumulated test time, drawn against the plan's acceptance and rejection lines.`,
    };
  }
  const plan = gradedPlan(spec);
  const boundaries = gradedBoundaries(plan);
  // Far enough to show where acceptance first becomes possible.
  const firstAccept = Math.ceil(boundaries.h1 / boundaries.slope) + 2;
  const span = plan.truncation === null ? Math.max(itemSpan(state.n, null), firstAccept) : itemSpan(state.n, plan.truncation);
  const start = Math.min(span, boundaries.h1 / boundaries.slope);
  return {
    xTitle: 'Items graded, n',
    yTitle: 'Demerits, D',
    evidenceLabel: 'demerits',
    pathStyle: 'line',
    path: states.map((at): ChartPoint => [at.n, at.total]),
    accept: [
      [start, boundaries.slope * start - boundaries.h1],
      [span, boundaries.slope * span - boundaries.h1],
    ],
    reject: [
      [0, boundaries.h2],
      [span, boundaries.slope * span + boundaries.h2],
    ],
    alt: `Chart of the demerits of ${state.n} graded items against n, drawn against the plan's acceptance and rejection lines.`,
  };
}
