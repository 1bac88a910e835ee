import { OUTCOME_WORDS } from '../../inspection/runOutcome.js';
import type { DecisionRecordInput, QualityEstimate, QualityLevel } from '../input/decisionRecordInput.js';
import { formatCount, formatFixed, formatNumber, formatTimestamp } from './format.js';
import type { RecordLayout } from './recordLayout.js';
import { stateHeadline } from './titleBlock.js';

const MODEL_NAMES = {
  passfail: 'passfail (each item conforming or nonconforming; binomial SPRT)',
  count: 'count (nonconformities per item; Poisson SPRT)',
  measurement: 'measurement (normal measurements, sigma known; SPRT on the sum)',
  lifetime: 'lifetime (exponential times to failure; SPRT on test time and failures)',
  graded: 'graded (items graded into classes; multinomial SPRT on demerits)',
} as const;

function hypothesis(name: string, level: QualityLevel): string {
  return `${name}: ${level.symbol} = ${formatNumber(level.value)} ${level.unit}`;
}

function risk(nominal: number, exact: number | null): string {
  return `${formatNumber(nominal)} nominal; ${exact === null ? 'exact value not computed' : `${formatNumber(exact)} exact for the plan as run`}`;
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

/** Model, hypotheses, risks, Wald boundaries, truncation, ASN and plan identity. */
export function drawPlanSection(layout: RecordLayout, input: DecisionRecordInput): void {
  const { plan } = input;
  layout.heading('Plan');
  layout.keyValues([
    ['Plan', `${plan.planName === undefined ? '' : `${plan.planName}, id `}${plan.planId}, version ${plan.planVersion}`],
    ['Model', MODEL_NAMES[plan.model]],
    ['Hypotheses', `${hypothesis('H0 (acceptable quality)', plan.acceptableQuality)}\n${hypothesis('H1 (rejectable quality)', plan.rejectableQuality)}`],
    ["Producer's risk (alpha)", risk(plan.producerRiskNominal, plan.producerRiskExact)],
    ["Consumer's risk (beta)", risk(plan.consumerRiskNominal, plan.consumerRiskExact)],
    ...(input.modelDetail === undefined ? countPlanRows(input) : input.modelDetail.planRows),
  ]);
}

/** Boundaries, LLR limits, truncation and ASN of a pass/fail or count plan. */
function countPlanRows(input: DecisionRecordInput): Array<[string, string]> {
  const { plan } = input;
  const { boundaries } = plan;
  return [
    [
      'Boundaries',
      `h1 = ${formatFixed(boundaries.h1, 4)}, h2 = ${formatFixed(boundaries.h2, 4)}, slope s = ${formatFixed(boundaries.slope, 6)}\n` +
        `accept when d <= -h1 + s n; reject when d >= h2 + s n (d: cumulative nonconforming, n: items)`,
    ],
    ['LLR limits', `ln A = ${formatFixed(boundaries.lnA, 4)} (reject at or above), ln B = ${formatFixed(boundaries.lnB, 4)} (accept at or below)`],
    ['Truncation', plan.truncation === null ? 'none' : `at ${formatCount(plan.truncation.maxItems)} items: ${plan.truncation.rule}`],
    [
      'Average sample number',
      `${formatNumber(plan.averageSampleNumberAtAcceptable)} items at H0, ${formatNumber(plan.averageSampleNumberAtRejectable)} items at H1`,
    ],
  ];
}

/** The decision with its rule and the counts, then the quality estimate with its method. */
export function drawDecisionSection(layout: RecordLayout, input: DecisionRecordInput): void {
  const { decision, qualityEstimate: estimate } = input;
  const counted = input.plan.model === 'count' ? 'Nonconformities found' : 'Nonconforming found';
  layout.heading('Decision and quality estimate');
  layout.keyValues([
    ['Outcome', OUTCOME_WORDS[input.outcome]],
    ['Decision', stateHeadline(decision.state)],
    ['Rule applied', decision.rule],
    ...(input.history.length > 1 ? [['Decision history', input.history.map((event) => `${event.at} seq ${event.sequence} ${event.actor}: ${event.text}`).join('\n')] as [string, string]] : []),
    ...(input.modelDetail?.decisionRows ?? [
      ['Items inspected', formatCount(decision.itemsInspected)],
      [counted, formatCount(decision.nonconformingFound)],
    ]),
    ['Final LLR', formatFixed(decision.finalLogLikelihoodRatio, 4)],
    ...estimateRows(estimate),
  ]);
}

function estimateRows(estimate: QualityEstimate | null): Array<[string, string]> {
  if (estimate === null) return [['Quality estimate', 'none yet: no items inspected']];
  const named = estimate.pointEstimateName === undefined ? '' : `${estimate.pointEstimateName} `;
  const naive =
    (estimate.naiveEstimate === undefined ? '' : `\nnaive d/n = ${formatNumber(estimate.naiveEstimate)}, for comparison only (biased after a sequential stop)`) +
    (estimate.detail === undefined ? '' : `\n${estimate.detail}`);
  return [
    [
      'Quality estimate',
      `${named}${formatNumber(estimate.pointEstimate)} ${estimate.unit}; ${formatNumber(estimate.confidenceLevel * 100, 3)} % confidence interval ` +
        `${formatNumber(estimate.lower)} to ${Number.isFinite(estimate.upper) ? formatNumber(estimate.upper) : 'no upper limit'}${naive}`,
    ],
    ['Estimation method', estimate.methodName],
  ];
}
