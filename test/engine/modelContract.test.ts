/**
 * The members of the SequentialModel contract that draw, read and print a run, for every model:
 * frame and point, parseEntryText, flags, text, json, labels.pooledRate and drawObservation.
 */
import { describe, expect, it } from 'vitest';
import {
  frameHorizon,
  modelFlags,
  modelLabels,
  modelNames,
  planOf,
  designPlan,
  type PlanFlagReader,
  type PlanSpec,
} from '../../src-main/engine/index.js';
import { normalCdf } from '../../src-main/engine/numerics/normalDistribution.js';
import { gradedSpec, lifetimeSpec, measurementSpec } from '../inspection/modelSpecs.js';

/** NIST/SEMATECH e-Handbook §6.2.6 example (first-hand): p0 0.01, p1 0.10, alpha 0.05, beta 0.10. */
const nistSpec: PlanSpec = { model: 'passfail', p0: 0.01, p1: 0.1, alpha: 0.05, beta: 0.1 };
/** An invented count plan. */
const countSpec: PlanSpec = { model: 'count', lambda0: 0.1, lambda1: 0.5, alpha: 0.05, beta: 0.1 };

/** Wald's limits ln A = ln((1 - beta)/alpha), ln B = ln(beta/(1 - alpha)) (Wald 1947 §3.2, from memory). */
const waldLnA = (alpha: number, beta: number) => Math.log((1 - beta) / alpha);
const waldLnB = (alpha: number, beta: number) => Math.log(beta / (1 - alpha));

/** The state and look-ahead of a run after the results given. */
function after(spec: PlanSpec, results: readonly unknown[]) {
  const plan = planOf(spec);
  let evidence = plan.emptyEvidence();
  for (const result of results) evidence = plan.observe(evidence, plan.canonical(result as never));
  const state = plan.state(evidence);
  return { plan, evidence, state, live: plan.liveState(state) };
}

/** A flag reader over plain values, as the CLI gives one; a missing required flag throws naming it. */
function reader(values: Record<string, unknown>): PlanFlagReader {
  return {
    need: <V>(name: string) => {
      if (values[name] === undefined) throw new Error(`--${name} is required`);
      return values[name] as V;
    },
    given: <V>(name: string) => values[name] as V | undefined,
    refuse: (_name, _allowed, message) => {
      throw new Error(message);
    },
  };
}

describe('frameHorizon, the one horizon rule', () => {
  it('draws 1.25 times the reach, at least the minimum, never past the limit unless the run stands there', () => {
    expect(frameHorizon({ reached: 0, reach: 24, minimum: 10, limit: null })).toBe(30);
    expect(frameHorizon({ reached: 0, reach: 4, minimum: 10, limit: null })).toBe(10);
    expect(frameHorizon({ reached: 0, reach: 24, minimum: 10, limit: 20 })).toBe(20);
    expect(frameHorizon({ reached: 25, reach: 30, minimum: 10, limit: 20 })).toBe(20);
    expect(frameHorizon({ reached: 15, reach: 16, minimum: 10, limit: 40 })).toBe(20);
  });
});

