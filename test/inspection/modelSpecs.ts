/** Invented plans of the three models with their own design path, shared by the model tests. */
import type { GradedSpec, LifetimeSpec, MeasurementSpec } from '../../src-main/engine/index.js';

/** A shaft diameter: 10.0 mm acceptable, 10.5 mm rejectable, sigma 0.4 mm known (invented). */
export const measurementSpec: MeasurementSpec = { model: 'measurement', mu0: 10, mu1: 10.5, sigma: 0.4, alpha: 0.05, beta: 0.1, unit: 'mm' };
/** A pump: MTBF 1000 unit-hours acceptable, 500 rejectable (discrimination ratio 2, invented). */
export const lifetimeSpec: LifetimeSpec = { model: 'lifetime', theta0: 1000, theta1: 500, alpha: 0.1, beta: 0.1, unit: 'unit-hours' };
/** Castings graded conforming / minor / major (invented shares). */
export const gradedSpec: GradedSpec = {
  model: 'graded',
  classes: ['conforming', 'minor', 'major'],
  p0: [0.9, 0.08, 0.02],
  p1: [0.75, 0.17, 0.08],
  alpha: 0.05,
  beta: 0.1,
};

/** LLR of n measurements with the given sum: (mu1 - mu0)/sigma^2 (sum - n (mu0 + mu1)/2) (Wald 1947, ch. 5, normal case, from memory). */
export function measurementLlr(spec: MeasurementSpec, n: number, sum: number): number {
  return ((spec.mu1 - spec.mu0) / spec.sigma ** 2) * (sum - (n * (spec.mu0 + spec.mu1)) / 2);
}

/** LLR of a life test: r ln(theta0/theta1) - T (1/theta1 - 1/theta0) (Epstein and Sobel 1955, from memory). */
export function lifetimeLlr(spec: LifetimeSpec, time: number, failures: number): number {
  return failures * Math.log(spec.theta0 / spec.theta1) - time * (1 / spec.theta1 - 1 / spec.theta0);
}

/** LLR of graded counts: sum_k counts_k ln(p1_k/p0_k) (Wald 1947, §3.1: any likelihood ratio). */
export function gradedLlr(spec: GradedSpec, counts: readonly number[]): number {
  return counts.reduce((sum, count, k) => sum + count * Math.log(spec.p1[k] / spec.p0[k]), 0);
}
