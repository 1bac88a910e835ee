/**
 * The plain data a decision record is drawn from. Nothing here knows about the engine or the
 * run journal: the glue that fills it from a real run lives elsewhere, so the document can be
 * built and tested on its own.
 *
 * Timestamps are ISO 8601 strings with an explicit offset (`2025-03-14T08:02:11+01:00` or `...Z`);
 * they are printed as written, never converted, so the record shows the time the inspector saw.
 */
import type { RunOutcome } from '../../inspection/runOutcome.js';

/** Who issues the record and with what software. */
export interface RecordHeader {
  organisationName: string;
  site: string;
  recordId: string;
  /** The run the record documents; named in the "how to verify" line. */
  runId: string;
  softwareName: string;
  softwareVersion: string;
  /** When the record was generated (ISO 8601 with offset); also the PDF creation date. */
  generatedAt: string;
  /** Paper size; A4 unless stated. */
  pageSize?: 'A4' | 'LETTER';
}

/** What was inspected, by whom and when. */
export interface RecordSubject {
  /** The source: a supplier, line or machine. */
  source: string;
  /** Null when the run does not name the part or the characteristic; the record says so. */
  part: string | null;
  characteristic: string | null;
  lotId: string;
  /** Items in the lot; null when the lot size is not known. */
  lotSize: number | null;
  inspectors: string[];
  startedAt: string;
  /** Null while the run has not been decided. */
  endedAt: string | null;
  /** IANA time zone name of the site, e.g. `Europe/Berlin`. */
  timeZone: string;
}

export type RecordModel = 'passfail' | 'count' | 'measurement' | 'lifetime' | 'graded';

/** A point of the evidence chart of a model with its own design path, in the chart's units. */
export type ChartPoint = readonly [x: number, y: number];

/**
 * What the record prints for a measurement, lifetime or graded run, in the model's natural units,
 * where the pass/fail and count record prints acceptance numbers and items.
 */
export interface ModelRecordDetail {
  /** Plan rows that replace the pass/fail Boundaries, Truncation and Average sample number rows. */
  planRows: Array<[label: string, text: string]>;
  /** Rows of the decision section that replace Items inspected and Nonconforming found. */
  decisionRows: Array<[label: string, text: string]>;
  /** One line of counts under the decision headline. */
  facts: string;
  chart: {
    xTitle: string;
    yTitle: string;
    evidenceLabel: string;
    /** 'line': points joined straight; 'time-steps': time runs flat, a failure steps up (lifetime). */
    pathStyle: 'line' | 'time-steps';
    path: ChartPoint[];
    /** The acceptance and rejection lines, as straight segments through these points. */
    accept: ChartPoint[];
    reject: ChartPoint[];
    alt: string;
  };
}

/** One hypothesis: the quality level with its symbol and unit, e.g. p0 = 0.01 fraction nonconforming. */
export interface QualityLevel {
  symbol: string;
  value: number;
  unit: string;
}

/** Wald's boundaries: accept when d <= -h1 + slope n, reject when d >= h2 + slope n. */
export interface PlanBoundaries {
  h1: number;
  h2: number;
  slope: number;
  /** ln A = ln((1 - beta) / alpha), the upper LLR limit. */
  lnA: number;
  /** ln B = ln(beta / (1 - alpha)), the lower LLR limit. */
  lnB: number;
}

export interface PlanTruncation {
  /** The run stops at this many items at the latest. */
  maxItems: number;
  /** The rule applied at the limit, in words. */
  rule: string;
}

export interface RecordPlan {
  planId: string;
  /** The plan's name as saved, printed beside its id; omitted when the plan has none. */
  planName?: string;
  planVersion: string;
  model: RecordModel;
  /** H0: acceptable quality (p0 or lambda0). */
  acceptableQuality: QualityLevel;
  /** H1: rejectable quality (p1 or lambda1). */
  rejectableQuality: QualityLevel;
  producerRiskNominal: number;
  consumerRiskNominal: number;
  /** Exact risks of the plan as run (with its truncation); null when not computed. */
  producerRiskExact: number | null;
  consumerRiskExact: number | null;
  boundaries: PlanBoundaries;
  truncation: PlanTruncation | null;
  /** Average sample number, in items, when quality is at H0 and at H1. */
  averageSampleNumberAtAcceptable: number;
  averageSampleNumberAtRejectable: number;
}

/** The void of an entry: a later journal entry that cancels it, with its reason. */
export interface EntryVoid {
  reason: string;
  /** Sequence number of the void entry in the journal. */
  voidSequence: number;
  voidedAt: string;
  actor: string;
}

export interface RecordEntry {
  sequence: number;
  recordedAt: string;
  itemId: string;
  /** Nonconformities found on the item: 0 or 1 for passfail, a count for the count model; 0 for the other models. */
  nonconformities: number;
  /** The result as printed, for the other models: a measured value with its unit, a test time or failure, a class. */
  resultText?: string;
  category: string | null;
  note: string | null;
  actor: string;
  voided: EntryVoid | null;
}

/** Acceptance and rejection numbers after `itemsInspected` items; null where no decision is possible yet. */
export interface BoundaryStep {
  itemsInspected: number;
  acceptanceNumber: number | null;
  rejectionNumber: number | null;
}

