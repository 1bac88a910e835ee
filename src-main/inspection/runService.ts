/**
 * The run service: start runs, record results, void, override after a decision, list and open runs.
 * Every change is one journal append, acknowledged only once it is on disk; the run closes itself
 * with the engine's decision and rule as soon as the statistics reach one.
 */
import { readFile } from 'node:fs/promises';
import type { PlanSpec } from '../engine/index.js';
import {
  JournalBusyError,
  JournalTamperedError,
  JournalWriter,
  PlanRepository,
  SourceRepository,
  analyseJournal,
  checkId,
  folderNames,
  layout,
  newId,
  type JournalProblem,
  type QuarantineRecord,
} from '../store/index.js';
import { RunReplay } from './runReplay.js';
import { canonicalResult } from './runState.js';
import type { ItemResult, RunEntryView, RunState, RunSummary, RunView } from './runTypes.js';

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
      const handle: OpenRun = {
        writer: opened.writer,
        replay: RunReplay.fromEntries(opened.entries),
        recovered: opened.recovered?.record ?? null,
      };
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

  function view(replay: RunReplay, extra: Pick<RunView, 'writable' | 'problems' | 'recovered'> & { fingerprint: string | null }): RunView {
    const state = stateOf(replay);
    const close = replay.status === 'closed' ? replay.lastClose : null;
    return {
      run: {
        ...replay.header.run,
        status: replay.status,
        sourceName: replay.header.source.name,
        closedAt: close?.time ?? null,
        decision: close?.decision ?? null,
        rule: close?.rule ?? null,
        fingerprint: extra.fingerprint,
      },
      plan: replay.header.plan,
      entries: replay.results.map((entry) => ({ ...entry })),
      state,
      writable: extra.writable,
      problems: extra.problems,
      recovered: extra.recovered,
    };
  }

  /** A read-only picture of a run straight from its file (used when it cannot be opened for writing). */
  async function readOnly(runId: string): Promise<{ replay: RunReplay; problems: JournalProblem[]; fingerprint: string | null }> {
    const analysis = analyseJournal(await readFile(layout.runJournal(dataDirectory, runId)));
    return { replay: RunReplay.fromEntries(analysis.entries), problems: analysis.problems, fingerprint: analysis.fingerprint };
  }

  async function readOnlyView(runId: string): Promise<RunView> {
    const found = await readOnly(runId);
    return view(found.replay, { writable: false, problems: found.problems, recovered: null, fingerprint: found.fingerprint });
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
      return view(handle.replay, { writable: true, problems: [], recovered: null, fingerprint: handle.writer.fingerprint });
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
          return view(handle.replay, { writable: true, problems: [], recovered: handle.recovered, fingerprint: handle.writer.fingerprint });
        } catch (error) {
          if (!(error instanceof RunNotWritableError)) throw error;
          return readOnlyView(runId);
        }
      });
    },

    /** A run as it is on disk, without taking its lock or repairing anything (for viewers and `run show`). */
    async readRun(runId: string): Promise<RunView> {
      const cached = open.get(checkId('run', runId));
      if (cached !== undefined) {
        return view(cached.replay, { writable: true, problems: [], recovered: cached.recovered, fingerprint: cached.writer.fingerprint });
      }
      return readOnlyView(runId);
    },

    /** Every run in the data directory, newest first, each journal read back and its chain verified. */
    async listRuns(): Promise<RunSummary[]> {
      const names = await folderNames(layout.runsFolder(dataDirectory));
      const ids = names.filter((name) => name.endsWith('.journal')).map((name) => name.slice(0, -'.journal'.length));
      const summaries = await Promise.all(
        ids.map(async (id): Promise<RunSummary> => {
          const { replay, problems } = await readOnly(id);
          const state = stateOf(replay);
          const { run, plan, source } = replay.header;
          return {
            id,
            lot: run.lot,
            sourceId: run.sourceId,
            sourceName: source.name,
            planId: plan.id,
            planVersion: plan.version,
            planName: plan.name,
            createdAt: run.createdAt,
            status: replay.status,
            decision: state.decision,
            n: state.n,
            total: state.total,
            ok: problems.length === 0,
            problems,
          };
        }),
      );
      return summaries.sort((a, b) => b.createdAt.localeCompare(a.createdAt));
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
