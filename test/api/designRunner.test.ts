// The design runner of the built app: designs in a worker thread, refusals rebuilt as the engine's
// error, newer edits of one form superseding older ones, and the event loop free while it designs.
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { designPlan, PlanParameterError, type PlanSpec } from '../../src-main/engine/index.js';
import type * as RunnerModule from '../../src-main/api/design/designRunner.js';

// The compiled module, as the hosts load it: its worker script sits beside it (the global setup builds it).
const built = pathToFileURL(join(import.meta.dirname, '..', '..', 'build', 'main', 'api', 'design', 'designRunner.js')).href;
const { createDesignRunner, SUPERSEDED } = (await import(built)) as typeof RunnerModule;
// PlanParameterError of the compiled engine: the runner rebuilds refusals with it.
const { PlanParameterError: BuiltPlanParameterError } = (await import(
  pathToFileURL(join(import.meta.dirname, '..', '..', 'build', 'main', 'engine', 'index.js')).href
)) as { PlanParameterError: typeof PlanParameterError };

// NIST/SEMATECH e-Handbook §6.2.6 example plan (p0 0.01, p1 0.10, alpha 0.05, beta 0.10), first-hand.
const nist: PlanSpec = { model: 'passfail', p0: 0.01, p1: 0.1, alpha: 0.05, beta: 0.1 };
// A design that takes a while: a three-class graded plan over 31 curve points (invented qualities).
const slow: PlanSpec = { model: 'graded', classes: ['ok', 'minor', 'major'], p0: [0.92, 0.06, 0.02], p1: [0.8, 0.14, 0.06], alpha: 0.05, beta: 0.1 };

const runner = createDesignRunner();
afterAll(() => runner.close());

describe('the design runner of the built app', () => {
  it('designs in a worker thread, the same design as on this thread', async () => {
    expect(runner.inWorker).toBe(true);
    const design = await runner.design(nist, { curvePoints: 11 });
    expect(design).toEqual(JSON.parse(JSON.stringify(designPlan(nist, { curvePoints: 11 }))));
  });

  it("answers a spec the engine refuses with the engine's error, naming the parameter", async () => {
    const refused = runner.design({ ...nist, p1: 0.005 }, {});
    await expect(refused).rejects.toBeInstanceOf(BuiltPlanParameterError);
    await expect(refused).rejects.toMatchObject({ parameter: 'p1' });
  });

  it('drops a running design when a newer edit of the same form arrives, and designs the newer one', async () => {
    const older = runner.design(slow, { curvePoints: 31 }, 'plan-form');
    const newer = runner.design(nist, { curvePoints: 11 }, 'plan-form');
    await expect(older).resolves.toBe(SUPERSEDED);
    await expect(newer).resolves.toMatchObject({ model: 'passfail' });
  });

  it('leaves the event loop free while a long design runs, and keeps other forms\' designs', async () => {
    const order: string[] = [];
    const long = runner.design(slow, { curvePoints: 31 }, 'form-a').then((design) => {
      order.push('design');
      return design;
    });
    // A timer, like another channel's request, is served while the worker designs.
    await new Promise((resolve) => setTimeout(resolve, 20));
    order.push('timer');
    const other = runner.design(nist, { curvePoints: 11 }, 'form-b');
    await expect(long).resolves.toMatchObject({ model: 'graded' });
    await expect(other).resolves.toMatchObject({ model: 'passfail' });
    expect(order).toEqual(['timer', 'design']);
  });
});

describe('a runner where no compiled worker exists', () => {
  it('designs on the calling thread, the same design', async () => {
    const onThread = createDesignRunner({ inWorker: false });
    expect(onThread.inWorker).toBe(false);
    expect(await onThread.design(nist, { curvePoints: 11 })).toEqual(designPlan(nist, { curvePoints: 11 }));
  });
});

describe('a runner whose worker cannot start', () => {
  it('designs on the calling thread instead and says so', async () => {
    // A script that throws as it loads, as a packaging that cannot start workers would.
    const broken = new URL(`data:text/javascript,${encodeURIComponent("throw new Error('no workers here')")}`);
    const fallback = createDesignRunner({ inWorker: true, workerScript: broken });
    try {
      expect(await fallback.design(nist, { curvePoints: 11 })).toEqual(JSON.parse(JSON.stringify(designPlan(nist, { curvePoints: 11 }))));
      expect(fallback.inWorker).toBe(false);
    } finally {
      await fallback.close();
    }
  });
});
