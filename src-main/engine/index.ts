/**
 * Tallyline's statistical engine: pure functions of plain data, no Node or DOM APIs.
 *
 * Conventions: H0 = acceptable quality, H1 = rejectable quality; alpha = P(reject | H0) (producer's
 * risk), beta = P(accept | H1) (consumer's risk); OC = P(accept). After n items with cumulative
 * count d: accept iff d <= acceptance number, reject iff d >= rejection number, with a 1e-12 guard
 * on floor/ceil so a point exactly on a line counts as on it. Logarithms are natural.
 */
export { PlanParameterError } from './errors.js';
export type { PlanSpec, PassFailSpec, CountSpec, FitMode, ModelName } from './spec.js';
export type { KlDivergences, ModelDefinition, LinearStatistic } from './models/model.js';
export { modelNames } from './models/registry.js';
export { waldBoundaries, klDivergences, waldLimits } from './wald-boundaries.js';
export type { WaldBoundaries } from './wald-boundaries.js';
export { modelOf, validatedModel } from './models/registry.js';
export { passFailModel } from './models/passfail.js';
export { countModel } from './models/count.js';
export {
  acceptanceNumber,
  rejectionNumber,
  truncationAcceptanceNumber,
  decisionAt,
} from './integer-lines.js';
export type { IntegerLines, Decision, DecisionAt } from './integer-lines.js';
export { createExactEvaluator } from './exact-evaluator.js';
export type { ExactEvaluator, ExactPoint, ExactEvaluatorOptions } from './exact-evaluator.js';
export { waldPoint, neutralQuality, waldOcFromExponent, solveWaldExponent } from './wald-curve.js';
export type { WaldPoint } from './wald-curve.js';
export { singleSamplingPlan } from './single-plan.js';
export type { SinglePlan } from './single-plan.js';
export { suggestedTruncation, TRUNCATION_RISK_ALLOWANCE } from './truncation.js';
export { fitExactRisks } from './exact-fit.js';
export type { ExactFit } from './exact-fit.js';
export { resolvePlan } from './plan-lines.js';
export type { ResolvedPlan } from './plan-lines.js';
export { designPlan, limitRows, truncationRule } from './design-plan.js';
export type { DesignOptions } from './design-plan.js';
export type { PlanDesign, CurvePoint, LimitRow, SampleSizeQuantiles } from './plan-design-types.js';
export { sampleSizeQuantiles } from './sample-size-quantiles.js';
export { liveState, decide } from './live-state.js';
export type { LiveState, QuickDecision } from './live-state.js';
export { createPlanEvaluator } from './plan-evaluator.js';
export type { PlanEvaluator } from './plan-evaluator.js';
// Models whose evidence is not one integer count per item (issue 8): each has its own design path.
export type { MeasurementSpec, LifetimeSpec, GradedSpec, ExtendedPlanSpec, AnyPlanSpec } from './spec.js';
export { measurementPlan, decideMeasurement, measurementBoundaries, measurementKl, measurementWaldPoint, SIEGMUND_RHO } from './models/measurement.js';
export type { MeasurementPlan, MeasurementBoundaries, MeasurementDecision } from './models/measurement.js';
export { designMeasurementPlan, measurementLiveState, measurementTruncationRule } from './models/measurement-design.js';
export type { MeasurementDesign, MeasurementCurvePoint, MeasurementLiveState } from './models/measurement-design.js';
export { lifetimePlan, decideLifetime, lifetimeBoundaries, acceptTime, rejectTime } from './models/lifetime.js';
export type { LifetimePlan, LifetimeBoundaries, LifetimeDecision } from './models/lifetime.js';
export { designLifetimePlan, lifetimeLiveState, lifetimeTruncationRule } from './models/lifetime-design.js';
export type { LifetimeDesign, LifetimeCurvePoint, LifetimeLiveState } from './models/lifetime-design.js';
export { fixedDurationPlan, fixedDurationRisks } from './models/lifetime-fixed-duration.js';
export type { FixedDurationPlan } from './models/lifetime-fixed-duration.js';
export { gradedPlan, decideGraded, gradedBoundaries, gradedKl, gradedQuality } from './models/graded.js';
export type { GradedPlan, GradedBoundaries, GradedDecision } from './models/graded.js';
export { designGradedPlan, gradedLiveState, GRADED_EXACT_LIMIT } from './models/graded-design.js';
export type { GradedDesign, GradedCurvePoint, GradedLiveState, GradedDesignOptions } from './models/graded-design.js';
export { designAnyPlan, checkAnyPlanSpec, isExtendedPlanSpec } from './design-any-plan.js';
export type { AnyPlanDesign } from './design-any-plan.js';
export { measurementLimitRows, lifetimeLimitRows, gradedLimitRows } from './models/extended-limit-rows.js';
