import { it } from 'vitest';
import { createStoppingEvaluator, estimateAfterStop } from '../../../src-main/engine/estimation/index.js';
import { createPlanEvaluator } from '../../../src-main/engine/index.js';
it('smoke', () => {
  const spec = { model: 'passfail', p0: 0.01, p1: 0.1, alpha: 0.05, beta: 0.1, truncation: 156 } as const;
  const ev = createStoppingEvaluator(spec);
  for (const p of [0.01, 0.05, 0.1]) {
    const dist = ev.distribution(p);
    const acc = dist.points.filter((x) => x.decision === 'accept').reduce((a, b) => a + b.probability, 0);
    const tot = dist.points.reduce((a, b) => a + b.probability, 0);
    console.log(p, acc, tot, dist.points.length, createPlanEvaluator(spec).evaluate(p).accept);
  }
  for (const o of [{ n: 24, total: 0 }, { n: 2, total: 2 }, { n: 30, total: 3 }, { n: 156, total: 6 }, { n: 156, total: 7 }, { n: 49, total: 1 }]) {
    console.log(o, estimateAfterStop(ev, o));
  }
  try { estimateAfterStop(ev, { n: 30, total: 5 }); } catch (e) { console.log(String(e)); }
  try { estimateAfterStop(ev, { n: 30, total: 1 }); } catch (e) { console.log(String(e)); }
  try { estimateAfterStop(ev, { n: 200, total: 1 }); } catch (e) { console.log(String(e)); }
  const cs = { model: 'count', lambda0: 0.5, lambda1: 2, alpha: 0.05, beta: 0.1 } as const;
  const ce = createStoppingEvaluator(cs);
  const d = ce.distribution(1);
  console.log(d.points.length, d.undecided, d.points.reduce((a, b) => a + b.probability, 0), createPlanEvaluator(cs).evaluate(1).accept, d.points.filter((x) => x.decision === 'accept').reduce((a, b) => a + b.probability, 0));
  console.log(d.points.slice(0, 12));
  console.log(estimateAfterStop(ce, { n: d.points[0].itemCount, total: d.points[0].total }));
  const rej = d.points.find((x) => x.decision === 'reject')!;
  console.log(rej, estimateAfterStop(ce, { n: rej.itemCount, total: rej.total + 3 }));
});
