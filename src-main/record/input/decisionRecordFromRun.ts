/**
 * The glue from a real run to its decision record: the run journal (entries, voids, close), the
 * plan's exact figures and record lines from its model (through the registry), the run's picture
 * (the frame the screens draw), the settings (organisation, site, confidence level) and the
 * software's identity.
 */
import { designPlan, planOf, type EvidenceState, type Observation } from '../../engine/index.js';
import {
  OUTCOME_WORDS,
  createRunCatalogue,
  evidencePathPoints,
  localTimestamp,
  requireIntact,
  resultTotal,
  runPicture,
  type IntactRunRead,
  type RunCatalogue,
} from '../../inspection/index.js';
import { SettingsRepository, localOffset, type Settings } from '../../store/index.js';
import type { DecisionRecordInput, EntryVoid, QualityEstimate, RecordDecision, RecordEntry, RecordState } from './decisionRecordInput.js';
import { softwareIdentity, type SoftwareIdentity } from './softwareIdentity.js';

export interface RecordContext {
  readonly settings: Pick<Settings, 'organisationName' | 'site' | 'confidenceLevel'>;
  readonly software: SoftwareIdentity;
  /** When the record is made; printed with this machine's UTC offset. */
  readonly generatedAt: Date;
}

/**
 * `DR-<random part of the run id>-<first 8 hex of the fingerprint>`: the same journal gives the same
 * id, and a record of the run after more entries a different one. Short, so footers keep one line.
 */
export function recordIdFor(runId: string, fingerprint: string): string {
  return `DR-${runId.split('-').at(-1)}-${fingerprint.slice(0, 8)}`;
}

/** Every result in journal order, each void carried with the entry it cancels, its result in the model's words. */
function recordEntries(read: IntactRunRead, resultText: (observation: Observation) => string): RecordEntry[] {
  const voids = new Map<number, EntryVoid>();
  for (const entry of read.entries) {
    if (entry.kind !== 'void') continue;
    const payload = entry.payload as { target: number; reason: string };
    voids.set(payload.target, { reason: payload.reason, voidSequence: entry.seq, voidedAt: localTimestamp(entry.time, entry.offset), actor: entry.actor });
  }
  return read.replay.results.map((result) => ({
    sequence: result.seq,
    recordedAt: localTimestamp(result.time, result.offset),
    itemId: result.itemId ?? '',
    nonconformities: resultTotal(result.result),
    resultText: resultText(result.result as Observation),
    category: result.category,
    note: result.note,
    actor: result.actor,
    voided: voids.get(result.seq) ?? null,
  }));
}

function closedState(rule: string, decision: 'accept' | 'reject'): RecordState {
  return rule.startsWith(`${decision} at truncation`) ? `${decision} at truncation` : decision;
}

/** The decision as the journal's close states it, or, while none stands, the evidence as it stands now. */
function recordDecision(read: IntactRunRead, state: EvidenceState): RecordDecision {
  const { replay } = read;
  const close = replay.status === 'closed' ? replay.lastClose : null;
  if (close !== null) {
    return { state: closedState(close.rule, close.decision), rule: close.rule, itemsInspected: close.n, nonconformingFound: close.total, finalLogLikelihoodRatio: close.llr };
  }
  const reopened = replay.lastClose;
  return {
    state: 'continue',
    rule:
      reopened === null
        ? state.standing
        : `none stands: the run was reopened after its decision (${reopened.decision}) by an override with a reason, and has not closed again; now ${state.standing}`,
    itemsInspected: state.n,
    nonconformingFound: state.total,
    finalLogLikelihoodRatio: state.llr,
  };
}

/** The estimate as the model gives it; while no decision stands, labelled interim. */
function interimLabelled(estimate: QualityEstimate | null, decided: boolean): QualityEstimate | null {
  return estimate === null || decided ? estimate : { ...estimate, methodName: `Interim, the run is undecided: ${estimate.methodName}` };
}

/** The time offsets the journal was written with, e.g. "UTC+01:00 (the inspecting computer's clock)". */
function timeZoneOf(read: IntactRunRead): string {
  const offsets = [...new Set(read.entries.map((entry) => entry.offset))];
  return `UTC${offsets.join(', UTC')} (as recorded by the inspecting computer)`;
}

