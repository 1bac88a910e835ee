/**
 * zod schemas of the engine's plan specs. One builder serves both places data enters: plan files
 * and journal headers (strict ranges) and the channels (shape only, so the engine's factory gives
 * its specific message, e.g. "p1 must be greater than p0").
 */
import { z } from 'zod';
import { checkPlanSpec, PlanParameterError } from '../engine/index.js';
import type { PlanSpec } from '../engine/index.js';

/** The number schemas a use of the builder wants for each kind of parameter. */
interface SpecNumbers {
  /** p0, p1 (and each class share), alpha, beta. */
  proportion: z.ZodNumber;
  /** lambda, sigma, theta, maximum test time. */
  positive: z.ZodNumber;
  /** truncation, maximum failures. */
  whole: z.ZodNumber;
}

/** The linear-count models (pass/fail, count) and every model, built from the given number schemas. */
export function planSpecSchemas({ proportion, positive, whole }: SpecNumbers) {
  const risks = { alpha: proportion, beta: proportion };
  const truncation = whole.nullable().optional();
  const linearOptions = { ...risks, truncation, fit: z.enum(['wald', 'exact']).optional() };
  /** A unit for display only, e.g. "mm" or "unit-hours". */
  const unit = z.string().trim().max(40).optional();
  const passFail = z.object({ model: z.literal('passfail'), p0: proportion, p1: proportion, ...linearOptions });
  const count = z.object({ model: z.literal('count'), lambda0: positive, lambda1: positive, ...linearOptions });
  return {
    linear: z.discriminatedUnion('model', [passFail, count]),
    /**
     * - passfail `{p0, p1, alpha, beta, truncation?, fit?}`, count `{lambda0, lambda1, ...same}`;
     * - measurement `{mu0, mu1, sigma, alpha, beta, truncation?, overshootCorrection?, unit?}`;
     * - lifetime `{theta0, theta1, alpha, beta, maxTime?, maxFailures?, unit?}`;
     * - graded `{classes: string[], p0: number[], p1: number[], alpha, beta, truncation?}`.
     */
    any: z.discriminatedUnion('model', [
      passFail,
      count,
      z.object({ model: z.literal('measurement'), mu0: z.number().finite(), mu1: z.number().finite(), sigma: positive, ...risks, truncation, overshootCorrection: z.boolean().optional(), unit }),
      z.object({ model: z.literal('lifetime'), theta0: positive, theta1: positive, ...risks, maxTime: positive.nullable().optional(), maxFailures: whole.nullable().optional(), unit }),
      z.object({
        model: z.literal('graded'),
        classes: z.array(z.string().trim().min(1, 'A class needs a name.').max(60)).min(2, 'A graded plan has at least 2 classes.').max(10, 'A graded plan has at most 10 classes.'),
        p0: z.array(proportion).max(10),
        p1: z.array(proportion).max(10),
        ...risks,
        truncation,
      }),
    ]),
  };
}

/**
 * Plan files and journal headers (so restore and journal replay too): every range checked, then the
 * engine's one spec check (checkPlanSpec: the relations p0 < p1, theta1 < theta0, sums, and the
 * bounds on truncation, failures and the work of a design), its message kept as the issue's.
 */
export const planSpecSchema = planSpecSchemas({
  proportion: z.number().gt(0).lt(1),
  positive: z.number().positive(),
  whole: z.number().int().positive(),
}).any.superRefine((spec, context) => {
  try {
    checkPlanSpec(spec as PlanSpec);
  } catch (error) {
    if (!(error instanceof PlanParameterError)) throw error;
    context.addIssue({ code: 'custom', path: [error.parameter], message: error.message });
  }
}) satisfies z.ZodType<PlanSpec>;
