/**
 * Tallyline's statistical engine: pure functions of plain data, no Node or DOM APIs.
 *
 * Conventions: H0 = acceptable quality, H1 = rejectable quality; alpha = P(reject | H0) (producer's
 * risk), beta = P(accept | H1) (consumer's risk); OC = P(accept). Logarithms are natural. Every
 * model is reached through the registry (`planOf`, `designPlan`, `checkPlanSpec`); the exports
 * after those are each model's own functions, for tests and the model's own screens.
 */
export { PlanParameterError } from './errors.js';
export { countNoun, countOf } from './countWords.js';
export { formatNumber, formatFixed, formatCount, withUnit, percentText, formatPercent, formatQuality, formatQualityInterval, formatTable, NUMBER_TEXT } from './numberText.js';
export type { PlanSpec, PassFailSpec, CountSpec, MeasurementSpec, LifetimeSpec, GradedSpec, LinearCountSpec, FitMode, ModelName, SpecOf } from './spec.js';

// The one contract and its registry.
export type { SequentialModel, ModelShapes, ModelLabels, DesignOptions, EvidenceDecision, EvidencePoint, EntryText, PlanFlag, PlanFlagReader, ModelFlags } from './models/sequentialModel.js';
export { frameHorizon, itemHorizon, MINIMUM_ITEM_HORIZON } from './models/sequentialModel.js';
export { modelNames, modelLabels, modelFlags, planOf, checkPlanSpec, designPlan, estimatePlanWork } from './models/registry.js';
export type { SequentialPlan, PlanDesign, DesignOf, EvidenceState, PlanLiveState, PlanFrame, LimitRowOf, Observation, Evidence } from './models/registry.js';
export type { RecordLines, RecordRow, RecordQuality, RecordPlanLines, RecordEvidenceLines, RecordEstimate, RecordChart, RecordPathPoint, ChartPoint } from './models/recordLines.js';
export { linearCountPlanRows, type LinearCountPlanFigures } from './models/linearCountRecordLines.js';
export type { LookAhead } from './lookAhead.js';

// Pass/fail and count: the integer-line machinery they share.
export type { KlDivergences, LinearCountDefinition, LinearStatistic } from './models/linearCountDefinition.js';
export type { LinearCountEvidence, LinearCountEvidenceState, LinearCountFrame } from './models/linearCountModel.js';
export { passFailDefinition } from './models/passfail/passFailDefinition.js';
export { isLinearCountSpec } from './models/linearCountDefinitions.js';
export { countDefinition } from './models/count/countDefinition.js';
export type { PassFailObservation } from './models/passfail/passFailModel.js';
export type { CountObservation } from './models/count/countModel.js';
export { waldBoundaries, klDivergences, waldLimits } from './waldBoundaries.js';
export type { WaldBoundaries } from './waldBoundaries.js';
export { acceptanceNumber, rejectionNumber, truncationAcceptanceNumber, decisionAt } from './integerLines.js';
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
export { resolvePlan } from './resolvePlan.js';
export type { ResolvedPlan } from './resolvePlan.js';
export { designLinearCountPlan, linearCountLimitRows, truncationRule } from './linearCountDesign.js';
export type { LinearCountDesign, CurvePoint, LimitRow, SampleSizeQuantiles } from './planDesignTypes.js';
export { sampleSizeQuantiles } from './sampleSizeQuantiles.js';
export { linearCountLiveState, decideLinearCount } from './linearCountLiveState.js';
export type { LinearCountLiveState, QuickDecision } from './linearCountLiveState.js';
export { createPlanEvaluator } from './planEvaluator.js';
export type { PlanEvaluator } from './planEvaluator.js';

// Measurement.
export { measurementPlan, decideMeasurement, measurementBoundaries, measurementKl, measurementWaldPoint, measurementLimitRows, SIEGMUND_RHO, MEASUREMENT_SUM_GUARD } from './models/measurement/measurementPlan.js';
export type { MeasurementPlan, MeasurementBoundaries, MeasurementDecision } from './models/measurement/measurementPlan.js';
export { designMeasurementPlan, measurementLiveState, measurementTruncationRule } from './models/measurement/measurementDesign.js';
export type { MeasurementDesign, MeasurementCurvePoint, MeasurementLiveState } from './models/measurement/measurementDesign.js';
export type { MeasurementObservation, MeasurementEvidence, MeasurementEvidenceState, MeasurementLimitRow, MeasurementFrame } from './models/measurement/measurementModel.js';

// Lifetime.
export { lifetimePlan, decideLifetime, lifetimeBoundaries, lifetimeLimitRows, acceptTime, rejectTime } from './models/lifetime/lifetimePlan.js';
export type { LifetimePlan, LifetimeBoundaries, LifetimeDecision } from './models/lifetime/lifetimePlan.js';
export { designLifetimePlan, lifetimeLiveState, lifetimeTruncationRule } from './models/lifetime/lifetimeDesign.js';
export type { LifetimeDesign, LifetimeCurvePoint, LifetimeLiveState } from './models/lifetime/lifetimeDesign.js';
export { fixedDurationPlan, fixedDurationRisks } from './models/lifetime/fixedDurationPlan.js';
export type { FixedDurationPlan } from './models/lifetime/fixedDurationPlan.js';
export type { LifetimeObservation, LifetimeEvidence, LifetimeEvidenceState, LifetimeLimitRow, LifetimeFrame } from './models/lifetime/lifetimeModel.js';

// Graded.
export { gradedPlan, decideGraded, gradedBoundaries, gradedKl, gradedQuality, gradedLimitRows } from './models/graded/gradedPlan.js';
export type { GradedPlan, GradedBoundaries, GradedDecision } from './models/graded/gradedPlan.js';
export { designGradedPlan, gradedLiveState, GRADED_EXACT_LIMIT } from './models/graded/gradedDesign.js';
export type { GradedDesign, GradedCurvePoint, GradedLiveState, GradedDesignOptions } from './models/graded/gradedDesign.js';
export { gradeIndex } from './models/graded/gradedModel.js';
export type { GradedObservation, GradedEvidence, GradedEvidenceState, GradedLimitRow, GradedFrame } from './models/graded/gradedModel.js';

// Distributions the models and their screens share.
export { binomialCdf } from './distributions/binomial.js';
export { poissonCdf } from './distributions/poisson.js';
export { normalCdf, normalQuantile } from './distributions/normal.js';

// Bounds every plan is held to before any work is done.
export { checkPlanWork, PLAN_LIMITS } from './planWork.js';
export type { PlanWorkEstimate } from './planWork.js';