describe('frame', () => {
  it('pass/fail: draws to 30 items before the first result (earliest accept at 24, NIST §6.2.6) with Wald ln A and ln B', () => {
    const { plan, live } = after(nistSpec, []);
    const frame = plan.frame(live);
    expect(frame.model).toBeUndefined();
    // Earliest accept: slope n >= h1 with h1 0.939, slope 0.0397 (NIST §6.2.6) at n = 24; 1.25 x 24 = 30.
    expect(frame.horizon).toBe(30);
    expect(frame.limits).toHaveLength(30);
    expect(frame.lnA).toBeCloseTo(waldLnA(0.05, 0.1), 10);
    expect(frame.lnB).toBeCloseTo(waldLnB(0.05, 0.1), 10);
    expect(frame.truncation).toBeNull();
  });

  it('pass/fail: never draws past the truncation', () => {
    const { plan, live } = after({ ...nistSpec, truncation: 20 }, []);
    const frame = plan.frame(live);
    expect(frame.horizon).toBe(20);
    expect(frame.truncation).toBe(20);
  });

  it('count: draws its limits in nonconformities up to the horizon', () => {
    const { plan, live } = after(countSpec, [0, 1]);
    const frame = plan.frame(live);
    expect(frame.model).toBeUndefined();
    expect(frame.horizon).toBeGreaterThanOrEqual(10);
    expect(frame.limits.map((row) => ('n' in row ? row.n : -1))).toEqual(Array.from({ length: frame.horizon }, (_, i) => i + 1));
    expect(frame.lnA).toBeCloseTo(waldLnA(0.05, 0.1), 10);
  });

  it('measurement: draws 1.25 times the expected end, with the unit and the side that rejects', () => {
    const { plan, live, state } = after(measurementSpec, [{ value: 10.1 }]);
    const frame = plan.frame(live);
    if (frame.model !== 'measurement' || live.model !== 'measurement') throw new Error('a measurement frame was expected');
    const reach = state.n + Math.max(1, live.expectedRemainingH0, live.expectedRemainingH1);
    expect(frame.horizon).toBe(Math.max(10, Math.ceil(1.25 * reach)));
    expect(frame.limits).toHaveLength(frame.horizon);
    expect(frame.rejectWhen).toBe('above');
    expect(frame.unit).toBe('mm');
    expect(frame.lnA).toBeCloseTo(waldLnA(0.05, 0.1), 10);
    expect(frame.lnB).toBeCloseTo(waldLnB(0.05, 0.1), 10);
  });

  it('lifetime: draws failure counts, at least 3 and the first that can reject, with no item truncation', () => {
    const { plan, live } = after(lifetimeSpec, []);
    const frame = plan.frame(live);
    if (frame.model !== 'lifetime') throw new Error('a lifetime frame was expected');
    expect(frame.horizon).toBeGreaterThanOrEqual(3);
    expect(frame.limits.map((row) => row.failures)).toEqual(Array.from({ length: frame.limits.length }, (_, i) => frame.limits[0].failures + i));
    expect(frame.truncation).toBeNull();
    expect(frame.unit).toBe('unit-hours');
    expect(frame.lnA).toBeCloseTo(waldLnA(0.1, 0.1), 10);
  });

  it('graded: draws demerit limits and the demerits per class (first class 0, second 1)', () => {
    const { plan, live } = after(gradedSpec, [{ grade: 'minor' }]);
    const frame = plan.frame(live);
    if (frame.model !== 'graded') throw new Error('a graded frame was expected');
    expect(frame.limits).toHaveLength(frame.horizon);
    expect(frame.demerits.map((row) => row.className)).toEqual(['conforming', 'minor', 'major']);
    expect(frame.demerits[0].demerits).toBe(0);
    expect(frame.demerits[1].demerits).toBe(1);
  });
});

describe('point', () => {
  it('is n against the running total with the LLR, and for lifetime also the test time', () => {
    const passfail = after(nistSpec, ['pass', 'fail']);
    expect(passfail.plan.point(passfail.state)).toEqual({ n: 2, total: 1, llr: passfail.state.llr });
    const measurement = after(measurementSpec, [{ value: 10.2 }, { value: 10.4 }]);
    expect(measurement.plan.point(measurement.state)).toEqual({ n: 2, total: measurement.state.total, llr: measurement.state.llr });
    expect(measurement.state.total).toBeCloseTo(20.6, 12);
    const lifetime = after(lifetimeSpec, [{ time: 300 }, { failure: true }]);
    expect(lifetime.plan.point(lifetime.state)).toEqual({ n: 2, total: 1, llr: lifetime.state.llr, time: 300 });
    const graded = after(gradedSpec, [{ grade: 'minor' }]);
    expect(graded.plan.point(graded.state)).toEqual({ n: 1, total: 1, llr: graded.state.llr });
  });
});

