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
