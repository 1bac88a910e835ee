/**
 * `tallyline replay` for the models with their own design path: reads the results file line by
 * line, accumulates each model's evidence and stops at the decision.
 * measurement: one value a line; lifetime: `time T` (accumulated test time), `fail` (a failure now)
 * or `fail T` (time reaches T, then a failure); graded: a class name or its 0-based index.
 */
import { acceptTime, decideGraded, decideLifetime, decideMeasurement, gradedPlan, lifetimePlan, measurementPlan } from '../engine/index.js';
import type { Decision, GradedSpec, LifetimeSpec, MeasurementSpec } from '../engine/index.js';
import { UsageError } from './flags.js';

export interface ExtendedReplay {
  /** The JSON summary: decision, the accumulated evidence, llr and rule. */
  summary: { decision: Decision; llr: number; rule: string } & Record<string, unknown>;
  /** One row per accepted line, for the readable table: [step, entry, evidence, LLR]. */
  rows: string[][];
}

const NUMBER_TEXT = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;

function lineError(lineNumber: number, text: string, allowed: string): UsageError {
  return new UsageError('--results', allowed, `--results line ${lineNumber}: ${JSON.stringify(text)} is not ${allowed}`);
}

/** Replays the results text through an extended plan; throws UsageError naming a bad line. */
export function replayExtended(spec: MeasurementSpec | LifetimeSpec | GradedSpec, text: string): ExtendedReplay {
  const lines = text.split(/\r?\n/);
  const rows: string[][] = [];
  const entries = function* () {
    for (let i = 0; i < lines.length; i++) {
      const entry = lines[i].trim();
      if (entry !== '' && !entry.startsWith('#')) yield { entry, lineNumber: i + 1 };
    }
  };
  if (spec.model === 'measurement') {
    const plan = measurementPlan(spec);
    let n = 0;
    let sum = 0;
    let state = decideMeasurement(plan, 0, 0);
    for (const { entry, lineNumber } of entries()) {
      if (state.decision !== 'continue') break;
      const value = NUMBER_TEXT.test(entry) ? Number(entry) : Number.NaN;
      if (!Number.isFinite(value)) throw lineError(lineNumber, entry, 'a measured value (a finite number)');
      n += 1;
      sum += value;
      state = decideMeasurement(plan, n, sum);
      rows.push([String(n), entry, String(sum), String(state.llr)]);
    }
    return { summary: { decision: state.decision, n, sum, llr: state.llr, rule: state.rule }, rows };
  }
  if (spec.model === 'lifetime') {
    const plan = lifetimePlan(spec);
    const allowed = '"time T", "fail" or "fail T" with T the accumulated test time, not decreasing';
    let time = 0;
    let failures = 0;
    let step = 0;
    let state = decideLifetime(plan, 0, 0);
    for (const { entry, lineNumber } of entries()) {
      if (state.decision !== 'continue') break;
      const match = /^(time|fail)(?:\s+(\S+))?$/i.exec(entry);
      const kind = match?.[1].toLowerCase();
      const at = match?.[2] === undefined ? null : NUMBER_TEXT.test(match[2]) ? Number(match[2]) : Number.NaN;
      if (match === null || (kind === 'time' && at === null) || (at !== null && !(at >= time && Number.isFinite(at)))) {
        throw lineError(lineNumber, entry, allowed);
      }
      if (at !== null) {
        time = at;
        state = decideLifetime(plan, time, failures);
      }
      if (kind === 'fail' && state.decision === 'continue') {
        failures += 1;
        state = decideLifetime(plan, time, failures);
      }
      step += 1;
      rows.push([String(step), entry, `T ${time}, r ${failures}`, String(state.llr)]);
    }
    // A time entry may pass the accept line or the maximum time: the test decided there, not at the entry.
    let decidedAt = state.decision !== 'continue' && plan.maxTime !== null ? Math.min(time, plan.maxTime) : time;
    if (state.rule === 'acceptance line crossed') decidedAt = Math.min(decidedAt, acceptTime(plan, failures));
    const llr = state.decision === 'continue' ? state.llr : Math.max(state.llr, failures * plan.llrPerFailure - decidedAt * plan.llrPerTime);
    return { summary: { decision: state.decision, time: decidedAt, failures, llr, rule: state.rule }, rows };
  }
  const plan = gradedPlan(spec);
  const counts = spec.classes.map(() => 0);
  const lowerNames = spec.classes.map((name) => name.toLowerCase());
  const allowed = `a class name (${spec.classes.join(', ')}) or its index 0 to ${spec.classes.length - 1}`;
  let n = 0;
  let state = decideGraded(plan, counts);
  for (const { entry, lineNumber } of entries()) {
    if (state.decision !== 'continue') break;
    const byName = lowerNames.indexOf(entry.toLowerCase());
    const index = byName >= 0 ? byName : /^\d+$/.test(entry) && Number(entry) < counts.length ? Number(entry) : -1;
    if (index < 0) throw lineError(lineNumber, entry, allowed);
    counts[index] += 1;
    n += 1;
    state = decideGraded(plan, counts);
    rows.push([String(n), spec.classes[index], counts.join('/'), String(state.llr)]);
  }
  return { summary: { decision: state.decision, n, counts, llr: state.llr, rule: state.rule }, rows };
}
