/**
 * Estimation after a sequential stop: the exact stopping distribution of an integer plan, the
 * stagewise ordering and its exact interval, and Whitehead's bias-adjusted estimate.
 */
export { estimateAfterStop, ESTIMATION_METHOD } from './estimateAfterStop.js';
export type { EstimateAfterStop } from './estimateAfterStop.js';
export { createStoppingEvaluator } from './stoppingDistribution.js';
export type {
  StoppingEvaluator,
  StoppingEvaluatorOptions,
  StoppingDistribution,
  StoppingPoint,
  StagewiseTail,
} from './stoppingDistribution.js';
export { StagewiseSide, compareStagewise } from './stagewiseOrder.js';
export { stoppingPointsAt, checkStoppingPoint } from './stoppingPoints.js';
export type { StoppingPointsAt } from './stoppingPoints.js';
export { stagewiseInference } from './stagewiseInterval.js';
export type { StagewiseInference } from './stagewiseInterval.js';
export { biasAdjustedEstimate, naiveEstimateBias } from './biasAdjusted.js';
