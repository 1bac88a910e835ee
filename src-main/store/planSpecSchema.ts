/** zod schema of the engine's PlanSpec, for checking plan files and journal headers on read. */
import { z } from 'zod';
import type { AnyPlanSpec } from '../engine/index.js';

const risk = z.number().gt(0).lt(1);
const common = {
  alpha: risk,
  beta: risk,
  truncation: z.number().int().positive().nullable().optional(),
  fit: z.enum(['wald', 'exact']).optional(),
};

const risks = { alpha: risk, beta: risk };
const truncation = common.truncation;
const unit = z.string().max(40).optional();
const positive = z.number().positive();

/** Every model's parameters; the engine's factory checks the relations (p0 < p1, theta1 < theta0, sums). */
export const planSpecSchema = z.discriminatedUnion('model', [
  z.object({ model: z.literal('passfail'), p0: risk, p1: risk, ...common }),
  z.object({ model: z.literal('count'), lambda0: positive, lambda1: positive, ...common }),
  z.object({ model: z.literal('measurement'), mu0: z.number(), mu1: z.number(), sigma: positive, ...risks, truncation, overshootCorrection: z.boolean().optional(), unit }),
  z.object({
    model: z.literal('lifetime'),
    theta0: positive,
    theta1: positive,
    ...risks,
    maxTime: positive.nullable().optional(),
    maxFailures: z.number().int().positive().nullable().optional(),
    unit,
  }),
  z.object({ model: z.literal('graded'), classes: z.array(z.string().min(1)).min(2).max(10), p0: z.array(risk).max(10), p1: z.array(risk).max(10), ...risks, truncation }),
]) satisfies z.ZodType<AnyPlanSpec>;
