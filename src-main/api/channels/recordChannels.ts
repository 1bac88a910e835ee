import { z } from 'zod';
import { idSchema } from '../../store/ids.js';
import type { PlanSpec } from '../../engine/index.js';
import type { QualityEstimate, RecordDecision } from '../../record/input/decisionRecordInput.js';
import { RUN_OUTCOMES, type RunHistory, type RunOutcome, type RunRow } from '../../inspection/index.js';

export type { RunHistory };
import type { InspectionEntry, InspectionFrame } from './inspectionChannels.js';

/** Run ids become file names: the same characters the store allows. */
const runId = idSchema('run');
const day = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'A date is written YYYY-MM-DD.');

/** Channels of the Records place: the run history, one run read-only, its record and its entries. */
export const recordChannels = {
  /** Every run, newest first, filtered by source, start date (from/to, inclusive) and outcome. */
  'record.history': {
    input: z
      .object({
        sourceId: idSchema('source').optional(),
        from: day.optional(),
        to: day.optional(),
        outcome: z.enum(RUN_OUTCOMES as [RunOutcome, ...RunOutcome[]]).optional(),
      })
      .refine((filter) => filter.from === undefined || filter.to === undefined || filter.from <= filter.to, {
        message: 'The period ends before it starts.',
        path: ['to'],
      }),
  },
  /** One run, read-only (no lock is taken: an inspector may be writing it), with its chart and estimate. */
  'record.open': { input: z.object({ runId }) },
  /** The decision record PDF (interim while undecided), as base64 for the renderer to download. */
  'record.pdf': { input: z.object({ runId }) },
  /** The run's entries as CSV (RFC 4180, UTF-8, header row). */
  'record.csv': { input: z.object({ runId }) },
} as const;

/** A run as the Records place shows it: what the record says, and the evidence path for the chart. */
export interface RecordRunView {
  readonly row: RunRow;
  readonly recordId: string;
  readonly plan: { readonly id: string; readonly name: string; readonly version: number; readonly spec: PlanSpec };
  readonly lotSize: number | null;
  readonly inspectors: string[];
  readonly entries: InspectionEntry[];
  /** As in the Inspect place (see inspectionChannels.ts): per model. */
  readonly frame: InspectionFrame;
  readonly decision: RecordDecision;
  readonly estimate: QualityEstimate | null;
  readonly interim: boolean;
  readonly fingerprint: string;
}

export interface RecordFile {
  readonly fileName: string;
  readonly interim: boolean;
}

export interface RecordChannelOutputs {
  'record.history': RunHistory;
  'record.open': RecordRunView;
  'record.pdf': RecordFile & { readonly recordId: string; readonly base64: string };
  'record.csv': RecordFile & { readonly text: string };
}
