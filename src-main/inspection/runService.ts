/**
 * The run service: start runs, record results, void, override after a decision, open runs for
 * writing. Reading and listing runs is the catalogue's (runCatalogue.ts). Every change is one
 * journal append, acknowledged only once it is on disk; the run closes itself with the engine's
 * decision and rule as soon as the statistics reach one.
 */
import type { PlanSpec } from '../engine/index.js';
import {
  JournalBusyError,
  JournalTamperedError,
  JournalWriter,
  PlanRepository,
  SourceRepository,
  checkId,
  liveLockOwner,
  lockPathFor,
  layout,
  newId,
  type QuarantineRecord,
} from '../store/index.js';
import { createRunCatalogue, RunUnreadableError, type RunCatalogue } from './runCatalogue.js';
import { RunJournalContentError, RunReplay } from './runReplay.js';
import { runView } from './runView.js';
import { canonicalResult } from './runState.js';
import type { ItemResult, RunEntryView, RunState, RunView } from './runTypes.js';

export interface StartRunInput {
  readonly planId: string;
  /** The plan version to run; the latest when omitted. */
  readonly planVersion?: number;
  readonly sourceId: string;
  readonly lot: string;
  readonly lotSize?: number | null;
  readonly inspector?: string | null;
  readonly note?: string | null;
}

export interface ResultInput {
  readonly itemId?: string | null;
  readonly result: ItemResult;
  readonly category?: string | null;
  readonly note?: string | null;
  readonly actor: string;
}

/** What an append did: the entry it took, the state after it, and the close it caused, if any. */
export interface RecordOutcome {
  readonly seq: number;
  readonly entry: RunEntryView | null;
  readonly state: RunState;
  readonly closedWith: RunState | null;
}

export class RunClosedError extends Error {
  readonly code = 'RUN_CLOSED';
  constructor(readonly runId: string, decision: string) {
    super(`run ${runId} is closed with "${decision}": record an override with a reason before entering more`);
    this.name = 'RunClosedError';
  }
}

/** A result that does not fit the run's plan (wrong shape for the model, a test time going down, an unknown class). */
export class ResultRefusedError extends Error {
  readonly code = 'RESULT_REFUSED';
  constructor(readonly model: string, problem: string) {
    super(problem);
    this.name = 'ResultRefusedError';
  }
}

export class RunNotWritableError extends Error {
  readonly code = 'RUN_NOT_WRITABLE';
  constructor(readonly runId: string, reason: string) {
    super(`run ${runId} cannot be written: ${reason}`);
    this.name = 'RunNotWritableError';
  }
}

export interface RunServiceOptions {
  readonly dataDirectory: string;
  readonly clock?: () => Date;
  /** Who starts runs when the input names no inspector. */
  readonly defaultActor?: string;
  /**
   * How long a run's journal stays open (and locked) after its last use, in ms (default 30 s).
   * Letting go when idle lets another writer, such as a station's `feed`, take the run over.
   */
  readonly idleReleaseMs?: number;
  /** The catalogue read-only views come from; one of its own when not given. */
  readonly catalogue?: RunCatalogue;
}

interface OpenRun {
  readonly writer: JournalWriter;
  readonly replay: RunReplay;
  readonly recovered: QuarantineRecord | null;
}

export type RunService = ReturnType<typeof createRunService>;