export type RecordState = 'continue' | 'accept' | 'reject' | 'accept at truncation' | 'reject at truncation';

export interface RecordDecision {
  state: RecordState;
  /** The rule that produced the state, in words, e.g. "2 nonconforming <= acceptance number 2 at n = 152". */
  rule: string;
  itemsInspected: number;
  nonconformingFound: number;
  /** Log-likelihood ratio after the last counted entry. */
  finalLogLikelihoodRatio: number;
}

export interface QualityEstimate {
  /** Name of the method, printed beside the numbers (say if it ignores the stopping rule). */
  methodName: string;
  pointEstimate: number;
  /** What the point estimate is, printed before it, e.g. "bias-adjusted"; omitted for a plain d/n. */
  pointEstimateName?: string;
  /** The naive d/n, printed for comparison when the point estimate is another one. */
  naiveEstimate?: number;
  confidenceLevel: number;
  lower: number;
  upper: number;
  /** The unit of the estimate, e.g. "fraction nonconforming". */
  unit: string;
  /** A further line, e.g. the share of each class of a graded run. */
  detail?: string;
}

export interface RecordApproval {
  inspectedBy: string | null;
  reviewedBy: string | null;
}

/** One decision of the run, or its reopening by an override with the reason, in journal order. */
export interface RecordHistoryEvent {
  sequence: number;
  at: string;
  actor: string;
  /** E.g. "accept (2 nonconforming <= acceptance number 2 at n = 152)" or "reopened after a decision: recount". */
  text: string;
}

export interface DecisionRecordInput {
  header: RecordHeader;
  subject: RecordSubject;
  plan: RecordPlan;
  /** Every entry of the run in journal order; voided entries stay, marked. */
  entries: RecordEntry[];
  /** One step per item count, from 1 up to at least the items inspected. */
  boundarySteps: BoundaryStep[];
  decision: RecordDecision;
  /** Null only while no item has been inspected: there is nothing to estimate from. */
  qualityEstimate: QualityEstimate | null;
  /** Where the run stands, in the words every place of the app uses (inspection/runOutcome.ts). */
  outcome: RunOutcome;
  /** Every decision and every reopening, in journal order. */
  history: RecordHistoryEvent[];
  /** The run journal's final SHA-256, 64 lower-case hex digits. */
  fingerprint: string;
  /** True for a run not yet decided: the record says so on every page. */
  interim: boolean;
  approval: RecordApproval;
  /** Present for measurement, lifetime and graded runs: their rows and chart in natural units. */
  modelDetail?: ModelRecordDetail;
}

/** Thrown when a DecisionRecordInput cannot make a truthful record; names the field and the value. */
export class DecisionRecordInputError extends Error {
  constructor(
    readonly field: string,
    readonly value: unknown,
    readonly allowed: string,
  ) {
    super(`decision record: ${field} is ${JSON.stringify(value)}; allowed: ${allowed}`);
    this.name = 'DecisionRecordInputError';
  }
}

const FINGERPRINT_PATTERN = /^[0-9a-f]{64}$/;
const TIMESTAMP_PATTERN = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2}(\.\d+)?)?(Z|[+-]\d{2}:\d{2})$/;

function requireText(field: string, value: unknown): void {
  if (typeof value !== 'string' || value.trim() === '') {
    throw new DecisionRecordInputError(field, value, 'a non-empty string');
  }
}

function requireTimestamp(field: string, value: unknown): void {
  if (typeof value !== 'string' || !TIMESTAMP_PATTERN.test(value) || Number.isNaN(Date.parse(value))) {
    throw new DecisionRecordInputError(field, value, 'an ISO 8601 date-time with offset, e.g. 2025-03-14T08:02:11+01:00');
  }
}

function requireFinite(field: string, value: unknown): void {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new DecisionRecordInputError(field, value, 'a finite number');
  }
}

function requireCount(field: string, value: unknown): void {
  if (typeof value !== 'number' || !Number.isInteger(value) || value < 0) {
    throw new DecisionRecordInputError(field, value, 'a whole number >= 0');
  }
}

function requireProbability(field: string, value: unknown): void {
  if (typeof value !== 'number' || !(value >= 0 && value <= 1)) {
    throw new DecisionRecordInputError(field, value, 'a probability in [0, 1]');
  }
}

/**
 * Checks a record input once, before any drawing, so a record is never half written.
 * Throws DecisionRecordInputError naming the first field that is wrong.
 */
