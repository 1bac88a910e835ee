import { OUTCOME_WORDS } from '../../inspection/runOutcome.js';
import type { DecisionRecordInput, QualityEstimate, QualityLevel } from '../input/decisionRecordInput.js';
import { formatCount, formatFixed, formatNumber, formatPercent, formatQuality, formatQualityInterval } from '../../engine/index.js';
import { formatTimestamp } from './formatTimestamp.js';
import type { RecordLayout } from './recordLayout.js';
import { stateHeadline } from './titleBlock.js';

function hypothesis(name: string, level: QualityLevel): string {
  return `${name}: ${level.symbol} = ${formatQuality(level.value, level.unit)}`;
}

function risk(nominal: number, exact: number | null): string {
  return `${formatPercent(nominal)} nominal; ${exact === null ? 'exact value not computed' : `${formatPercent(exact)} exact for the plan as run`}`;
}

/** Source, part, characteristic, lot, inspectors and times. */
export function drawTestedSection(layout: RecordLayout, input: DecisionRecordInput): void {
  const { subject } = input;
  layout.heading('What was tested');
  layout.keyValues([
    ['Source', subject.source],
    ['Part', subject.part ?? 'not recorded with the run'],
    ['Characteristic', subject.characteristic ?? 'not recorded with the run'],
    ['Lot / batch', subject.lotId],
    ['Lot size', subject.lotSize === null ? 'not stated' : `${formatCount(subject.lotSize)} items`],
    [subject.inspectors.length > 1 ? 'Inspectors' : 'Inspector', subject.inspectors.join(', ')],
    ['Started', formatTimestamp(subject.startedAt)],
    ['Ended', subject.endedAt === null ? 'not ended (run undecided)' : formatTimestamp(subject.endedAt)],
    ['Time zone', subject.timeZone],
  ]);
}

/** Plan identity, model, hypotheses, risks, then the model's rows: boundaries, truncation, expected run. */
export function drawPlanSection(layout: RecordLayout, input: DecisionRecordInput): void {
  const { plan } = input;
  layout.heading('Plan');
  layout.keyValues([
    ['Plan', `${plan.planName === undefined ? '' : `${plan.planName}, id `}${plan.planId}, version ${plan.planVersion}`],
    ['Model', plan.modelLine],
    ['Hypotheses', `${hypothesis('H0 (acceptable quality)', plan.acceptableQuality)}\n${hypothesis('H1 (rejectable quality)', plan.rejectableQuality)}`],
    ["Producer's risk (alpha)", risk(plan.producerRiskNominal, plan.producerRiskExact)],
    ["Consumer's risk (beta)", risk(plan.consumerRiskNominal, plan.consumerRiskExact)],
    ...plan.rows,
  ]);
}

/** The decision with its rule and the counts, then the quality estimate with its method. */
export function drawDecisionSection(layout: RecordLayout, input: DecisionRecordInput): void {
  const { decision, qualityEstimate: estimate } = input;
  layout.heading('Decision and quality estimate');
  layout.keyValues([
    ['Outcome', OUTCOME_WORDS[input.outcome]],
    ['Decision', stateHeadline(decision.state)],
    ['Rule applied', decision.rule],
    ...(input.history.length > 1 ? [['Decision history', input.history.map((event) => `${event.at} seq ${event.sequence} ${event.actor}: ${event.text}`).join('\n')] as [string, string]] : []),
    ...input.evidence.rows,
    ['Final LLR', formatFixed(decision.finalLogLikelihoodRatio, 4)],
    ...estimateRows(estimate),
  ]);
}

function estimateRows(estimate: QualityEstimate | null): Array<[string, string]> {
  if (estimate === null) return [['Quality estimate', 'none yet: no items inspected']];
  const named = estimate.pointEstimateName === undefined ? '' : `${estimate.pointEstimateName} `;
  const naive =
    (estimate.naiveEstimate === undefined ? '' : `\nnaive d/n = ${formatQuality(estimate.naiveEstimate, estimate.unit)}, for comparison only (biased after a sequential stop)`) +
    (estimate.detail === undefined ? '' : `\n${estimate.detail}`);
  return [
    [
      'Quality estimate',
      `${named}${formatQuality(estimate.pointEstimate, estimate.unit)}; ${formatNumber(estimate.confidenceLevel * 100, 3)} % confidence interval ` +
        `${formatQualityInterval(estimate.lower, estimate.upper, estimate.unit)}${naive}`,
    ],
    ['Estimation method', estimate.methodName],
  ];
}
