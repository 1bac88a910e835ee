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
