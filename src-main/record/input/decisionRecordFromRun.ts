/**
 * The glue from a real run to its decision record: the run journal (entries, voids, close), the
 * plan's exact figures from the engine, the settings (organisation, site, confidence level) and
 * the software's identity. The quality estimate is the sequential one once the run is decided.
 */
import { designLinearCountPlan, linearCountLimitRows, resolvePlan, decideLinearCount, isLinearCountSpec, PlanParameterError, type GradedSpec, type LifetimeSpec, type MeasurementSpec, type PlanSpec, type LinearCountSpec } from '../../engine/index.js';
import { estimateAfterStop } from '../../engine/estimation/index.js';
import {
  OUTCOME_WORDS,
  itemHorizon,
  createRunCatalogue,
  localTimestamp,
  requireIntact,
  resultTotal,
  type IntactRunRead,
  type RunCatalogue,
} from '../../inspection/index.js';
import { SettingsRepository, localOffset, type Settings } from '../../store/index.js';
import { modelChart } from './modelChartData.js';
import { modelEstimate, modelEvidence, modelPlan, modelResultText } from './modelRecord.js';
import { naiveQualityEstimate } from '../../engine/estimation/naiveQualityEstimate.js';
import type {
  BoundaryStep,
  DecisionRecordInput,
  EntryVoid,
  QualityEstimate,
  RecordDecision,
  RecordEntry,
  RecordPlan,
  RecordState,
} from './decisionRecordInput.js';
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

function qualityUnit(spec: LinearCountSpec): string {
  return spec.model === 'passfail' ? 'fraction nonconforming' : 'nonconformities per item';
}

/** The plan of a pass/fail or count run (the other models take modelRecordParts). */
function linearSpec(spec: PlanSpec): LinearCountSpec {
  if (isLinearCountSpec(spec)) return spec;
  throw new Error(`a ${spec.model} plan has no acceptance numbers`);
}

/**
 * The plan, decision, estimate and chart of a measurement, lifetime or graded run, in its natural
 * units; the decision's numbers are the evidence as the run stands (as it closed, when closed).
 */
function modelRecordParts(read: IntactRunRead, spec: MeasurementSpec | LifetimeSpec | GradedSpec, confidenceLevel: number) {
  const { replay } = read;
  const { plan } = replay.header;
  const state = replay.evidence.state();
  const close = replay.status === 'closed' ? replay.lastClose : null;
  const { figures, rows } = modelPlan(spec);
  const evidence = modelEvidence(spec, state);
  const decision: RecordDecision = {
    state: close === null ? 'continue' : closedState(close.rule, close.decision),
    rule: close?.rule ?? (replay.lastClose === null ? state.rule ?? 'between the lines' : `none stands: the run was reopened after its decision (${replay.lastClose.decision}) by an override with a reason, and has not closed again`),
    itemsInspected: state.n,
    nonconformingFound: state.total,
    finalLogLikelihoodRatio: state.llr,
  };
  const estimate = modelEstimate(spec, state, confidenceLevel);
  return {
    plan: { planId: plan.id, planName: plan.name, planVersion: String(plan.version), model: spec.model, producerRiskNominal: spec.alpha, consumerRiskNominal: spec.beta, ...figures } satisfies RecordPlan,
    decision,
    qualityEstimate: estimate === null || decision.state !== 'continue' ? estimate : { ...estimate, methodName: `Interim, the run is undecided: ${estimate.methodName}` },
    modelDetail: { planRows: rows, decisionRows: evidence.rows, facts: evidence.facts, chart: modelChart(spec, replay.results, state) },
    entries: recordEntries(read).map((entry, i) => ({ ...entry, resultText: modelResultText(spec, replay.results[i].result) })),
  };
}

function recordPlan(read: IntactRunRead): RecordPlan {
  const { plan } = read.replay.header;
  const spec = linearSpec(plan.spec);
  const design = designLinearCountPlan(spec, { curvePoints: 2 });
  const unit = qualityUnit(spec);
  const [symbol0, symbol1] = spec.model === 'passfail' ? ['p0', 'p1'] : ['lambda0', 'lambda1'];
  return {
    planId: plan.id,
    planName: plan.name,
    planVersion: String(plan.version),
    model: spec.model,
    acceptableQuality: { symbol: symbol0, value: design.hypotheses.theta0, unit },
    rejectableQuality: { symbol: symbol1, value: design.hypotheses.theta1, unit },
    producerRiskNominal: spec.alpha,
    consumerRiskNominal: spec.beta,
    producerRiskExact: design.exact.alpha,
    consumerRiskExact: design.exact.beta,
    boundaries: design.boundaries,
    truncation: design.truncation === null ? null : { maxItems: design.truncation, rule: design.truncationRule },
    // The exact ASN of the integer plan as run (with its truncation), not Wald's approximation.
    averageSampleNumberAtAcceptable: design.exact.asnH0,
    averageSampleNumberAtRejectable: design.exact.asnH1,
  };
}

