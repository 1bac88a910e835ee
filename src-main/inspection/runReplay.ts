/**
 * Replay a run journal into the run's current picture. Incremental: the run service applies each
 * entry it appends, and a reopened run is rebuilt by applying every entry in order, so a reopened
 * run continues exactly where it stopped.
 */
import type { z } from 'zod';
import type { JournalEntry } from '../store/index.js';
import {
  closePayloadSchema,
  overridePayloadSchema,
  resultPayloadSchema,
  runHeaderSchema,
  voidPayloadSchema,
  type ClosePayload,
  type RunEntryView,
  type RunHeader,
  type RunStatus,
} from './runTypes.js';
import { RunEvidence } from './runEvidence.js';

export class RunJournalContentError extends Error {
  readonly code = 'RUN_JOURNAL_CONTENT';
  constructor(
    readonly seq: number,
    /** What is wrong with the entry, without the entry's number. */
    readonly detail: string,
  ) {
    super(`run journal entry ${seq}: ${detail}`);
    this.name = 'RunJournalContentError';
  }
}

type MutableEntryView = { -readonly [Key in keyof RunEntryView]: RunEntryView[Key] };

export class RunReplay {
  readonly results: MutableEntryView[] = [];
  status: RunStatus = 'open';
  lastClose: (ClosePayload & { time: string }) | null = null;
  /** The evidence of the counted (not voided) results, kept up to date entry by entry. */
  evidence: RunEvidence;

  private constructor(readonly header: RunHeader) {
    this.evidence = new RunEvidence(header.plan.spec);
  }

  /** Results counted (not voided). */
  get n(): number {
    return this.evidence.n;
  }

  /** Their total: nonconforming items or nonconformities (passfail, count); the sum (measurement). */
  get total(): number {
    return this.evidence.total;
  }

  static fromEntries(entries: readonly JournalEntry[]): RunReplay {
    const first = entries[0];
    if (first === undefined || first.kind !== 'open') throw new RunJournalContentError(0, 'the journal has no open header');
    const replay = new RunReplay(checked(0, runHeaderSchema, first.payload) as RunHeader);
    for (const entry of entries.slice(1)) replay.apply(entry);
    return replay;
  }

  /** The most recent result that is not voided, if any. */
  lastCountedResult(): RunEntryView | undefined {
    return this.results.findLast((entry) => !entry.voided);
  }

  apply(entry: JournalEntry): void {
    switch (entry.kind) {
      case 'result': {
        const payload = checked(entry.seq, resultPayloadSchema, entry.payload);
        this.results.push({ seq: entry.seq, time: entry.time, offset: entry.offset, actor: entry.actor, ...payload, voided: false, voidReason: null });
        this.evidence.add(payload.result);
        return;
      }
      case 'void': {
        const payload = checked(entry.seq, voidPayloadSchema, entry.payload);
        const target = this.results.find((result) => result.seq === payload.target);
        if (target === undefined || target.voided) {
          throw new RunJournalContentError(entry.seq, `voids entry ${payload.target}, which is not a counted result`);
        }
        target.voided = true;
        target.voidReason = payload.reason;
        // Rebuilt rather than subtracted: a voided lifetime time reading gives back the previous time.
        this.evidence = RunEvidence.of(this.header.plan.spec, this.results.filter((result) => !result.voided).map((result) => result.result));
        return;
      }
      case 'override':
        checked(entry.seq, overridePayloadSchema, entry.payload);
        this.status = 'open';
        return;
      case 'close':
        this.lastClose = { ...checked(entry.seq, closePayloadSchema, entry.payload), time: entry.time };
        this.status = 'closed';
        return;
      case 'open':
        throw new RunJournalContentError(entry.seq, 'a second open header');
    }
  }
}

function checked<Schema extends z.ZodType>(seq: number, schema: Schema, payload: unknown): z.infer<Schema> {
  const result = schema.safeParse(payload);
  if (!result.success) {
    const issue = result.error.issues[0];
    throw new RunJournalContentError(seq, `payload field "${issue?.path.join('.') ?? ''}": ${issue?.message ?? 'invalid'}`);
  }
  return result.data;
}
