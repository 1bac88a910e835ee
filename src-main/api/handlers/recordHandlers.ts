import { linearCountLimitRows, resolvePlan, type PlanSpec, type LinearCountSpec } from '../../engine/index.js';
import { RunJournalContentError, resultTotal } from '../../inspection/index.js';
import { entriesToCsv } from '../../record/entriesCsv.js';
import { decisionRecordFromRun, evidenceHorizon, recordContextFor } from '../../record/fromRun.js';
import type { DecisionRecordInput } from '../../record/recordInput.js';
import { renderDecisionRecord } from '../../record/renderDecisionRecord.js';
import { historyRow, runHistory } from '../../record/runHistory.js';
import { RunJournalUnverifiedError, readRunJournal, requireVerified, type RunJournalRead } from '../../record/runJournalRead.js';
import type { EvidenceFrame, InspectionEntry, InspectionFrame } from '../channels/inspectionChannels.js';
import type { ChannelHandlers } from '../dispatcher.js';
import { ChannelFailure } from '../result.js';
import { evidenceFrame as runFrame, runLive, withStatistics } from './inspectionFrames.js';

type RecordHandlers = Pick<ChannelHandlers, 'record.history' | 'record.open' | 'record.pdf' | 'record.csv'>;

export interface RecordHandlerContext {
  dataDirectory: string;
}

/**
 * The Records place's handlers. Every request reads the journal afresh, without a lock, so a run
 * an inspector is writing can be looked at (and printed as interim) at the same time.
 */
export function createRecordHandlers(context: RecordHandlerContext): RecordHandlers {
  const { dataDirectory } = context;

  /** One verified read of a run and its record input, with the run service's refusals as failures. */
  async function recordOf(runId: string): Promise<{ read: RunJournalRead; input: DecisionRecordInput }> {
    try {
      const [read, recordContext] = await Promise.all([readRunJournal(dataDirectory, runId), recordContextFor(dataDirectory)]);
      return { read, input: decisionRecordFromRun(requireVerified(read), recordContext) };
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code === 'ENOENT') throw new ChannelFailure('not-found', `There is no run with id ${runId}.`, 'runId');
      if (error instanceof RunJournalUnverifiedError || error instanceof RunJournalContentError) {
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
    'record.history': (filter) => runHistory(dataDirectory, filter),

    'record.open': async ({ runId }) => {
      const { read, input } = await recordOf(runId);
      const { plan, run } = read.replay.header;
      return {
        row: historyRow(read),
        recordId: input.header.recordId,
        plan: { id: plan.id, name: plan.name, version: plan.version, spec: plan.spec },
        lotSize: run.lotSize,
        inspectors: input.subject.inspectors,
        ...recordEvidence(read, plan.spec, input.decision.itemsInspected),
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
      return { fileName: `${fileStem(input, 'entries')}.csv`, interim: input.interim, text: entriesToCsv(input.entries, input.plan.model) };
    },
  };
}

/** The evidence path and the frame it is drawn in: for the models with their own design path, as the Inspect place draws them. */
function recordEvidence(read: RunJournalRead, spec: PlanSpec, itemsInspected: number): { entries: InspectionEntry[]; frame: InspectionFrame } {
  if (spec.model === 'passfail' || spec.model === 'count') {
    return { entries: evidenceEntries(read, spec), frame: evidenceFrame(spec, itemsInspected) };
  }
  return { entries: withStatistics(spec, read.replay.results), frame: runFrame(spec, runLive(spec, read.replay.evidence.state())) };
}

/** Each result with n, total and LLR after it (null for a voided one): the points of the evidence path. */
function evidenceEntries(read: RunJournalRead, spec: LinearCountSpec): InspectionEntry[] {
  const { countWeight, itemOffset } = resolvePlan(spec);
  let n = 0;
  let total = 0;
  return read.replay.results.map((entry) => {
    if (entry.voided) return { ...entry, after: null };
    n += 1;
    total += resultTotal(entry.result);
    return { ...entry, after: { n, total, llr: countWeight * total - itemOffset * n } };
  });
}

/** The steps the chart draws: the same horizon as the printed record's chart. */
function evidenceFrame(spec: LinearCountSpec, itemsInspected: number): EvidenceFrame {
  const { lines, countWeight } = resolvePlan(spec);
  const horizon = evidenceHorizon(spec, itemsInspected);
  return { horizon, limits: linearCountLimitRows(lines, horizon), lnA: lines.h2 * countWeight, lnB: -lines.h1 * countWeight, truncation: lines.truncation };
}
