/**
 * The history of runs for the Records place: one row per run journal in the data folder, read
 * without locks, and the filters by source, period (the run's start date) and decision.
 */
import type { PlanSpec } from '../engine/index.js';
import { folderNames, layout } from '../store/index.js';
import { localTimestamp, readRunJournal, type RunJournalRead } from './runJournalRead.js';

/** What a row's run came to: a decision, or none yet. */
export type HistoryDecision = 'accept' | 'reject' | 'undecided';

export interface HistoryRow {
  readonly runId: string;
  readonly sourceId: string;
  readonly sourceName: string;
  readonly lot: string;
  readonly planId: string;
  readonly planName: string;
  readonly planVersion: number;
  /** Start and end as the inspecting computer's clock showed them, ISO 8601 with offset. */
  readonly startedAt: string;
  readonly endedAt: string | null;
  readonly decision: HistoryDecision;
  /** The rule that decided, or null while undecided. */
  readonly rule: string | null;
  readonly itemsInspected: number;
  /** Nonconforming items (passfail) or nonconformities (count). */
  readonly nonconformingFound: number;
  readonly model: PlanSpec['model'];
  /** False when the journal's chain does not verify (the row is shown, its record is refused). */
  readonly verified: boolean;
}

export interface HistoryFilter {
  readonly sourceId?: string;
  /** First and last start date included, `YYYY-MM-DD`, in the run's own recorded offset. */
  readonly from?: string;
  readonly to?: string;
  readonly decision?: HistoryDecision;
}

export interface RunHistory {
  /** Rows that pass the filter, newest start first. */
  readonly rows: HistoryRow[];
  /** Every source that has runs, by name, for the filter. */
  readonly sources: Array<{ readonly id: string; readonly name: string }>;
  /** Runs before filtering. */
  readonly totalRuns: number;
  /** Journals that could not be read as runs at all, with why. */
  readonly unreadable: Array<{ readonly runId: string; readonly problem: string }>;
}

export function historyRow(read: RunJournalRead): HistoryRow {
  const { replay, entries } = read;
  const { run, plan, source } = replay.header;
  const close = replay.status === 'closed' ? replay.lastClose : null;
  const closeEntry = close === null ? undefined : entries.findLast((entry) => entry.kind === 'close');
  return {
    runId: run.id,
    sourceId: source.id,
    sourceName: source.name,
    lot: run.lot,
    planId: plan.id,
    planName: plan.name,
    planVersion: plan.version,
    startedAt: localTimestamp(entries[0].time, entries[0].offset),
    endedAt: closeEntry === undefined ? null : localTimestamp(closeEntry.time, closeEntry.offset),
    decision: close?.decision ?? 'undecided',
    rule: close?.rule ?? null,
    itemsInspected: replay.n,
    // A sum of measurements, failures or demerits is not a count of nonconforming items.
    nonconformingFound: plan.spec.model === 'passfail' || plan.spec.model === 'count' ? replay.total : 0,
    model: plan.spec.model,
    verified: read.problems.length === 0,
  };
}

/** Whether a row passes every filter that is set. Dates compare as text: both are `YYYY-MM-DD`. */
export function matchesHistoryFilter(row: HistoryRow, filter: HistoryFilter): boolean {
  const startDate = row.startedAt.slice(0, 10);
  return (
    (filter.sourceId === undefined || row.sourceId === filter.sourceId) &&
    (filter.decision === undefined || row.decision === filter.decision) &&
    (filter.from === undefined || startDate >= filter.from) &&
    (filter.to === undefined || startDate <= filter.to)
  );
}

/** Every run in the data folder as a history row, filtered. */
export async function runHistory(dataDirectory: string, filter: HistoryFilter = {}): Promise<RunHistory> {
  const names = await folderNames(layout.runsFolder(dataDirectory));
  const ids = names.filter((name) => name.endsWith('.journal')).map((name) => name.slice(0, -'.journal'.length));
  const unreadable: Array<{ runId: string; problem: string }> = [];
  const rows: HistoryRow[] = [];
  await Promise.all(
    ids.map(async (runId) => {
      try {
        rows.push(historyRow(await readRunJournal(dataDirectory, runId)));
      } catch (error) {
        unreadable.push({ runId, problem: error instanceof Error ? error.message : String(error) });
      }
    }),
  );
  const sources = new Map(rows.map((row) => [row.sourceId, row.sourceName]));
  return {
    rows: rows
      .filter((row) => matchesHistoryFilter(row, filter))
      .sort((a, b) => Date.parse(b.startedAt) - Date.parse(a.startedAt) || a.runId.localeCompare(b.runId)),
    sources: [...sources].map(([id, name]) => ({ id, name })).sort((a, b) => a.name.localeCompare(b.name)),
    totalRuns: rows.length,
    unreadable: unreadable.sort((a, b) => a.runId.localeCompare(b.runId)),
  };
}