function inspectorsOf(read: IntactRunRead): string[] {
  // Everyone who wrote an entry after the header: results, voids, overrides.
  const names = [read.replay.header.run.inspector, ...read.entries.filter((entry) => entry.kind !== 'open').map((entry) => entry.actor)];
  const unique = [...new Set(names.filter((name): name is string => name !== null && name.trim() !== ''))];
  return unique.length > 0 ? unique : ['not named'];
}

/** The decision record of a run from one verified read of its journal. */
export function decisionRecordFromRun(read: IntactRunRead, context: RecordContext): DecisionRecordInput {
  const { header: runHeader, lastClose, status, results } = read.replay;
  const { run, plan, source } = runHeader;
  const { spec } = plan;
  const lines = planOf(spec).recordLines();
  const opened = read.entries[0];
  const state = read.replay.evidence.state();
  const decision = recordDecision(read, state);
  const decided = decision.state !== 'continue';
  const planLines = lines.plan(designPlan(spec, { curvePoints: 2 }));
  const picture = runPicture(spec, results, state);
  const generated = context.generatedAt;
  return {
    header: {
      organisationName: context.settings.organisationName.trim() || 'organisation not set (Settings)',
      site: context.settings.site.trim() || 'site not set (Settings)',
      recordId: recordIdFor(run.id, read.fingerprint),
      runId: run.id,
      softwareName: context.software.name,
      softwareVersion: context.software.version,
      generatedAt: localTimestamp(generated.toISOString(), localOffset(generated)),
    },
    subject: {
      source: source.name,
      // The plan version copied into the journal's header names them when it was saved with them.
      part: plan.part ?? null,
      characteristic: plan.characteristic ?? null,
      lotId: run.lot,
      lotSize: run.lotSize,
      inspectors: inspectorsOf(read),
      startedAt: localTimestamp(opened.time, opened.offset),
      endedAt: status === 'closed' && lastClose !== null ? localTimestamp(lastClose.time, closeOffset(read)) : null,
      timeZone: timeZoneOf(read),
    },
    plan: {
      planId: plan.id,
      planName: plan.name,
      planVersion: String(plan.version),
      modelLine: lines.modelLine,
      producerRiskNominal: spec.alpha,
      consumerRiskNominal: spec.beta,
      ...planLines,
    },
    entries: recordEntries(read, lines.resultText),
    chart: lines.chart(picture.frame.limits as Parameters<typeof lines.chart>[0], evidencePathPoints(spec, picture.entries)),
    decision,
    evidence: lines.evidence(state),
    qualityEstimate: interimLabelled(lines.estimate(state, decided, context.settings.confidenceLevel), decided),
    outcome: read.row.outcome,
    history: read.history.map((event) =>
      event.kind === 'decision'
        ? { sequence: event.seq, at: event.at, actor: event.actor, text: `${event.decision} (${event.rule})` }
        : { sequence: event.seq, at: event.at, actor: event.actor, text: `${OUTCOME_WORDS.reopened}: ${event.reason}` },
    ),
    fingerprint: read.fingerprint,
    interim: !decided,
    approval: { inspectedBy: run.inspector, reviewedBy: null },
  };
}

/** The offset the last close entry was written with. */
function closeOffset(read: IntactRunRead): string {
  return read.entries.findLast((entry) => entry.kind === 'close')?.offset ?? '+00:00';
}

/** The settings and software identity a record of this data folder is made with. */
export async function recordContextFor(dataDirectory: string, generatedAt = new Date()): Promise<RecordContext> {
  const [settings, software] = await Promise.all([new SettingsRepository(dataDirectory).get(), softwareIdentity()]);
  return { settings, software, generatedAt };
}

/**
 * Reads a run through the catalogue (refusing a journal that does not verify), the settings and
 * the software identity, and builds its record input.
 */
export async function decisionRecordForRun(
  dataDirectory: string,
  runId: string,
  generatedAt = new Date(),
  catalogue: RunCatalogue = createRunCatalogue(dataDirectory),
): Promise<DecisionRecordInput> {
  const [read, context] = await Promise.all([catalogue.readRun(runId), recordContextFor(dataDirectory, generatedAt)]);
  return decisionRecordFromRun(requireIntact(read), context);
}
