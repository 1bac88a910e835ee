/**
 * The Inspect place's state: the runs on record, the one run active in this window, what the
 * inspector is typing, and the entries on their way to disk. An entry shows as taken only once the
 * main side answers that it is written and fsync'd; until then it is a pending row. Requests go out
 * one after another, so entries reach the journal in the order they were keyed.
 */
import { request } from '../../lib/channelClient';
import type { InspectionEntry, InspectionRunView, InspectionStep } from '../../../../src-main/api/channels/inspectionChannels';
import type { ItemResult } from '../../../../src-main/inspection/runTypes';
import type { RunRow } from '../../../../src-main/inspection/runCatalogue';
import type { ChannelResult } from '../../../../src-main/api/result';

/** One result as keyed, per model (see inspectionChannels.ts). */
export type EntryResult = ItemResult;

/** A result keyed but not yet confirmed by the main side, or refused by it. */
export interface PendingEntry {
  readonly key: number;
  readonly itemId: string | null;
  readonly result: EntryResult;
  readonly category: string | null;
  readonly note: string | null;
  /** Why the main side did not take it; null while it is on its way. */
  readonly refusal: string | null;
}

const inspectorKey = 'tallyline.inspect.inspector';

/** The inspector's typing for the next entry; kept across refusals so nothing typed is lost. */
class EntryDraft {
  itemId = $state('');
  /** The scan ended with Enter (shown beside the field). */
  scanEnded = $state(false);
  category = $state('');
  note = $state('');
  count = $state('');
  /** A measured value (measurement plans) or an accumulated test time reading (time-to-failure plans). */
  reading = $state('');

  clearAfterEntry(result: EntryResult): void {
    this.itemId = '';
    this.scanEnded = false;
    this.count = '';
    this.reading = '';
    if (result !== 'pass') {
      this.category = '';
      this.note = '';
    }
  }

  /** Puts a refused entry's text back into empty fields. */
  restore(entry: PendingEntry): void {
    if (this.itemId === '' && entry.itemId !== null) this.itemId = entry.itemId;
    if (this.category === '' && entry.category !== null) this.category = entry.category;
    if (this.note === '' && entry.note !== null) this.note = entry.note;
    if (this.count === '' && typeof entry.result === 'number') this.count = String(entry.result);
    const result = entry.result;
    if (this.reading === '' && typeof result === 'object') {
      if ('value' in result) this.reading = String(result.value);
      else if ('time' in result && result.time !== undefined) this.reading = String(result.time);
    }
  }
}

/** The start form's fields, kept while the inspector visits other places. */
class StartDraft {
  planId = $state('');
  /** The version as chosen in the list; '' for the latest. */
  planVersion = $state('');
  sourceId = $state('');
  lot = $state('');
  lotSize = $state('');
  inspector = $state(localStorage.getItem(inspectorKey) ?? '');
  note = $state('');

  /** Remembers the inspector on this machine and clears what belongs to one lot. */
  started(): void {
    localStorage.setItem(inspectorKey, this.inspector.trim());
    this.lot = '';
    this.lotSize = '';
    this.note = '';
  }
}

const activeRunKey = 'tallyline.inspect.activeRun';
/** How often a run held by another program is checked (a lock-file read on the main side). */
const holdPollMilliseconds = 1500;

export class InspectSession {
  runs = $state.raw<RunRow[]>([]);
  runsProblem = $state<string | null>(null);
  /** The active run: its header, plan, state, live look-ahead and chart frame (its entries are in `entries`). */
  view = $state.raw<InspectionRunView | null>(null);
  entries = $state.raw<InspectionEntry[]>([]);
  pending = $state.raw<PendingEntry[]>([]);
  /** A refusal of something other than an entry (void, override, opening). */
  problem = $state<string | null>(null);
  opening = $state(false);
  /** The run last left with "All runs": its line in the list takes the focus. */
  lastLeftRunId = $state<string | null>(null);
  readonly draft = new EntryDraft();
  readonly startDraft = new StartDraft();

  private chain: Promise<unknown> = Promise.resolve();
  /** Polls, while another program holds the active run, for the moment it lets go. */
  private holdWatch: ReturnType<typeof setInterval> | null = null;
  private nextKey = 1;

  /** The run this window was showing before a reload, if any. */
  get rememberedRunId(): string | null {
    return sessionStorage.getItem(activeRunKey);
  }

  async refreshRuns(): Promise<void> {
    const result = await request('inspection.list', null);
    if (result.ok) {
      this.runs = result.value;
      this.runsProblem = null;
    } else {
      this.runsProblem = result.message;
    }
  }

