import {
  RunJournalUnverifiedError,
  RunNotFoundError,
  createRunCatalogue,
  requireIntact,
  type IntactRunRead,
  type RunCatalogue,
  runHistory,
  runPicture,
} from '../../inspection/index.js';
import { entriesToCsv } from '../../record/input/entriesToCsv.js';
import { decisionRecordFromRun, recordContextFor } from '../../record/input/decisionRecordFromRun.js';
import type { DecisionRecordInput } from '../../record/input/decisionRecordInput.js';
import { renderDecisionRecord } from '../../record/pdf/renderDecisionRecord.js';
import type { ChannelHandlers } from '../dispatcher.js';
import { ChannelFailure } from '../result.js';

type RecordHandlers = Pick<ChannelHandlers, 'record.history' | 'record.open' | 'record.pdf' | 'record.csv'>;

export interface RecordHandlerContext {
  dataDirectory: string;
  catalogue?: RunCatalogue;
}

/**
 * The Records place's handlers. Every request reads the journal afresh, without a lock, so a run
 * an inspector is writing can be looked at (and printed as interim) at the same time.
 */
export function createRecordHandlers(context: RecordHandlerContext): RecordHandlers {
  const { dataDirectory } = context;
  const catalogue = context.catalogue ?? createRunCatalogue(dataDirectory);

  /** One verified read of a run and its record input, with the run service's refusals as failures. */
  async function recordOf(runId: string): Promise<{ read: IntactRunRead; input: DecisionRecordInput }> {
    try {
      const [read, recordContext] = await Promise.all([catalogue.readRun(runId), recordContextFor(dataDirectory)]);
      const intact = requireIntact(read);
      return { read: intact, input: decisionRecordFromRun(intact, recordContext) };
    } catch (error) {
      if (error instanceof RunNotFoundError) throw new ChannelFailure('not-found', `There is no run with id ${runId}.`, 'runId');
      if (error instanceof RunJournalUnverifiedError) {
        throw new ChannelFailure('conflict', `${error.message}. Check it with: tallyline verify --run ${runId}`, 'runId');
      }
      throw error;
    }
  }

  /** File names say what the file is, which run and lot: "record-KF-25-0311-DR-1a2b3c4d-5e6f7a8b.pdf". */
  function fileStem(input: DecisionRecordInput, kind: string): string {
    return `${kind}-${input.subject.lotId}-${input.header.recordId}`.replace(/[^A-Za-z0-9._-]+/g, '_');
  }

  return {
    'record.history': async (filter) => runHistory(await catalogue.listRuns(), filter),

    'record.open': async ({ runId }) => {
      const { read, input } = await recordOf(runId);
      const { plan, run } = read.replay.header;
      return {
        row: read.row,
        recordId: input.header.recordId,
        plan: { id: plan.id, name: plan.name, version: plan.version, spec: plan.spec },
        lotSize: run.lotSize,
        inspectors: input.subject.inspectors,
        ...runPicture(plan.spec, read.replay.results, read.replay.evidence.state()),
        decision: input.decision,
        estimate: input.qualityEstimate,
        interim: input.interim,
        fingerprint: input.fingerprint,
      };
    },

    'record.pdf': async ({ runId }) => {
      const { input } = await recordOf(runId);
      const pdf = await renderDecisionRecord(input);
      return { fileName: `${fileStem(input, input.interim ? 'interim-record' : 'record')}.pdf`, interim: input.interim, recordId: input.header.recordId, base64: pdf.toString('base64') };
    },

    'record.csv': async ({ runId }) => {
      const { input } = await recordOf(runId);
      return { fileName: `${fileStem(input, 'entries')}.csv`, interim: input.interim, text: entriesToCsv(input.entries) };
    },
  };
}
