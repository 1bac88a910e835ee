import { z } from 'zod';
import type { KlDivergences, WaldBoundaries } from '../../engine/index.js';

/** A finite number; ranges (0 < p0 < p1 < 1, alpha + beta < 1, ...) are the engine factory's job. */
const finite = z.number().finite();
const planOptions = {
  alpha: finite,
  beta: finite,
  truncation: z.number().int().nullable().optional(),
  fit: z.enum(['wald', 'exact']).optional(),
};

/** The plan parameters as they cross a boundary (IPC, HTTP, files, CLI). */
export const planSpecSchema = z.discriminatedUnion('model', [
  z.object({ model: z.literal('passfail'), p0: finite, p1: finite, ...planOptions }),
  z.object({ model: z.literal('count'), lambda0: finite, lambda1: finite, ...planOptions }),
]);

/** Channels of the Plan place. */
export const planChannels = {
  /** Wald's limits and the evidence per item (KL both ways): cheap, asked on every keystroke. */
  'plan.limits': { input: planSpecSchema },
} as const;

export interface PlanChannelOutputs {
  'plan.limits': { boundaries: WaldBoundaries; kl: KlDivergences };
}
