import { klDivergences, waldBoundaries } from '../../engine/index.js';
import type { ChannelHandlers } from '../dispatcher.js';

type PlanHandlers = Pick<ChannelHandlers, 'plan.limits'>;

export function createPlanHandlers(): PlanHandlers {
  return {
    'plan.limits': (spec) => ({ boundaries: waldBoundaries(spec), kl: klDivergences(spec) }),
  };
}
