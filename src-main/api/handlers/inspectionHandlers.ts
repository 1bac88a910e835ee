import { decide, limitRows, liveState, resolvePlan, type LiveState, type PlanSpec } from '../../engine/index.js';
import {
  RunClosedError,
  RunNotWritableError,
  createRunService,
  resultProblem,
  resultTotal,
  type RecordOutcome,
  type RunEntryView,
  type RunView,
} from '../../inspection/index.js';
import { PlanRepository, SourceRepository } from '../../store/index.js';
import type { EvidenceFrame, InspectionEntry, InspectionRunView, InspectionStep } from '../channels/inspectionChannels.js';
import type { ChannelHandlers } from '../dispatcher.js';
import { ChannelFailure } from '../result.js';

type InspectionHandlers = Pick<
  ChannelHandlers,
  'inspection.start' | 'inspection.list' | 'inspection.open' | 'inspection.record' | 'inspection.void' | 'inspection.override'
>;

export interface InspectionHandlerContext {
  dataDirectory: string;
}

/** What a handler needs to know of a run between requests: fixed at its start. */
interface KnownRun {
  readonly spec: PlanSpec;
  readonly actor: string;
}

/** Items drawn beyond the furthest point the run can reach next, so the steps ahead stay in view. */
const HORIZON_MARGIN = 1.25;
const MINIMUM_HORIZON = 10;

export function createInspectionHandlers(context: InspectionHandlerContext): InspectionHandlers {
  const service = createRunService({ dataDirectory: context.dataDirectory });
  const plans = new PlanRepository(context.dataDirectory);
  const sources = new SourceRepository(context.dataDirectory);
  const known = new Map<string, KnownRun>();

  function remember(view: RunView): InspectionRunView {
    known.set(view.run.id, { spec: view.plan.spec, actor: view.run.inspector ?? 'inspector' });
    const live = liveState(view.plan.spec, view.state.n, view.state.total);
    return { ...view, entries: withStatistics(view.plan.spec, view.entries), live, frame: evidenceFrame(view.plan.spec, live) };
  }

  async function knownRun(runId: string): Promise<KnownRun> {
    const found = known.get(runId);
    if (found !== undefined) return found;
    remember(await translated(() => service.openRun(runId), runId));
    return known.get(runId) as KnownRun;
  }

  /** The answer to an append; the run's header is read again only when the append changed its status. */
  async function step(runId: string, kind: InspectionStep['kind'], outcome: RecordOutcome, spec: PlanSpec): Promise<InspectionStep> {
    const live = liveState(spec, outcome.state.n, outcome.state.total);
    const statusChanged = outcome.closedWith !== null || kind === 'override';
    const { status, decision, rule, closedAt } = statusChanged
      ? (await service.openRun(runId)).run
      : { status: 'open' as const, decision: null, rule: null, closedAt: null };
    const taken = outcome.entry;
    const entry: InspectionEntry | null =
      taken === null ? null : { ...taken, after: taken.voided ? null : { n: outcome.state.n, total: outcome.state.total, llr: outcome.state.llr } };
    return { seq: outcome.seq, kind, entry, run: { status, decision, rule, closedAt }, state: outcome.state, live, frame: evidenceFrame(spec, live) };
  }

  return {
    'inspection.start': async ({ planId, planVersion, sourceId, lot, lotSize, inspector, note }) => {
      const versions = await plans.versions(planId);
      if (versions.length === 0) throw new ChannelFailure('not-found', `There is no saved plan with id ${planId}.`, 'planId');
      if (planVersion !== undefined && !versions.includes(planVersion)) {
        throw new ChannelFailure('not-found', `Plan ${planId} has no version ${planVersion}; it has ${versions.map((v) => `v${v}`).join(', ')}.`, 'planVersion');
      }
      const source = await sources.get(sourceId).catch(() => undefined);
      if (source === undefined) throw new ChannelFailure('not-found', `There is no source with id ${sourceId}.`, 'sourceId');
      if (source.retired) throw new ChannelFailure('conflict', `The source ${source.name} is retired; runs can no longer start on it.`, 'sourceId');
      return remember(await service.startRun({ planId, planVersion, sourceId, lot, lotSize, inspector, note }));
    },

    'inspection.list': () => service.listRuns(),

    'inspection.open': async ({ runId }) => remember(await translated(() => service.openRun(runId), runId)),

    'inspection.record': async ({ runId, itemId, result, category, note, actor }) => {
      const run = await knownRun(runId);
      const problem = resultProblem(run.spec, result);
      if (problem !== null) throw new ChannelFailure('invalid-parameter', `This run's plan is ${run.spec.model}: ${problem}.`, 'result');
      const outcome = await translated(
        () => service.recordResult(runId, { itemId, result, category, note, actor: actor ?? run.actor }),
        runId,
      );
      return step(runId, 'result', outcome, run.spec);
    },

    'inspection.void': async ({ runId, reason, actor }) => {
      const run = await knownRun(runId);
      const outcome = await translated(() => service.voidLastEntry(runId, reason, actor ?? run.actor), runId);
      return step(runId, 'void', outcome, run.spec);
    },

    'inspection.override': async ({ runId, reason, actor }) => {
      const run = await knownRun(runId);
      const outcome = await translated(() => service.overrideAfterDecision(runId, reason, actor ?? run.actor), runId);
      return step(runId, 'override', outcome, run.spec);
    },
  };
}