describe('parseEntryText', () => {
  it.each([
    [nistSpec, 'FAIL', 'fail'],
    [nistSpec, '0', 'pass'],
    [countSpec, '3', 3],
    [measurementSpec, '10.03', { value: 10.03 }],
    [measurementSpec, '-1e-2', { value: -0.01 }],
    [lifetimeSpec, 'time 250', { time: 250 }],
    [lifetimeSpec, 'fail', { failure: true }],
    [lifetimeSpec, 'Fail 300', { failure: true, time: 300 }],
    [gradedSpec, 'MAJOR', { grade: 'major' }],
    [gradedSpec, '1', { grade: 'minor' }],
  ] as Array<[PlanSpec, string, unknown]>)('reads a %s plan line %j as its result', (spec, text, result) => {
    expect(planOf(spec).parseEntryText(text)).toEqual({ result });
  });

  it.each([
    [nistSpec, 'maybe', '"maybe" is not pass, fail, 0 or 1'],
    [nistSpec, 'constructor', '"constructor" is not pass, fail, 0 or 1'],
    [countSpec, '1.5', '"1.5" is not a whole number of nonconformities (0 or more)'],
    [measurementSpec, '10,3', '"10,3" is not a measured value (a number such as 10.03)'],
    [lifetimeSpec, 'time', '"time" is not "time T", "fail" or "fail T" (T the accumulated test time, a number of 0 or more)'],
    [lifetimeSpec, 'fail -3', '"fail -3" is not "time T", "fail" or "fail T" (T the accumulated test time, a number of 0 or more)'],
    [gradedSpec, '3', '"3" is not a class of this plan (conforming, minor, major) or its index 0 to 2'],
  ] as Array<[PlanSpec, string, string]>)('says what is wrong with a %s plan line %j', (spec, text, problem) => {
    expect(planOf(spec).parseEntryText(text)).toEqual({ problem });
  });
});

describe('flags', () => {
  it('declare each shared flag with one kind across the models', () => {
    const kinds = new Map<string, string>();
    for (const model of modelNames) {
      for (const declared of modelFlags(model).own) {
        const kind = JSON.stringify({ ...declared, name: undefined });
        expect(kinds.get(declared.name) ?? kind, `--${declared.name} of ${model}`).toBe(kind);
        kinds.set(declared.name, kind);
      }
    }
  });

  it.each([
    ['passfail', { p0: 0.01, p1: 0.1, alpha: 0.05, beta: 0.1, truncate: 40 }, { model: 'passfail', p0: 0.01, p1: 0.1, alpha: 0.05, beta: 0.1, truncation: 40, fit: 'wald' }],
    ['count', { lambda0: 0.1, lambda1: 0.5, alpha: 0.05, beta: 0.1, fit: 'exact' }, { model: 'count', lambda0: 0.1, lambda1: 0.5, alpha: 0.05, beta: 0.1, truncation: null, fit: 'exact' }],
    ['measurement', { mu0: 10, mu1: 10.5, sigma: 0.4, alpha: 0.05, beta: 0.1, unit: 'mm' }, { model: 'measurement', mu0: 10, mu1: 10.5, sigma: 0.4, alpha: 0.05, beta: 0.1, truncation: null, overshootCorrection: false, unit: 'mm' }],
    ['lifetime', { theta0: 1000, theta1: 500, alpha: 0.1, beta: 0.1, 'max-failures': 8 }, { model: 'lifetime', theta0: 1000, theta1: 500, alpha: 0.1, beta: 0.1, maxTime: null, maxFailures: 8 }],
    ['graded', { classes: ['a', 'b'], p0: [0.9, 0.1], p1: [0.7, 0.3], alpha: 0.05, beta: 0.1 }, { model: 'graded', classes: ['a', 'b'], p0: [0.9, 0.1], p1: [0.7, 0.3], alpha: 0.05, beta: 0.1, truncation: null }],
  ] as Array<[PlanSpec['model'], Record<string, unknown>, PlanSpec]>)('%s: reads its spec from its flags, keys in the order plan files keep', (model, values, spec) => {
    const read = modelFlags(model).spec(reader(values));
    expect(read).toEqual(spec);
    expect(Object.keys(read)).toEqual(Object.keys(spec));
  });

  it('name a missing required flag and refuse a list where one probability is asked or a list of the wrong length', () => {
    expect(() => modelFlags('measurement').spec(reader({ mu0: 10, sigma: 1, alpha: 0.05, beta: 0.1 }))).toThrow('--mu1 is required');
    expect(() => modelFlags('passfail').spec(reader({ p0: [0.1, 0.9], p1: 0.2, alpha: 0.05, beta: 0.1 }))).toThrow('--p0 must be a number in (0, 1) for --model passfail (got a list)');
    expect(() => modelFlags('graded').spec(reader({ classes: ['a', 'b', 'c'], p0: [0.9, 0.1], p1: [0.7, 0.2, 0.1], alpha: 0.05, beta: 0.1 }))).toThrow(
      '--p0 must be 3 probabilities, comma-separated, one per class of --classes, summing to 1 (got 2)',
    );
  });

  it('list only flags the model takes and give each model help lines', () => {
    expect(modelFlags('lifetime').own.map((declared) => declared.name)).not.toContain('truncate');
    expect(modelFlags('measurement').own.map((declared) => declared.name)).not.toContain('fit');
    for (const model of modelNames) expect(modelFlags(model).usage.every((line) => line.startsWith('  '))).toBe(true);
  });
});

