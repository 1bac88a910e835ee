/**
 * The run catalogue: the one reader of run journals. `readRun` is a single verified read of one run
 * (its entries, fingerprint, problems, replayed state and decision history, all from the same
 * bytes); `listRuns` gives one row per run with one outcome word (runOutcome.ts).
 *
 * Read-only: takes no lock and repairs nothing, so any run can be looked at while it is written.
 * Damage is kept per run: a journal whose chain breaks or whose entries do not replay is listed as
 * damaged with its first bad sequence, its good prefix stays readable, and other runs are unaffected.
 *
 * A listing does not re-verify unchanged journals: each row is kept in memory with the journal's
 * size, modification and change times and inode, and re-read only when one of them differs (an
 * append always grows the file; an edit changes the change time even when the modification time
 * is set back).
 */
import type { Stats } from 'node:fs';
import { open, stat } from 'node:fs/promises';
import path from 'node:path';
import { modelLabels, type PlanSpec } from '../engine/index.js';
import { analyseJournal, checkAnchor, checkId, folderNames, layout, readAnchorBytes, withAnchor, type AnchorCheck, type JournalEntry, type JournalProblem } from '../store/index.js';
import { localTimestamp } from './localTime.js';
import { RunJournalContentError, RunReplay } from './runReplay.js';
import type { RunOutcome } from './runOutcome.js';

/** The first entry that cannot be trusted, and why. */
export interface RunDamage {
  readonly firstBadSeq: number;
  readonly problem: string;
}

/** One decision of a run, or one reopening of it by an override, in journal order. */
export type DecisionEvent =
  | {
      readonly kind: 'decision';
      readonly seq: number;
      /** As the inspector's clock showed it, ISO 8601 with offset. */
      readonly at: string;
      readonly actor: string;
      readonly decision: 'accept' | 'reject';
      readonly rule: string;
      readonly itemsInspected: number;
    }
  | { readonly kind: 'reopened'; readonly seq: number; readonly at: string; readonly actor: string; readonly reason: string };

/**
 * A run as every list shows it. Fields taken from the run's header are null only for a damaged
 * journal whose header cannot be read.
 */
export interface RunRow {
  readonly runId: string;
  readonly outcome: RunOutcome;
  readonly sourceId: string | null;
  readonly sourceName: string | null;
  readonly lot: string | null;
  readonly planId: string | null;
  readonly planName: string | null;
  readonly planVersion: number | null;
  readonly model: PlanSpec['model'] | null;
  /** From the plan version, when it named them. */
  readonly part: string | null;
  readonly characteristic: string | null;
  /** Start, and the standing decision's time, as the inspecting computer's clock showed them (ISO 8601 with milliseconds and offset). */
  readonly startedAt: string | null;
  readonly endedAt: string | null;
  /** The rule of the standing decision, null when none stands. */
  readonly rule: string | null;
  /** Items (entries for lifetime) counted, voids excluded; of the good prefix when damaged. */
  readonly itemsInspected: number;
  /** Nonconforming items (passfail) or nonconformities (count); 0 for the other models. */
  readonly nonconformingFound: number;
  /** Set when the outcome is damaged. */
  readonly damage: RunDamage | null;
}

/** One verified read of a run. */
export interface RunRead {
  readonly runId: string;
  /** The good prefix of the journal: every entry before the first bad one (all of them when intact). */
  readonly entries: readonly JournalEntry[];
  /** Entries read from intact lines in the whole journal, the good prefix and any after it (what verify counts). */
  readonly entriesRead: number;
  /** SHA-256 of the journal's last intact line, null for an empty file. */
  readonly fingerprint: string | null;
  /** What is wrong with the journal: chain problems, a torn tail, the anchor's problem, and an entry that does not replay. */
  readonly problems: readonly JournalProblem[];
  /** How the journal stands against its anchor file; null when the read was not given the anchor. */
  readonly anchor: AnchorCheck | null;
  /** The first entry of the good prefix that does not replay (also among `problems`), or null. */
  readonly replayProblem: (JournalProblem & { readonly detail: string }) | null;
  /** The replay of the good prefix; null when not even the header can be read. */
  readonly replay: RunReplay | null;
  readonly damage: RunDamage | null;
  readonly history: readonly DecisionEvent[];
  readonly row: RunRow;
}

/** An intact read: nothing wrong with the journal, so a record of it is truthful. */
export type IntactRunRead = RunRead & { readonly replay: RunReplay; readonly fingerprint: string; readonly damage: null };