export function createRunService(options: RunServiceOptions) {
  const { dataDirectory } = options;
  const clock = options.clock ?? (() => new Date());
  const plans = new PlanRepository(dataDirectory, clock);
  const sources = new SourceRepository(dataDirectory, clock);
  const open = new Map<string, OpenRun>();
  const queues = new Map<string, Promise<unknown>>();
  const idleTimers = new Map<string, NodeJS.Timeout>();
  const idleReleaseMs = options.idleReleaseMs ?? 30_000;
  const catalogue = options.catalogue ?? createRunCatalogue(dataDirectory);

  /** Closes a run's journal once it has not been used for idleReleaseMs; every use restarts the wait. */
  function releaseWhenIdle(runId: string): void {
    clearTimeout(idleTimers.get(runId));
    const timer = setTimeout(() => {
      idleTimers.delete(runId);
      void exclusive(runId, async () => {
        const handle = open.get(runId);
        open.delete(runId);
        await handle?.writer.close();
      });
    }, idleReleaseMs);
    timer.unref();
    idleTimers.set(runId, timer);
  }

  /** Operations on one run run one after another, so a check and the append it allows never interleave. */
  function exclusive<Value>(runId: string, operation: () => Promise<Value>): Promise<Value> {
    const result = (queues.get(runId) ?? Promise.resolve()).then(operation);
    queues.set(runId, result.catch(() => undefined));
    return result;
  }

  async function writable(runId: string): Promise<OpenRun> {
    const cached = open.get(runId);
    if (cached !== undefined) {
      releaseWhenIdle(runId);
      return cached;
    }
    try {
      const opened = await JournalWriter.open(layout.runJournal(dataDirectory, runId), clock);
      let replay: RunReplay;
      try {
        replay = RunReplay.fromEntries(opened.entries);
      } catch (error) {
        // The chain holds but an entry is not one this app writes: read-only, like a broken chain.
        await opened.writer.close();
        throw error instanceof RunJournalContentError ? new RunNotWritableError(runId, error.message) : error;
      }
      const handle: OpenRun = { writer: opened.writer, replay, recovered: opened.recovered?.record ?? null };
      open.set(runId, handle);
      releaseWhenIdle(runId);
      return handle;
    } catch (error) {
      if (error instanceof JournalTamperedError || error instanceof JournalBusyError) {
        throw new RunNotWritableError(runId, error.message);
      }
      throw error;
    }
  }

  function stateOf(replay: RunReplay): RunState {
    return replay.evidence.state();
  }

  /** Close the run when the statistics have reached a decision (or the truncation point). */
  async function closeIfDecided(handle: OpenRun, actor: string): Promise<RunState | null> {
    const state = stateOf(handle.replay);
    if (state.decision === 'continue' || handle.replay.status === 'closed') return null;
    const payload = { decision: state.decision, rule: state.rule ?? '', n: state.n, total: state.total, llr: state.llr };
    handle.replay.apply(await handle.writer.append('close', actor, payload));
    return state;
  }

  function openForEntry(runId: string, handle: OpenRun): void {
    if (handle.replay.status === 'closed') throw new RunClosedError(runId, handle.replay.lastClose?.decision ?? 'decided');
  }

  /** A read-only picture of a run from the catalogue (used when it cannot be opened for writing). */
  async function readOnlyView(runId: string): Promise<RunView> {
    const read = await catalogue.readRun(runId);
    if (read.replay === null) throw new RunUnreadableError(runId, read.damage ?? { firstBadSeq: 0, problem: 'no header' });
    return runView(read.replay, { writable: false, problems: [...read.problems], recovered: null, fingerprint: read.fingerprint, damage: read.damage });
  }

  return {
    async startRun(input: StartRunInput): Promise<RunView> {
      const plan = await plans.get(input.planId, input.planVersion);
      const source = await sources.get(checkId('source', input.sourceId));
      if (source.retired) throw new Error(`source ${source.name} (${source.id}) is retired`);
      const lot = input.lot.trim();
      if (lot === '') throw new Error('a run needs a lot or batch id');
      if (input.lotSize != null && !(Number.isInteger(input.lotSize) && input.lotSize > 0)) {
        throw new Error(`lotSize must be a whole number above 0, not ${input.lotSize}`);
      }
      const runId = newId('run', clock());
      const run = {
        id: runId,
        planId: plan.id,
        planVersion: plan.version,
        sourceId: source.id,
        lot,
        lotSize: input.lotSize ?? null,
        inspector: input.inspector?.trim() || null,
        note: input.note?.trim() || null,
        createdAt: clock().toISOString(),
      };
      const actor = run.inspector ?? options.defaultActor ?? 'inspector';
      const created = await JournalWriter.create(
        layout.runJournal(dataDirectory, runId),
        actor,
        { run, plan, source: { id: source.id, name: source.name } },
        clock,
      );
      const handle: OpenRun = { writer: created.writer, replay: RunReplay.fromEntries(created.entries), recovered: null };
      open.set(runId, handle);
      releaseWhenIdle(runId);
      return runView(handle.replay, { writable: true, problems: [], recovered: null, fingerprint: handle.writer.fingerprint, damage: null });
    },

    recordResult(runId: string, input: ResultInput): Promise<RecordOutcome> {
      return exclusive(runId, async () => {
        const handle = await writable(runId);
        openForEntry(runId, handle);
        const spec = handle.replay.header.plan.spec;
        const problem = handle.replay.evidence.problem(input.result);
        if (problem !== null) throw new ResultRefusedError(spec.model, problem);
        const entry = await handle.writer.append('result', input.actor, {
          itemId: input.itemId?.trim() || null,
          result: canonicalResult(spec, input.result),
          category: input.category?.trim() || null,
          note: input.note?.trim() || null,
        });
        handle.replay.apply(entry);
        const closedWith = await closeIfDecided(handle, input.actor);
        return { seq: entry.seq, entry: handle.replay.results.at(-1) ?? null, state: stateOf(handle.replay), closedWith };
      });
    },

    voidLastEntry(runId: string, reason: string, actor: string): Promise<RecordOutcome> {
      return exclusive(runId, async () => {
        const handle = await writable(runId);
        openForEntry(runId, handle);
        if (reason.trim() === '') throw new Error('voiding an entry needs a reason');
        const target = handle.replay.lastCountedResult();
        if (target === undefined) throw new Error(`run ${runId} has no counted result to void`);
        const entry = await handle.writer.append('void', actor, { target: target.seq, reason: reason.trim() });
        handle.replay.apply(entry);
        const closedWith = await closeIfDecided(handle, actor);
        return { seq: entry.seq, entry: { ...target }, state: stateOf(handle.replay), closedWith };
      });
    },

    overrideAfterDecision(runId: string, reason: string, actor: string): Promise<RecordOutcome> {
      return exclusive(runId, async () => {
        const handle = await writable(runId);
        if (handle.replay.status !== 'closed') throw new Error(`run ${runId} has not reached a decision: no override needed`);
        if (reason.trim() === '') throw new Error('entering results after a decision needs a reason');
        const entry = await handle.writer.append('override', actor, { reason: reason.trim() });
        handle.replay.apply(entry);
        return { seq: entry.seq, entry: null, state: stateOf(handle.replay), closedWith: null };
      });
    },

    /** Open a run: for writing when possible (quarantining a torn tail), else read-only with its problems. */
    openRun(runId: string): Promise<RunView> {
      return exclusive(runId, async () => {
        checkId('run', runId);
        try {
          const handle = await writable(runId);
          return runView(handle.replay, { writable: true, problems: [], recovered: handle.recovered, fingerprint: handle.writer.fingerprint, damage: null });
        } catch (error) {
          if (!(error instanceof RunNotWritableError)) throw error;
          return readOnlyView(runId);
        }
      });
    },

    /** Whether another live process holds the run's journal for writing (reads only its lock file). */
    async heldElsewhere(runId: string): Promise<boolean> {
      if (open.has(checkId('run', runId))) return false;
      const holder = await liveLockOwner(lockPathFor(layout.runJournal(dataDirectory, runId)));
      return holder !== null && holder.pid !== process.pid;
    },

    /** Release every journal handle and lock this service holds. */
    async close(): Promise<void> {
      for (const timer of idleTimers.values()) clearTimeout(timer);
      idleTimers.clear();
      const handles = [...open.values()];
      open.clear();
      await Promise.all(handles.map((handle) => handle.writer.close()));
    },
  };
}
