/**
 * One entry point for designing and checking a plan of any model: the linear-count models
 * (pass/fail, count) go through `designPlan`, the others through their own design path. Every
 * design carries its `model`, so callers can tell the shapes apart.
 */
import { designPlan } from './designPlan.js';
import { gradedPlan } from './models/graded.js';
import { designGradedPlan } from './models/gradedDesign.js';
import type { GradedDesign } from './models/gradedDesign.js';
import { lifetimePlan } from './models/lifetime.js';
import { designLifetimePlan } from './models/lifetimeDesign.js';
import type { LifetimeDesign } from './models/lifetimeDesign.js';
import { measurementPlan } from './models/measurement.js';
import { designMeasurementPlan } from './models/measurementDesign.js';
import type { MeasurementDesign } from './models/measurementDesign.js';
import type { PlanDesign } from './planDesignTypes.js';
import { checkPlanWork } from './planWork.js';
import type { AnyPlanSpec, ExtendedPlanSpec } from './spec.js';
import { waldBoundaries } from './waldBoundaries.js';

/** The design of a plan of any model, discriminated by `model`. */
export type AnyPlanDesign = PlanDesign | MeasurementDesign | LifetimeDesign | GradedDesign;

/** True for the models with their own design path (measurement, lifetime, graded). */
export function isExtendedPlanSpec(spec: AnyPlanSpec): spec is ExtendedPlanSpec {
  return spec.model === 'measurement' || spec.model === 'lifetime' || spec.model === 'graded';
}

/**
 * Designs a plan of any model.
 *
 * Method: dispatch on `model` to designPlan, designMeasurementPlan, designLifetimePlan or
 * designGradedPlan; each keeps its own Method and References.
 * References: see the model's design function.
 *
 * @throws PlanParameterError for an invalid spec or curvePoints.
 */
export function designAnyPlan(spec: AnyPlanSpec, options: { curvePoints?: number } = {}): AnyPlanDesign {
  checkAnyPlanSpec(spec, options);
  switch (spec.model) {
    case 'measurement':
      return designMeasurementPlan(spec, options);
    case 'lifetime':
      return designLifetimePlan(spec, options);
    case 'graded':
      return designGradedPlan(spec, options);
    default:
      return designPlan(spec, options);
  }
}

/**
 * Checks a spec of any model without designing it, in well under a millisecond: its model's factory
 * (ranges, truncation and failure bounds), then the size of its runs and of its design
 * (checkPlanWork). The one check for the CLI, the channels, plan files, restore and journal replay.
 *
 * @param options.curvePoints the qualities the design will compute (default 51).
 * @throws PlanParameterError naming the parameter, its value and what is allowed.
 */
export function checkAnyPlanSpec(spec: AnyPlanSpec, options: { curvePoints?: number } = {}): void {
  if (spec.model === 'measurement') measurementPlan(spec);
  else if (spec.model === 'lifetime') lifetimePlan(spec);
  else if (spec.model === 'graded') gradedPlan(spec);
  else waldBoundaries(spec);
  checkPlanWork(spec, options.curvePoints ?? 51);
}
