/** zod schema of the engine's PlanSpec, for checking plan files and journal headers on read. */
import { z } from 'zod';
import type { PlanSpec } from '../engine/index.js';

const risk = z.number().gt(0).lt(1);
const common = {
  alpha: risk,
  beta: risk,
  truncation: z.number().int().positive().nullable().optional(),
  fit: z.enum(['wald', 'exact']).optional(),
};

export const planSpecSchema = z.discriminatedUnion('model', [
  z.object({ model: z.literal('passfail'), p0: risk, p1: risk, ...common }),
  z.object({ model: z.literal('count'), lambda0: z.number().positive(), lambda1: z.number().positive(), ...common }),
]) satisfies z.ZodType<PlanSpec>;