export interface RunFilter {
  readonly sourceId?: string;
  /** First and last start date included, `YYYY-MM-DD`, in the run's own recorded offset. */
  readonly from?: string;
  readonly to?: string;
  readonly outcome?: RunOutcome;
}

export class RunNotFoundError extends Error {
  readonly code = 'RUN_NOT_FOUND';
  constructor(readonly runId: string) {
    super(`there is no run ${runId} in this data folder`);
    this.name = 'RunNotFoundError';
  }
}

/** A run whose journal has no readable header: nothing of it can be shown but the damage. */
export class RunUnreadableError extends Error {
  readonly code = 'RUN_UNREADABLE';
  constructor(readonly runId: string, readonly damage: RunDamage) {
    super(`run ${runId} is damaged from seq ${damage.firstBadSeq} (${damage.problem}); nothing of it can be read`);
    this.name = 'RunUnreadableError';
  }
}

/** Thrown when a journal does not verify: a record of it would not be truthful. */
export class RunJournalUnverifiedError extends Error {
  readonly code = 'RUN_JOURNAL_UNVERIFIED';
  constructor(readonly runId: string, readonly problems: readonly JournalProblem[]) {
    const first = problems[0];
    super(
      `run ${runId}: the journal does not verify (${problems.length} problem${problems.length === 1 ? '' : 's'}; ` +
        `first at entry ${first?.seq ?? '?'}, line ${first?.line ?? '?'}: ${first?.problem ?? 'unknown'}); no record is made of it`,
    );
    this.name = 'RunJournalUnverifiedError';
  }
}

/** The read itself when its journal is intact; RunJournalUnverifiedError otherwise. */
export function requireIntact(read: RunRead): IntactRunRead {
  if (read.problems.length > 0 || read.replay === null || read.fingerprint === null) {
    const problems = read.problems.length > 0 ? read.problems : [{ seq: 0, line: 1, problem: 'the journal is empty', kind: 'tampered' as const }];
    throw new RunJournalUnverifiedError(read.runId, problems);
  }
  return read as IntactRunRead;
}

/** Whether a row passes every filter that is set. Dates compare as text: both are `YYYY-MM-DD`. */
export function matchesRunFilter(row: RunRow, filter: RunFilter): boolean {
  const startDate = row.startedAt?.slice(0, 10) ?? null;
  const dated = filter.from !== undefined || filter.to !== undefined;
  return (
    (filter.sourceId === undefined || row.sourceId === filter.sourceId) &&
    (filter.outcome === undefined || row.outcome === filter.outcome) &&
    (!dated || startDate !== null) &&
    (filter.from === undefined || (startDate !== null && startDate >= filter.from)) &&
    (filter.to === undefined || (startDate !== null && startDate <= filter.to))
  );
}

/** The Records place's list: the rows that pass the filter, and what the filter can offer. */
export interface RunHistory {
  /** Rows that pass the filter, in the order given (the catalogue lists newest start first). */
  readonly rows: RunRow[];
  /** Every source that has runs, by name. */
  readonly sources: Array<{ readonly id: string; readonly name: string }>;
  /** Runs before filtering. */
  readonly totalRuns: number;
  /** Runs whose journal is damaged, before filtering. */
  readonly damaged: number;
}

/** The run history of the Records place from every listed row and its filter. */
export function runHistory(every: readonly RunRow[], filter: RunFilter): RunHistory {
  const named = new Map<string, string>();
  for (const row of every) if (row.sourceId !== null && row.sourceName !== null) named.set(row.sourceId, row.sourceName);
  return {
    rows: every.filter((row) => matchesRunFilter(row, filter)),
    sources: [...named].map(([id, name]) => ({ id, name })).sort((a, b) => a.name.localeCompare(b.name)),
    totalRuns: every.length,
    damaged: every.filter((row) => row.outcome === 'damaged').length,
  };
}

/** Newest start first; rows without a readable start last; then by run id. */
export function compareRows(a: RunRow, b: RunRow): number {
  const time = (row: RunRow) => (row.startedAt === null ? -Infinity : Date.parse(row.startedAt));
  return time(b) - time(a) || a.runId.localeCompare(b.runId);
}

/**
 * Reads the bytes of one journal: a verified, replayed picture of the run. Pure apart from its input.
 * With the anchor file's bytes (null when there is none) the journal is also checked against its
 * anchor; `laterAnchorBytes` is the anchor read again after the journal (see checkAnchor).
 */
