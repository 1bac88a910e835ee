/**
 * The plain data a decision record is drawn from, and its schema. Nothing here knows about a
 * model: the plan's rows, the evidence rows, each result's text and the chart come already in the
 * model's words and units (the engine's record lines), so the document can be built and tested on
 * its own.
 *
 * Timestamps are ISO 8601 strings with an explicit offset (`2025-03-14T08:02:11+01:00` or `...Z`);
 * they are printed as written, never converted, so the record shows the time the inspector saw.
 */
import { z } from 'zod';
import type { RecordChart, RecordEstimate, RecordEvidenceLines, RecordQuality, RecordRow } from '../../engine/index.js';
import { RUN_OUTCOMES, type RunOutcome } from '../../inspection/runOutcome.js';

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
  /** IANA time zone name of the site, e.g. `Europe/Berlin`, or the offsets the journal was written with. */
  timeZone: string;
}

/** One hypothesis: the quality level with its symbol and unit, e.g. p0 = 0.01 fraction nonconforming. */
export type QualityLevel = RecordQuality;

export interface RecordPlan {
  planId: string;
  /** The plan's name as saved, printed beside its id; omitted when the plan has none. */
  planName?: string;
  planVersion: string;
  /** The model as the record names it, e.g. "passfail (each item conforming or nonconforming; binomial SPRT)". */
  modelLine: string;
  /** H0: acceptable quality (p0, lambda0, mu0, theta0 or the share outside the reference class). */
  acceptableQuality: QualityLevel;
  /** H1: rejectable quality. */
  rejectableQuality: QualityLevel;
  producerRiskNominal: number;
  consumerRiskNominal: number;
  /** Exact risks of the plan as run (with its truncation); null when not computed. */
  producerRiskExact: number | null;
  consumerRiskExact: number | null;
  /** Boundaries, truncation, expected run and what else the model states, after the risks. */
  rows: RecordRow[];
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
  /** The result as printed: "nonconforming", "2 nonconformities", a measured value with its unit, a test time or failure, a class. */
  resultText: string;
  category: string | null;
  note: string | null;
  actor: string;
  voided: EntryVoid | null;
}

export type RecordState = 'continue' | 'accept' | 'reject' | 'accept at truncation' | 'reject at truncation';

export interface RecordDecision {
  state: RecordState;
  /** The rule that produced the state, in words, e.g. "2 nonconforming <= acceptance number 2 at n = 152". */
  rule: string;
  /** Entries counted: items, measurements, lifetime entries. */
  itemsInspected: number;
  /** The model's running total in natural units: nonconforming items, nonconformities, the sum of measurements, failures, demerits. */
  nonconformingFound: number;
  /** Log-likelihood ratio after the last counted entry. */
  finalLogLikelihoodRatio: number;
}

export type QualityEstimate = RecordEstimate;

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
  /** The evidence chart: the run's path against the limits of its picture frame. */
  chart: RecordChart;
  decision: RecordDecision;
  /** The decision section's rows and the decision box's line of counts, in the model's words. */
  evidence: RecordEvidenceLines;
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

const TIMESTAMP_PATTERN = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2}(\.\d+)?)?(Z|[+-]\d{2}:\d{2})$/;

const text = z.string({ error: 'a non-empty string' }).refine((value) => value.trim() !== '', 'a non-empty string');
const timestamp = z
  .string({ error: 'an ISO 8601 date-time with offset, e.g. 2025-03-14T08:02:11+01:00' })
  .refine((value) => TIMESTAMP_PATTERN.test(value) && !Number.isNaN(Date.parse(value)), 'an ISO 8601 date-time with offset, e.g. 2025-03-14T08:02:11+01:00');
const finite = z.number({ error: 'a finite number' });
const count = z.number({ error: 'a whole number >= 0' }).int({ error: 'a whole number >= 0' }).min(0, { error: 'a whole number >= 0' });
const probability = z.number({ error: 'a probability in [0, 1]' }).min(0, { error: 'a probability in [0, 1]' }).max(1, { error: 'a probability in [0, 1]' });
const row = z.tuple([z.string(), z.string()]);
const chartPoint = z.tuple([finite, finite]);
const quality = z.object({ symbol: text, value: finite, unit: z.string() });

const estimateSchema = z.object({
  methodName: text,
  pointEstimate: finite,
  pointEstimateName: z.string().optional(),
  naiveEstimate: finite.optional(),
  confidenceLevel: probability,
  lower: finite,
  // An MTBF interval with no failure yet has no upper limit.
  upper: z.custom<number>((value) => typeof value === 'number' && (Number.isFinite(value) || value === Number.POSITIVE_INFINITY), {
    error: 'a finite number, or Infinity where the interval has no upper limit',
  }),
  unit: z.string(),
  detail: z.string().optional(),
});