  /** Makes a run the active one in this window (a started run, or one reopened from the list). */
  show(view: InspectionRunView): void {
    this.view = { ...view, entries: [] };
    this.entries = view.entries;
    this.pending = [];
    this.problem = null;
    sessionStorage.setItem(activeRunKey, view.run.id);
    this.watchHold(view);
  }

  /**
   * A run shown read-only only because another program (a command-line `feed`) holds it is opened
   * again for writing as soon as that program lets go. The check reads one small lock file.
   */
  private watchHold(view: InspectionRunView): void {
    this.stopWatch();
    if (view.writable || view.problems.length > 0) return;
    const runId = view.run.id;
    this.holdWatch = setInterval(async () => {
      const answer = await request('inspection.held', { runId });
      if (this.view?.run.id !== runId || this.holdWatch === null) return;
      if (answer.ok && !answer.value.held) {
        this.stopWatch();
        await this.open(runId);
      }
    }, holdPollMilliseconds);
  }

  private stopWatch(): void {
    if (this.holdWatch !== null) clearInterval(this.holdWatch);
    this.holdWatch = null;
  }

  async open(runId: string): Promise<void> {
    this.opening = true;
    const result = await request('inspection.open', { runId });
    this.opening = false;
    if (result.ok) {
      this.show(result.value);
    } else {
      if (result.code === 'not-found') sessionStorage.removeItem(activeRunKey);
      this.problem = result.message;
    }
  }

  /** Leaves the active run (it stays as it is on disk) and goes back to the list. */
  leave(): void {
    this.lastLeftRunId = this.view?.run.id ?? null;
    this.stopWatch();
    this.view = null;
    this.entries = [];
    this.pending = [];
    this.problem = null;
    sessionStorage.removeItem(activeRunKey);
    void this.refreshRuns();
  }

  /** Keys one result: shown pending at once, taken when the main side confirms it. */
  record(result: EntryResult): void {
    const view = this.view;
    if (view === null) return;
    const draft = this.draft;
    const entry: PendingEntry = {
      key: this.nextKey++,
      itemId: draft.itemId.trim() || null,
      result,
      category: result === 'pass' ? null : draft.category.trim() || null,
      note: result === 'pass' ? null : draft.note.trim() || null,
      refusal: null,
    };
    draft.clearAfterEntry(result);
    this.pending = [...this.pending, entry];
    const runId = view.run.id;
    this.enqueue(async () => {
      const answer = await request('inspection.record', {
        runId,
        result: entry.result,
        itemId: entry.itemId,
        category: entry.category,
        note: entry.note,
      });
      if (this.view?.run.id !== runId) return;
      if (answer.ok) {
        this.pending = this.pending.filter((waiting) => waiting.key !== entry.key);
        this.apply(answer.value);
      } else {
        this.pending = this.pending.map((waiting) => (waiting.key === entry.key ? { ...waiting, refusal: answer.message } : waiting));
        this.draft.restore(entry);
      }
    });
  }

  /** Clears refused entries from view once the inspector has read them. */
  dismissRefused(): void {
    this.pending = this.pending.filter((entry) => entry.refusal === null);
  }

  /** Voids the last counted entry; true when the main side took the void. */
  voidLast(reason: string): Promise<boolean> {
    return this.append((runId) => request('inspection.void', { runId, reason }));
  }

  /** Records why more entries are made after the decision; true when it was taken. */
  override(reason: string): Promise<boolean> {
    return this.append((runId) => request('inspection.override', { runId, reason }));
  }

  private append(send: (runId: string) => Promise<ChannelResult<InspectionStep>>): Promise<boolean> {
    const view = this.view;
    if (view === null) return Promise.resolve(false);
    const runId = view.run.id;
    return this.enqueue(async () => {
      const answer = await send(runId);
      if (this.view?.run.id !== runId) return false;
      if (!answer.ok) {
        this.problem = answer.message;
        return false;
      }
      this.problem = null;
      this.apply(answer.value);
      return true;
    });
  }

  private enqueue<Value>(work: () => Promise<Value>): Promise<Value> {
    const next = this.chain.then(work);
    this.chain = next.catch(() => undefined);
    return next;
  }

  private apply(step: InspectionStep): void {
    const view = this.view;
    if (view === null) return;
    const entry = step.entry;
    if (entry !== null) {
      const known = this.entries.findIndex((existing) => existing.seq === entry.seq);
      this.entries = known < 0 ? [...this.entries, entry] : this.entries.with(known, entry);
    }
    this.view = { ...view, run: { ...view.run, ...step.run }, state: step.state, live: step.live, frame: step.frame };
  }
}

export const inspectSession = new InspectSession();