export function readRunBytes(runId: string, bytes: Buffer, anchorFile?: Buffer | null, laterAnchorBytes?: Buffer | null): RunRead {
  const analysis = analyseJournal(bytes);
  const anchor = anchorFile === undefined ? null : checkAnchor(analysis, anchorFile, laterAnchorBytes);
  const problems: JournalProblem[] = [...(anchor === null ? analysis.problems : withAnchor(analysis, anchor).problems)];
  const firstChainBreak = Math.min(Infinity, ...problems.filter((problem) => problem.kind === 'tampered').map((problem) => problem.seq));

  // The good prefix: entries in sequence from 0, before the first break of the chain.
  const prefix: JournalEntry[] = [];
  for (const entry of analysis.entries) {
    if (entry.seq !== prefix.length || entry.seq >= firstChainBreak) break;
    prefix.push(entry);
  }

  let replay: RunReplay | null = null;
  let replayProblem: (JournalProblem & { readonly detail: string }) | null = null;
  const history: DecisionEvent[] = [];
  const entries: JournalEntry[] = [];
  try {
    for (const entry of prefix) {
      if (replay === null) replay = RunReplay.fromEntries([entry]);
      else replay.apply(entry);
      entries.push(entry);
      const event = decisionEvent(entry, replay);
      if (event !== null) history.push(event);
    }
  } catch (error) {
    if (!(error instanceof RunJournalContentError)) throw error;
    replayProblem = { seq: error.seq, line: error.seq + 1, problem: error.message, kind: 'tampered', detail: error.detail };
    problems.push(replayProblem);
    problems.sort((a, b) => a.line - b.line);
  }
  if (replay === null && replayProblem === null && prefix.length === 0) {
    const problem = analysis.entries.length === 0 ? 'the journal holds no entry' : 'entry 0 (the header) is missing';
    if (!problems.some((found) => found.kind === 'tampered')) problems.unshift({ seq: 0, line: 1, problem, kind: 'tampered' });
  }

  const firstTampered = problems.filter((problem) => problem.kind === 'tampered').sort((a, b) => a.seq - b.seq)[0];
  const damage: RunDamage | null = firstTampered === undefined ? null : { firstBadSeq: firstTampered.seq, problem: firstTampered.problem };
  return { runId, entries, entriesRead: analysis.entries.length, fingerprint: analysis.fingerprint, problems, anchor, replayProblem, replay, damage, history, row: rowOf(runId, replay, entries, damage) };
}

function decisionEvent(entry: JournalEntry, replay: RunReplay): DecisionEvent | null {
  const at = localTimestamp(entry.time, entry.offset);
  if (entry.kind === 'close' && replay.lastClose !== null) {
    const { decision, rule, n } = replay.lastClose;
    return { kind: 'decision', seq: entry.seq, at, actor: entry.actor, decision, rule, itemsInspected: n };
  }
  if (entry.kind === 'override') {
    return { kind: 'reopened', seq: entry.seq, at, actor: entry.actor, reason: (entry.payload as { reason: string }).reason };
  }
  return null;
}

/** Where a replayed run stands. */
export function outcomeOf(replay: RunReplay | null, damage: RunDamage | null): RunOutcome {
  if (damage !== null || replay === null) return 'damaged';
  if (replay.status === 'closed') return replay.lastClose?.decision === 'reject' ? 'rejected' : 'accepted';
  return replay.lastClose === null ? 'open' : 'reopened';
}

function rowOf(runId: string, replay: RunReplay | null, entries: readonly JournalEntry[], damage: RunDamage | null): RunRow {
  const outcome = outcomeOf(replay, damage);
  if (replay === null) {
    return {
      runId, outcome, sourceId: null, sourceName: null, lot: null, planId: null, planName: null, planVersion: null, model: null,
      part: null, characteristic: null, startedAt: null, endedAt: null, rule: null, itemsInspected: 0, nonconformingFound: 0, damage,
    };
  }
  const { run, plan, source } = replay.header;
  const standing = outcome === 'accepted' || outcome === 'rejected';
  const closeEntry = standing ? entries.findLast((entry) => entry.kind === 'close') : undefined;
  const model = plan.spec.model;
  return {
    runId,
    outcome,
    sourceId: source.id,
    sourceName: source.name,
    lot: run.lot,
    planId: plan.id,
    planName: plan.name,
    planVersion: plan.version,
    model,
    part: plan.part ?? null,
    characteristic: plan.characteristic ?? null,
    startedAt: localTimestamp(entries[0].time, entries[0].offset, { milliseconds: true }),
    endedAt: closeEntry === undefined ? null : localTimestamp(closeEntry.time, closeEntry.offset, { milliseconds: true }),
    rule: standing ? (replay.lastClose?.rule ?? null) : null,
    itemsInspected: replay.n,
    // Only a model whose total counts nonconforming items or nonconformities (labels.pooledRate) has one; a sum of measurements, failures or demerits is not.
    nonconformingFound: modelLabels(model).pooledRate === null ? 0 : replay.total,
    damage,
  };
}