export function validateDecisionRecordInput(input: DecisionRecordInput): void {
  const { header, subject, plan, decision, qualityEstimate } = input;
  for (const key of ['organisationName', 'site', 'recordId', 'runId', 'softwareName', 'softwareVersion'] as const) {
    requireText(`header.${key}`, header[key]);
  }
  requireTimestamp('header.generatedAt', header.generatedAt);
  for (const key of ['source', 'part', 'characteristic', 'lotId', 'timeZone'] as const) {
    if (subject[key] !== null) requireText(`subject.${key}`, subject[key]);
  }
  if (subject.lotSize !== null) requireCount('subject.lotSize', subject.lotSize);
  if (subject.inspectors.length === 0) {
    throw new DecisionRecordInputError('subject.inspectors', subject.inspectors, 'at least one name');
  }
  subject.inspectors.forEach((name, i) => requireText(`subject.inspectors[${i}]`, name));
  requireTimestamp('subject.startedAt', subject.startedAt);
  if (subject.endedAt !== null) requireTimestamp('subject.endedAt', subject.endedAt);

  requireText('plan.planId', plan.planId);
  requireText('plan.planVersion', plan.planVersion);
  const linear = plan.model === 'passfail' || plan.model === 'count';
  if (!linear && !['measurement', 'lifetime', 'graded'].includes(plan.model)) {
    throw new DecisionRecordInputError('plan.model', plan.model, "'passfail', 'count', 'measurement', 'lifetime' or 'graded'");
  }
  if (linear === (input.modelDetail !== undefined)) {
    throw new DecisionRecordInputError('modelDetail', input.modelDetail === undefined ? 'absent' : 'present', `present exactly for the measurement, lifetime and graded models (this plan is ${plan.model})`);
  }
  requireFinite('plan.acceptableQuality.value', plan.acceptableQuality.value);
  requireFinite('plan.rejectableQuality.value', plan.rejectableQuality.value);
  requireProbability('plan.producerRiskNominal', plan.producerRiskNominal);
  requireProbability('plan.consumerRiskNominal', plan.consumerRiskNominal);
  if (plan.producerRiskExact !== null) requireProbability('plan.producerRiskExact', plan.producerRiskExact);
  if (plan.consumerRiskExact !== null) requireProbability('plan.consumerRiskExact', plan.consumerRiskExact);
  for (const key of ['h1', 'h2', 'slope', 'lnA', 'lnB'] as const) {
    requireFinite(`plan.boundaries.${key}`, plan.boundaries[key]);
  }
  if (plan.truncation !== null) requireCount('plan.truncation.maxItems', plan.truncation.maxItems);
  requireFinite('plan.averageSampleNumberAtAcceptable', plan.averageSampleNumberAtAcceptable);
  requireFinite('plan.averageSampleNumberAtRejectable', plan.averageSampleNumberAtRejectable);

  input.entries.forEach((entry, i) => {
    requireCount(`entries[${i}].sequence`, entry.sequence);
    requireTimestamp(`entries[${i}].recordedAt`, entry.recordedAt);
    requireCount(`entries[${i}].nonconformities`, entry.nonconformities);
    if (plan.model === 'passfail' && entry.nonconformities > 1) {
      throw new DecisionRecordInputError(`entries[${i}].nonconformities`, entry.nonconformities, '0 or 1 for a passfail plan');
    }
    if (entry.voided !== null) {
      requireText(`entries[${i}].voided.reason`, entry.voided.reason);
      requireTimestamp(`entries[${i}].voided.voidedAt`, entry.voided.voidedAt);
    }
  });
  input.boundarySteps.forEach((step, i) => requireCount(`boundarySteps[${i}].itemsInspected`, step.itemsInspected));

  requireCount('decision.itemsInspected', decision.itemsInspected);
  // A measurement run's total is its sum, any real number; the count models' totals are counts.
  if (linear) requireCount('decision.nonconformingFound', decision.nonconformingFound);
  else requireFinite('decision.nonconformingFound', decision.nonconformingFound);
  requireFinite('decision.finalLogLikelihoodRatio', decision.finalLogLikelihoodRatio);
  requireText('decision.rule', decision.rule);
  const undecided = decision.state === 'continue';
  if (input.interim !== undecided) {
    throw new DecisionRecordInputError('interim', input.interim, `${undecided} for a run in state '${decision.state}'`);
  }
  if (qualityEstimate === null) {
    if (decision.itemsInspected !== 0) {
      throw new DecisionRecordInputError('qualityEstimate', null, `an estimate once items are inspected (${decision.itemsInspected} are)`);
    }
  } else {
    requireText('qualityEstimate.methodName', qualityEstimate.methodName);
    requireProbability('qualityEstimate.confidenceLevel', qualityEstimate.confidenceLevel);
    for (const key of ['pointEstimate', 'lower'] as const) {
      requireFinite(`qualityEstimate.${key}`, qualityEstimate[key]);
    }
    // An MTBF interval with no failure yet has no upper limit.
    if (!(Number.isFinite(qualityEstimate.upper) || (qualityEstimate.upper === Number.POSITIVE_INFINITY && plan.model === 'lifetime'))) {
      throw new DecisionRecordInputError('qualityEstimate.upper', qualityEstimate.upper, 'a finite number (infinite only for a lifetime MTBF)');
    }
    if (qualityEstimate.naiveEstimate !== undefined) requireFinite('qualityEstimate.naiveEstimate', qualityEstimate.naiveEstimate);
  }
  if (typeof input.fingerprint !== 'string' || !FINGERPRINT_PATTERN.test(input.fingerprint)) {
    throw new DecisionRecordInputError('fingerprint', input.fingerprint, '64 lower-case hex digits (SHA-256)');
  }
}