/**
 * What a truthful record needs: every field present and well formed, the interim mark matching
 * the decision, and an estimate once anything is inspected.
 */
export const decisionRecordInputSchema = z
  .object({
    header: z.object({
      organisationName: text,
      site: text,
      recordId: text,
      runId: text,
      softwareName: text,
      softwareVersion: text,
      generatedAt: timestamp,
      pageSize: z.enum(['A4', 'LETTER']).optional(),
    }),
    subject: z.object({
      source: text,
      part: text.nullable(),
      characteristic: text.nullable(),
      lotId: text,
      lotSize: count.nullable(),
      inspectors: z.array(text).min(1, { error: 'at least one name' }),
      startedAt: timestamp,
      endedAt: timestamp.nullable(),
      timeZone: text,
    }),
    plan: z.object({
      planId: text,
      planName: z.string().optional(),
      planVersion: text,
      modelLine: text,
      acceptableQuality: quality,
      rejectableQuality: quality,
      producerRiskNominal: probability,
      consumerRiskNominal: probability,
      producerRiskExact: probability.nullable(),
      consumerRiskExact: probability.nullable(),
      rows: z.array(row),
    }),
    entries: z.array(
      z.object({
        sequence: count,
        recordedAt: timestamp,
        itemId: z.string(),
        nonconformities: count,
        resultText: z.string(),
        category: z.string().nullable(),
        note: z.string().nullable(),
        actor: z.string(),
        voided: z.object({ reason: text, voidSequence: count, voidedAt: timestamp, actor: z.string() }).nullable(),
      }),
    ),
    chart: z.object({
      xTitle: text,
      yTitle: text,
      evidenceLabel: text,
      acceptLabel: text,
      rejectLabel: text,
      limitStyle: z.enum(['steps', 'line']),
      accept: z.array(chartPoint.nullable()),
      reject: z.array(chartPoint.nullable()),
      pathStyle: z.enum(['steps', 'line']),
      path: z.array(chartPoint).min(1, { error: 'at least the start of the run' }),
      alt: text,
    }),
    decision: z.object({
      state: z.enum(['continue', 'accept', 'reject', 'accept at truncation', 'reject at truncation']),
      rule: text,
      itemsInspected: count,
      nonconformingFound: finite,
      finalLogLikelihoodRatio: finite,
    }),
    evidence: z.object({ rows: z.array(row), facts: text }),
    qualityEstimate: estimateSchema.nullable(),
    outcome: z.enum(RUN_OUTCOMES as [RunOutcome, ...RunOutcome[]]),
    history: z.array(z.object({ sequence: count, at: z.string(), actor: z.string(), text: z.string() })),
    fingerprint: z.string().regex(/^[0-9a-f]{64}$/, { error: '64 lower-case hex digits (SHA-256)' }),
    interim: z.boolean(),
    approval: z.object({ inspectedBy: z.string().nullable(), reviewedBy: z.string().nullable() }),
  })
  .superRefine((input, context) => {
    const undecided = input.decision.state === 'continue';
    if (input.interim !== undecided) {
      context.addIssue({ code: 'custom', path: ['interim'], message: `${undecided} for a run in state '${input.decision.state}'` });
    }
    if (input.qualityEstimate === null && input.decision.itemsInspected !== 0) {
      context.addIssue({ code: 'custom', path: ['qualityEstimate'], message: `an estimate once items are inspected (${input.decision.itemsInspected} are)` });
    }
  });

/** `entries[3].recordedAt` from a schema issue's path. */
function fieldName(path: readonly PropertyKey[]): string {
  return path.map((key, i) => (typeof key === 'number' ? `[${key}]` : `${i === 0 ? '' : '.'}${String(key)}`)).join('');
}

function valueAt(input: unknown, path: readonly PropertyKey[]): unknown {
  let value = input;
  for (const key of path) value = value !== null && typeof value === 'object' ? (value as Record<PropertyKey, unknown>)[key] : undefined;
  return value;
}

/**
 * Checks a record input once, before any drawing, so a record is never half written.
 * Throws DecisionRecordInputError naming the first field that is wrong.
 */
export function validateDecisionRecordInput(input: DecisionRecordInput): void {
  const checked = decisionRecordInputSchema.safeParse(input);
  if (checked.success) return;
  const [issue] = checked.error.issues;
  throw new DecisionRecordInputError(fieldName(issue.path), valueAt(input, issue.path), issue.message);
}
