/**
 * Tallyline's statistical engine: pure functions of plain data, no Node or DOM APIs.
 *
 * Conventions: H0 = acceptable quality, H1 = rejectable quality; alpha = P(reject | H0) (producer's
 * risk), beta = P(accept | H1) (consumer's risk); OC = P(accept). After n items with cumulative
 * count d: accept iff d <= acceptance number, reject iff d >= rejection number, with a 1e-12 guard
 * on floor/ceil so a point exactly on a line counts as on it. Logarithms are natural.
 */
export { PlanParameterError } from './errors.js';
export { countNoun, countOf } from './countWords.js';
export type { PlanSpec, PassFailSpec, CountSpec, FitMode, ModelName } from './spec.js';
export type { KlDivergences, ModelDefinition, LinearStatistic } from './models/model.js';
export { modelNames } from './models/registry.js';
export { waldBoundaries, klDivergences, waldLimits } from './waldBoundaries.js';
export type { WaldBoundaries } from './waldBoundaries.js';
export { modelOf, validatedModel } from './models/registry.js';
export { passFailModel } from './models/passfail.js';
export { countModel } from './models/count.js';
export {
  acceptanceNumber,
  rejectionNumber,
  truncationAcceptanceNumber,
  decisionAt,
} from './integerLines.js';
export type { IntegerLines, Decision, DecisionAt } from './integerLines.js';
export { createExactEvaluator } from './exactEvaluator.js';
export type { ExactEvaluator, ExactPoint, ExactEvaluatorOptions } from './exactEvaluator.js';
export { waldPoint, neutralQuality, waldOcFromExponent, solveWaldExponent } from './waldCurve.js';
export type { WaldPoint } from './waldCurve.js';
export { singleSamplingPlan } from './singlePlan.js';
export type { SinglePlan } from './singlePlan.js';
export { suggestedTruncation, TRUNCATION_RISK_ALLOWANCE } from './truncation.js';
export { fitExactRisks } from './exactFit.js';
export type { ExactFit } from './exactFit.js';
export { resolvePlan } from './planLines.js';
export type { ResolvedPlan } from './planLines.js';
export { designPlan, limitRows, truncationRule } from './designPlan.js';
export type { DesignOptions } from './designPlan.js';
export type { PlanDesign, CurvePoint, LimitRow, SampleSizeQuantiles } from './planDesignTypes.js';
export { sampleSizeQuantiles } from './sampleSizeQuantiles.js';
export { liveState, decide } from './liveState.js';
export type { LiveState, QuickDecision } from './liveState.js';
export { createPlanEvaluator } from './planEvaluator.js';
export type { PlanEvaluator } from './planEvaluator.js';
// Models whose evidence is not one integer count per item (issue 8): each has its own design path.
export type { MeasurementSpec, LifetimeSpec, GradedSpec, ExtendedPlanSpec, AnyPlanSpec } from './spec.js';
export { measurementPlan, decideMeasurement, measurementBoundaries, measurementKl, measurementWaldPoint, SIEGMUND_RHO } from './models/measurement.js';
export type { MeasurementPlan, MeasurementBoundaries, MeasurementDecision } from './models/measurement.js';
export { designMeasurementPlan, measurementLiveState, measurementTruncationRule } from './models/measurementDesign.js';
export type { MeasurementDesign, MeasurementCurvePoint, MeasurementLiveState } from './models/measurementDesign.js';
export { lifetimePlan, decideLifetime, lifetimeBoundaries, acceptTime, rejectTime } from './models/lifetime.js';
export type { LifetimePlan, LifetimeBoundaries, LifetimeDecision } from './models/lifetime.js';
export { designLifetimePlan, lifetimeLiveState, lifetimeTruncationRule } from './models/lifetimeDesign.js';
export type { LifetimeDesign, LifetimeCurvePoint, LifetimeLiveState } from './models/lifetimeDesign.js';
export { fixedDurationPlan, fixedDurationRisks } from './models/lifetimeFixedDuration.js';
export type { FixedDurationPlan } from './models/lifetimeFixedDuration.js';
export { gradedPlan, decideGraded, gradedBoundaries, gradedKl, gradedQuality } from './models/graded.js';
export type { GradedPlan, GradedBoundaries, GradedDecision } from './models/graded.js';
export { designGradedPlan, gradedLiveState, GRADED_EXACT_LIMIT } from './models/gradedDesign.js';
export type { GradedDesign, GradedCurvePoint, GradedLiveState, GradedDesignOptions } from './models/gradedDesign.js';
export { designAnyPlan, checkAnyPlanSpec, isExtendedPlanSpec } from './designAnyPlan.js';
export type { AnyPlanDesign } from './designAnyPlan.js';
export { measurementLimitRows, lifetimeLimitRows, gradedLimitRows } from './models/extendedLimitRows.js';
