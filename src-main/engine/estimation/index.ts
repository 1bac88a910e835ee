/**
 * Estimation after a sequential stop: the exact stopping distribution of an integer plan, the
 * stagewise ordering and its exact interval, and Whitehead's bias-adjusted estimate.
 */
export { estimateAfterStop, ESTIMATION_METHOD } from './estimate-after-stop.js';
export type { EstimateAfterStop } from './estimate-after-stop.js';
export { createStoppingEvaluator } from './stopping-distribution.js';
export type {
  StoppingEvaluator,
  StoppingEvaluatorOptions,
  StoppingDistribution,
  StoppingPoint,
  StagewiseTail,
} from './stopping-distribution.js';
export { StagewiseSide, compareStagewise } from './stagewise-order.js';
export { stoppingPointsAt, checkStoppingPoint } from './stopping-points.js';
export type { StoppingPointsAt } from './stopping-points.js';
export { stagewiseInference } from './stagewise-interval.js';
export type { StagewiseInference } from './stagewise-interval.js';
export { biasAdjustedEstimate, naiveEstimateBias } from './bias-adjusted.js';
