import type { PlanSpec } from '../../engine/index.js';
import {
  ResultRefusedError,
  RunClosedError,
  RunNotWritableError,
  RunNotFoundError,
  RunUnreadableError,
  createRunCatalogue,
  createRunService,
  type RunCatalogue,
  resultProblem,
  type RecordOutcome,
  type RunService,
  type RunView,
} from '../../inspection/index.js';
import { PlanRepository, SourceRepository } from '../../store/index.js';
import type { InspectionEntry, InspectionRunView, InspectionStep } from '../channels/inspectionChannels.js';
import type { ChannelHandlers } from '../dispatcher.js';
import { ChannelFailure } from '../result.js';
import { evidenceFrame, pointOf, runLive, withStatistics } from '../../inspection/index.js';

type InspectionHandlers = Pick<
  ChannelHandlers,
  'inspection.start' | 'inspection.list' | 'inspection.open' | 'inspection.held' | 'inspection.record' | 'inspection.void' | 'inspection.override'
>;

export interface InspectionHandlerContext {
  dataDirectory: string;
  catalogue?: RunCatalogue;
  /** The run service to use; the app passes its own so it can close the journals on quit. */
  runService?: RunService;
}

/** What a handler needs to know of a run between requests: fixed at its start. */
interface KnownRun {
  readonly spec: PlanSpec;
  readonly actor: string;
}

export function createInspectionHandlers(context: InspectionHandlerContext): InspectionHandlers {
  const catalogue = context.catalogue ?? createRunCatalogue(context.dataDirectory);
  const service = context.runService ?? createRunService({ dataDirectory: context.dataDirectory, catalogue });
  const plans = new PlanRepository(context.dataDirectory);
  const sources = new SourceRepository(context.dataDirectory);
  const known = new Map<string, KnownRun>();

  function remember(view: RunView): InspectionRunView {
    known.set(view.run.id, { spec: view.plan.spec, actor: view.run.inspector ?? 'inspector' });
    const live = runLive(view.plan.spec, view.state);
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
    const live = runLive(spec, outcome.state);
    const statusChanged = outcome.closedWith !== null || kind === 'override';
    const { status, decision, rule, closedAt } = statusChanged
      ? (await service.openRun(runId)).run
      : { status: 'open' as const, decision: null, rule: null, closedAt: null };
    const taken = outcome.entry;
    const entry: InspectionEntry | null =
      taken === null ? null : { ...taken, after: taken.voided ? null : pointOf(spec, outcome.state) };
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

    'inspection.list': () => catalogue.listRuns(),

    'inspection.open': async ({ runId }) => remember(await translated(() => service.openRun(runId), runId)),

    'inspection.held': async ({ runId }) => ({ held: await translated(() => service.heldElsewhere(runId), runId) }),

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
    if (error instanceof RunNotWritableError || error instanceof RunUnreadableError) throw new ChannelFailure('conflict', sentence(error.message), 'runId');
    if (error instanceof RunNotFoundError) throw new ChannelFailure('not-found', `There is no run with id ${runId}.`, 'runId');
    if (error instanceof ResultRefusedError) throw new ChannelFailure('invalid-parameter', `This run's plan is ${error.model}: ${error.message}.`, 'result');
    const systemCode = (error as NodeJS.ErrnoException).code;
    if (systemCode === 'ENOENT') throw new ChannelFailure('not-found', `There is no run with id ${runId}.`, 'runId');
    if (error instanceof Error && error.name === 'Error' && systemCode === undefined) {
      throw new ChannelFailure('conflict', sentence(error.message), 'runId');
    }
    throw error;
  }
}

/** A message as a sentence: capital first letter, one full stop. */
function sentence(message: string): string {
  return `${message[0]?.toUpperCase() ?? ''}${message.slice(1)}${message.endsWith('.') ? '' : '.'}`;
}