describe('text and json', () => {
  it('pass/fail and count: print n and the total; replay JSON {n, total}, run show adds nothing', () => {
    const { plan, state } = after(nistSpec, ['pass', 'fail', 'pass']);
    expect(plan.text.result('fail')).toBe('fail');
    expect(plan.text.evidence(state)).toBe('n = 3, total = 1');
    expect(plan.text.evidenceColumn).toBe('total');
    expect(plan.text.evidenceCell(state)).toBe('1');
    expect(plan.text.reached(state)).toBe('after 3 items, total 1');
    expect(plan.json.state(state)).toEqual({});
    expect(plan.json.summary(state)).toEqual({ n: 3, total: 1 });
    expect(planOf(countSpec).text.result(2)).toBe('2');
  });

  it('measurement: prints the sum; replay JSON {n, sum}, run show adds {sum, mean}', () => {
    const { plan, state } = after(measurementSpec, [{ value: 10.25 }, { value: 10.5 }]);
    expect(plan.text.result({ value: 10.25 })).toBe('10.25');
    expect(plan.text.evidence(state)).toBe('n = 2, sum = 20.75');
    expect(plan.text.evidenceColumn).toBe('evidence');
    expect(plan.text.evidenceCell(state)).toBe('20.75');
    expect(plan.text.reached(state)).toBe('after 2 entries, 20.75');
    expect(Object.keys(plan.json.state(state))).toEqual(['sum', 'mean']);
    expect(plan.json.state(state)).toEqual({ sum: 20.75, mean: 10.375 });
    expect(plan.json.summary(state)).toEqual({ n: 2, sum: 20.75 });
  });

  it('lifetime: prints test time and failures; replay JSON and run show add {time, failures}', () => {
    const { plan, state } = after(lifetimeSpec, [{ time: 120 }, { failure: true, time: 150 }]);
    expect([plan.text.result({ time: 120 }), plan.text.result({ failure: true }), plan.text.result({ failure: true, time: 150 })]).toEqual(['time 120', 'fail', 'fail 150']);
    expect(plan.text.evidence(state)).toBe('test time = 150, failures = 1');
    expect(plan.text.evidenceCell(state)).toBe('T 150, r 1');
    expect(plan.text.reached(state)).toBe('after 2 entries, T 150, r 1');
    expect(plan.json.state(state)).toEqual({ time: 150, failures: 1 });
    expect(Object.keys(plan.json.summary(state))).toEqual(['time', 'failures']);
  });

  it('graded: prints the counts per class and demerits; replay JSON {n, counts}, run show adds {counts, demerits}', () => {
    const { plan, state } = after(gradedSpec, [{ grade: 'minor' }, { grade: 'conforming' }]);
    expect(plan.text.result({ grade: 'minor' })).toBe('minor');
    expect(plan.text.evidence(state)).toBe(`n = 2, counts = 1/1/0, demerits = 1`);
    expect(plan.text.evidenceCell(state)).toBe('1/1/0');
    expect(plan.text.reached(state)).toBe('after 2 entries, 1/1/0');
    expect(plan.json.state(state)).toEqual({ counts: [1, 1, 0], demerits: 1 });
    expect(plan.json.summary(state)).toEqual({ n: 2, counts: [1, 1, 0] });
  });

  it('prints each design readably, starting with the plan in words', () => {
    expect(planOf(nistSpec).text.design(designPlan(nistSpec))).toMatch(/^Sequential plan, passfail: p0 = 0\.01, p1 = 0\.1, alpha = 0\.05, beta = 0\.1\n/);
    expect(planOf(countSpec).text.design(designPlan(countSpec))).toMatch(/^Sequential plan, count: lambda0 = 0\.1, lambda1 = 0\.5,/);
    expect(planOf(measurementSpec).text.design(designPlan(measurementSpec))).toMatch(/^Sequential plan, measurement: mu0 = 10, mu1 = 10\.5, sigma = 0\.4,/);
    expect(planOf(lifetimeSpec).text.design(designPlan(lifetimeSpec))).toMatch(/^Sequential plan, lifetime: theta0 = 1000, theta1 = 500 \(d = 2\),/);
    expect(planOf(gradedSpec).text.design(designPlan(gradedSpec))).toMatch(/^Sequential plan, graded: classes conforming, minor, major,/);
  });
});