/** Every result in journal order, each void carried with the entry it cancels. */
function recordEntries(read: IntactRunRead): RecordEntry[] {
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
    category: result.category,
    note: result.note,
    actor: result.actor,
    voided: voids.get(result.seq) ?? null,
  }));
}

/** The item count the record's chart draws up to: the screens' horizon rule (inspection/runPictures.ts) one item past the last. */
export function evidenceHorizon(spec: LinearCountSpec, itemsInspected: number): number {
  return itemHorizon(itemsInspected, 1, resolvePlan(spec).lines.truncation);
}

function boundarySteps(spec: LinearCountSpec, itemsInspected: number): BoundaryStep[] {
  return linearCountLimitRows(resolvePlan(spec).lines, evidenceHorizon(spec, itemsInspected)).map((row) => ({
    itemsInspected: row.n,
    acceptanceNumber: row.accept,
    rejectionNumber: row.reject,
  }));
}

function closedState(rule: string, decision: 'accept' | 'reject'): RecordState {
  return rule.startsWith(`${decision} at truncation`) ? `${decision} at truncation` : decision;
}

function recordDecision(read: IntactRunRead): RecordDecision {
  const { replay } = read;
  const close = replay.status === 'closed' ? replay.lastClose : null;
  if (close !== null) {
    return { state: closedState(close.rule, close.decision), rule: close.rule, itemsInspected: close.n, nonconformingFound: close.total, finalLogLikelihoodRatio: close.llr };
  }
  const now = decideLinearCount(linearSpec(replay.header.plan.spec), replay.n, replay.total);
  const reopened = replay.lastClose !== null;
  return {
    state: 'continue',
    rule: reopened
      ? `none stands: the run was reopened after its decision (${replay.lastClose?.decision}) by an override with a reason, and has not closed again; now ${now.rule}`
      : now.rule,
    itemsInspected: replay.n,
    nonconformingFound: replay.total,
    finalLogLikelihoodRatio: now.llr,
  };
}

/**
 * The quality estimate: for a decided run, Whitehead's bias-adjusted estimate and the stagewise
 * exact interval from the plan's exact stopping distribution; otherwise (or where that method does
 * not apply to the stop) the naive d/n with its fixed-sample interval, labelled as such.
 */
export function recordQualityEstimate(spec: LinearCountSpec, decision: RecordDecision, confidenceLevel: number): QualityEstimate | null {
  const { itemsInspected: n, nonconformingFound: total } = decision;
  if (n === 0) return null;
  const naive = naiveQualityEstimate({ model: spec.model, itemsInspected: n, nonconformities: total, confidenceLevel });
  if (decision.state === 'continue') {
    return { ...naive, methodName: `Interim, the run is undecided: ${naive.methodName}` };
  }
  try {
    const after = estimateAfterStop(spec, { n, total, confidence: confidenceLevel });
    const percent = `${Number((confidenceLevel * 100).toPrecision(3))} %`;
    return {
      methodName:
        `Bias-adjusted estimate (Whitehead 1986) and exact ${percent} interval from the stagewise ordering of the ` +
        `sample space (Armitage 1958; Jennison and Turnbull 2000, section 8.4), both from the exact stopping distribution of the plan as run`,
      pointEstimate: after.biasAdjusted,
      pointEstimateName: 'bias-adjusted',
      naiveEstimate: after.naive,
      confidenceLevel,
      lower: after.interval.lower,
      upper: after.interval.upper,
      unit: naive.unit,
    };
  } catch (error) {
    if (!(error instanceof PlanParameterError)) throw error;
    // E.g. a run that went on past a stopping point after an override: the stopping distribution
    // does not describe how it stopped, so only the naive figure can be given honestly.
    return { ...naive, methodName: `The sequential estimate does not apply to this stop (${error.message}). ${naive.methodName}` };
  }
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
  const { header: runHeader, lastClose, status } = read.replay;
  const { run, plan, source } = runHeader;
  const opened = read.entries[0];
  const model = isLinearCountSpec(plan.spec) ? null : modelRecordParts(read, plan.spec, context.settings.confidenceLevel);
  const decision = model?.decision ?? recordDecision(read);
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
    plan: model?.plan ?? recordPlan(read),
    entries: model?.entries ?? recordEntries(read),
    boundarySteps: model === null ? boundarySteps(linearSpec(plan.spec), decision.itemsInspected) : [],
    decision,
    qualityEstimate: model === null ? recordQualityEstimate(linearSpec(plan.spec), decision, context.settings.confidenceLevel) : model.qualityEstimate,
    ...(model === null ? {} : { modelDetail: model.modelDetail }),
    outcome: read.row.outcome,
    history: read.history.map((event) =>
      event.kind === 'decision'
        ? { sequence: event.seq, at: event.at, actor: event.actor, text: `${event.decision} (${event.rule})` }
        : { sequence: event.seq, at: event.at, actor: event.actor, text: `${OUTCOME_WORDS.reopened}: ${event.reason}` },
    ),
    fingerprint: read.fingerprint,
    interim: decision.state === 'continue',
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
