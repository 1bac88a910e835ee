/**
 * One read of a run journal for documents: its entries, its fingerprint and its replay, all from
 * the same bytes, so what a record prints and the fingerprint it carries cannot drift apart.
 * Read-only: takes no lock and repairs nothing, so it is safe while an inspector is writing the run.
 */
import { readFile } from 'node:fs/promises';
import { RunReplay } from '../inspection/index.js';
import { analyseJournal, layout, type JournalEntry, type JournalProblem } from '../store/index.js';

export interface RunJournalRead {
  readonly runId: string;
  readonly entries: readonly JournalEntry[];
  /** SHA-256 of the last intact line. */
  readonly fingerprint: string;
  readonly problems: readonly JournalProblem[];
  readonly replay: RunReplay;
}

/** Thrown when a journal does not verify: a record of it would not be truthful. */
export class RunJournalUnverifiedError extends Error {
  readonly code = 'RUN_JOURNAL_UNVERIFIED';
  constructor(
    readonly runId: string,
    readonly problems: readonly JournalProblem[],
  ) {
    const first = problems[0];
    super(
      `run ${runId}: the journal does not verify (${problems.length} problem${problems.length === 1 ? '' : 's'}; ` +
        `first at entry ${first?.seq ?? '?'}, line ${first?.line ?? '?'}: ${first?.problem ?? 'unknown'}); no record is made of it`,
    );
    this.name = 'RunJournalUnverifiedError';
  }
}

/** Reads and replays a run journal; problems are reported, not thrown (see requireVerified). */
export async function readRunJournal(dataDirectory: string, runId: string): Promise<RunJournalRead> {
  const analysis = analyseJournal(await readFile(layout.runJournal(dataDirectory, runId)));
  if (analysis.fingerprint === null) throw new RunJournalUnverifiedError(runId, analysis.problems);
  return {
    runId,
    entries: analysis.entries,
    fingerprint: analysis.fingerprint,
    problems: analysis.problems,
    replay: RunReplay.fromEntries(analysis.entries),
  };
}

/** The read itself when its chain is intact; RunJournalUnverifiedError otherwise. */
export function requireVerified(read: RunJournalRead): RunJournalRead {
  if (read.problems.length > 0) throw new RunJournalUnverifiedError(read.runId, read.problems);
  return read;
}

/**
 * A journal time as the inspector's clock showed it: the UTC time shifted by the recorded offset,
 * written with that offset ("2025-03-14T08:02:11+01:00").
 */
export function localTimestamp(utcTime: string, offset: string): string {
  const sign = offset.startsWith('-') ? -1 : 1;
  const [hours, minutes] = offset.slice(1).split(':').map(Number);
  const shifted = new Date(Date.parse(utcTime) + sign * (hours * 60 + minutes) * 60_000);
  return `${shifted.toISOString().slice(0, 19)}${offset}`;
}