/** What a journal file looks like from outside; a row stays valid while this does not change. */
function fileKey(stats: Stats): string {
  return `${stats.size}:${stats.mtimeMs}:${stats.ctimeMs}:${stats.ino}`;
}

const JOURNAL_SUFFIX = '.journal';
/** Journals read at once by a listing: enough to keep the disk busy, well below the open-file limit. */
const READS_AT_ONCE = 16;

export type RunCatalogue = ReturnType<typeof createRunCatalogue>;

export function createRunCatalogue(dataDirectory: string) {
  const rows = new Map<string, { readonly key: string; readonly row: RunRow }>();
  let journalsRead = 0;

  async function readRun(runId: string): Promise<RunRead> {
    const journalPath = layout.runJournal(dataDirectory, checkId('run', runId));
    let handle;
    try {
      handle = await open(journalPath, 'r');
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code === 'ENOENT') throw new RunNotFoundError(runId);
      throw error;
    }
    try {
      // The key is taken before the bytes: a change during the read makes the next listing read again.
      // The anchor is read before the journal: a writer fsyncs the journal before it replaces the anchor.
      const key = fileKey(await handle.stat());
      const anchorFile = await readAnchorBytes(journalPath);
      const bytes = await handle.readFile();
      let read = readRunBytes(runId, bytes, anchorFile);
      // A busy writer can be several entries past the anchor read first: read the anchor again.
      if (read.anchor?.status === 'ahead') read = readRunBytes(runId, bytes, anchorFile, await readAnchorBytes(journalPath));
      journalsRead += 1;
      rows.set(runId, { key, row: read.row });
      return read;
    } finally {
      await handle.close();
    }
  }

  /** The row of one run, from memory while its journal is unchanged; a journal that cannot be read at all is a damaged row. */
  async function cachedRow(runId: string, stats: Stats): Promise<RunRow | null> {
    const known = rows.get(runId);
    if (known !== undefined && known.key === fileKey(stats)) return known.row;
    try {
      return (await readRun(runId)).row;
    } catch (error) {
      if (error instanceof RunNotFoundError) return null;
      const problem = `the journal cannot be read: ${(error as Error).message}`;
      return { ...unreadableRow(runId), damage: { firstBadSeq: 0, problem } };
    }
  }

  return {
    readRun,

    /** How many journals this catalogue has read and verified so far (what a listing of unchanged runs avoids). */
    get journalsRead(): number {
      return journalsRead;
    },

    /** Every run that passes the filter, newest start first. */
    async listRuns(filter: RunFilter = {}): Promise<RunRow[]> {
      const folder = layout.runsFolder(dataDirectory);
      const ids = (await folderNames(folder))
        .filter((name) => name.endsWith(JOURNAL_SUFFIX))
        .map((name) => name.slice(0, -JOURNAL_SUFFIX.length));
      const found: RunRow[] = [];
      let next = 0;
      const worker = async () => {
        while (next < ids.length) {
          const runId = ids[next++];
          const stats = await stat(path.join(folder, `${runId}${JOURNAL_SUFFIX}`)).catch(() => null);
          const row = stats === null ? null : await cachedRow(runId, stats);
          if (row !== null) found.push(row);
        }
      };
      await Promise.all(Array.from({ length: Math.min(READS_AT_ONCE, ids.length) }, worker));
      const present = new Set(ids);
      for (const runId of rows.keys()) if (!present.has(runId)) rows.delete(runId);
      return found.filter((row) => matchesRunFilter(row, filter)).sort(compareRows);
    },
  };
}

function unreadableRow(runId: string): RunRow {
  return rowOf(runId, null, [], { firstBadSeq: 0, problem: '' });
}
