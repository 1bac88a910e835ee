// Engine cases. "exact-curve" is the stated yardstick case: pass/fail, p0 0.05, p1 0.08, alpha 0.05, beta 0.05,
// truncation 3000, exact OC and ASN at 201 evenly spaced p from 0.01 to 0.15.
import { createPlanEvaluator, designLinearCountPlan, linearCountLiveState } from '../../../src-main/engine/index.js';
import type { LinearCountSpec } from '../../../src-main/engine/index.js';
import { benchCase } from '../benchCase.js';

const curveSpec: LinearCountSpec = { model: 'passfail', p0: 0.05, p1: 0.08, alpha: 0.05, beta: 0.05, truncation: 3000 };
const nist: LinearCountSpec = { model: 'passfail', p0: 0.01, p1: 0.1, alpha: 0.05, beta: 0.1 };

export const cases = [
  benchCase({
    name: 'exact-curve',
    description: 'pass/fail p0 0.05 p1 0.08 alpha 0.05 beta 0.05 truncation 3000: exact OC and ASN at 201 p in [0.01, 0.15], evaluator built each run',
    setup: () => ({
      qualities: Float64Array.from({ length: 201 }, (_, i) => 0.01 + (0.14 * i) / 200),
      accept: new Float64Array(201),
      asn: new Float64Array(201),
    }),
    run: ({ qualities, accept, asn }) => {
      createPlanEvaluator(curveSpec).evaluateMany(qualities, accept, asn);
      return accept[100] + asn[100];
    },
  }),
  benchCase({
    name: 'design-nist',
    description: 'designLinearCountPlan for the NIST example (untruncated, 51 curve points, single plan, suggested truncation)',
    run: () => designLinearCountPlan(nist).exact.asnH0,
  }),
  benchCase({
    name: 'design-nist-fit-exact',
    description: 'designLinearCountPlan for the NIST example with the exact-risk fit (fit cache cleared by varying beta slightly)',
    setup: () => ({ round: 0 }),
    run: (state) => designLinearCountPlan({ ...nist, beta: 0.1 + 1e-9 * ++state.round, fit: 'exact' }, { curvePoints: 11 }).fit.h1,
    repeat: 9,
    warmup: 2,
  }),
  benchCase({
    name: 'live-state',
    description: 'linearCountLiveState mid-run for the exact-curve plan (three exact recursions from n = 200, count 12)',
    run: () => linearCountLiveState(curveSpec, 200, 12).expectedRemainingH0,
  }),
];