/**
 * The run service's refusals as channel failures: a missing run is not-found; a closed, busy or
 * damaged run, and a void or override the run's state does not allow, are conflicts. Errors that
 * carry a system code (disk full, permission) stay internal, with their message.
 */
async function translated<Value>(operation: () => Promise<Value>, runId: string): Promise<Value> {
  try {
    return await operation();
  } catch (error) {
    if (error instanceof RunClosedError) {
      throw new ChannelFailure('conflict', 'The run has reached its decision: record a reason for entering more before the next entry.', 'runId');
    }
    if (error instanceof RunNotWritableError) throw new ChannelFailure('conflict', error.message, 'runId');
    const systemCode = (error as NodeJS.ErrnoException).code;
    if (systemCode === 'ENOENT') throw new ChannelFailure('not-found', `There is no run with id ${runId}.`, 'runId');
    if (error instanceof Error && error.name === 'Error' && systemCode === undefined) {
      throw new ChannelFailure('conflict', `${error.message[0]?.toUpperCase() ?? ''}${error.message.slice(1)}.`, 'runId');
    }
    throw error;
  }
}

/** Each counted result with n, total and LLR after it: the points of the evidence path. */
function withStatistics(spec: PlanSpec, entries: readonly RunEntryView[]): InspectionEntry[] {
  let n = 0;
  let total = 0;
  return entries.map((entry) => {
    if (entry.voided) return { ...entry, after: null };
    n += 1;
    total += resultTotal(entry.result);
    return { ...entry, after: { n, total, llr: decide(spec, n, total).llr } };
  });
}

/**
 * The acceptance and rejection numbers the chart draws, far enough ahead to show the earliest
 * accept and reject from here, never past the truncation.
 */
function evidenceFrame(spec: PlanSpec, live: LiveState): EvidenceFrame {
  const { lines, countWeight } = resolvePlan(spec);
  const reach = live.n + Math.max(live.itemsToEarliestAccept ?? 0, live.itemsToEarliestReject ?? 0);
  const ahead = Math.max(MINIMUM_HORIZON, Math.ceil(HORIZON_MARGIN * reach));
  const horizon = lines.truncation === null ? ahead : Math.min(lines.truncation, Math.max(ahead, live.n));
  return {
    horizon,
    limits: limitRows(lines, horizon),
    // ln A and ln B of the lines in use (the fitted ones when the plan fits exact risks).
    lnA: lines.h2 * countWeight,
    lnB: -lines.h1 * countWeight,
    truncation: lines.truncation,
  };
}
