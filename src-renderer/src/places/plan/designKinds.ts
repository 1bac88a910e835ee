/** The plan.design answer told apart by model: the linear-count designs and the three others. */
import type { LinearCountDesign } from '../../../../src-main/api/channels/planChannels';
import type { GradedDesign, LifetimeDesign, MeasurementDesign } from '../../../../src-main/engine/index';

export type ExtendedDesign = MeasurementDesign | LifetimeDesign | GradedDesign;
/** Pass/fail and count designs (acceptance and rejection numbers, quantiles, single plan n/c). */
export type LinearDesign = Exclude<LinearCountDesign, ExtendedDesign>;

export function linearDesign(design: LinearCountDesign | null): LinearDesign | null {
  return design !== null && (design.model === 'passfail' || design.model === 'count') ? (design as LinearDesign) : null;
}