describe('labels.pooledRate', () => {
  it('names the rate of pass/fail and count totals and is null where a total is no count of nonconforming items', () => {
    expect(modelNames.map((model) => [model, modelLabels(model).pooledRate])).toEqual([
      ['passfail', 'fraction nonconforming'],
      ['count', 'nonconformities per item'],
      ['measurement', null],
      ['lifetime', null],
      ['graded', null],
    ]);
  });
});

describe('drawObservation', () => {
  const uniforms = (...values: number[]) => () => {
    const value = values.shift();
    if (value === undefined) throw new Error('more uniforms drawn than given');
    return value;
  };

  it('pass/fail: a failure when the uniform falls below p', () => {
    const plan = planOf(nistSpec);
    expect(plan.drawObservation(plan.emptyEvidence(), 0.01, uniforms(0.005))).toBe('fail');
    expect(plan.drawObservation(plan.emptyEvidence(), 0.01, uniforms(0.02))).toBe('pass');
  });

  it('count: the number of uniforms multiplied before the product falls to e^-lambda (Knuth 1997 §3.4.1)', () => {
    const plan = planOf(countSpec);
    // e^-0.5 = 0.6065: 0.9 and 0.9 x 0.8 = 0.72 stay above, 0.72 x 0.5 = 0.36 falls below: 2.
    expect(plan.drawObservation(plan.emptyEvidence(), 0.5, uniforms(0.9, 0.8, 0.5))).toBe(2);
    expect(plan.drawObservation(plan.emptyEvidence(), 0.5, uniforms(0.6))).toBe(0);
  });

  it('measurement: the normal quantile of the uniform around the quality, scaled by sigma', () => {
    const plan = planOf(measurementSpec);
    expect((plan.drawObservation(plan.emptyEvidence(), 10.2, uniforms(0.5)) as { value: number }).value).toBeCloseTo(10.2, 9);
    // One sigma above: the uniform at Phi(1).
    expect((plan.drawObservation(plan.emptyEvidence(), 10.2, uniforms(normalCdf(1))) as { value: number }).value).toBeCloseTo(10.6, 6);
  });

  it('lifetime: the next failure an exponential time after the test time so far', () => {
    const { plan, evidence } = after(lifetimeSpec, [{ time: 100 }]);
    // u = 1 - e^-1 gives one mean time: 100 + 800.
    const drawn = plan.drawObservation(evidence, 800, uniforms(1 - Math.exp(-1))) as { failure: true; time: number };
    expect(drawn.failure).toBe(true);
    expect(drawn.time).toBeCloseTo(900, 9);
  });

  it('graded: the class by inversion of (1 - t) p0 + t p1', () => {
    const plan = planOf(gradedSpec);
    const at = (t: number, u: number) => plan.drawObservation(plan.emptyEvidence(), t, uniforms(u));
    // At t = 0 the shares are p0 = 0.9, 0.08, 0.02.
    expect([at(0, 0.5), at(0, 0.95), at(0, 0.99)]).toEqual([{ grade: 'conforming' }, { grade: 'minor' }, { grade: 'major' }]);
    // At t = 1 they are p1 = 0.75, 0.17, 0.08: 0.8 is minor.
    expect(at(1, 0.8)).toEqual({ grade: 'minor' });
  });
});
