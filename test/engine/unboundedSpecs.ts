// Specs whose design used to run until killed (or throw a typed-array RangeError), each with the
// parameter the refusal names and words its one-line message must hold. Shared by the engine, the
// channel and the command-line tests, so all three refuse the same list.
import type { PlanSpec } from '../../src-main/engine/index.js';

export interface UnboundedSpec {
  name: string;
  spec: PlanSpec;
  /** The engine parameter the refusal names. */
  parameter: string;
  /** Words the message must contain: what is allowed. */
  message: RegExp;
  /** The same spec as command-line plan flags. */
  flags: string[];
}

const risks = { alpha: 0.05, beta: 0.1 };
const riskFlags = ['--alpha', '0.05', '--beta', '0.1'];
const fiveClasses = ['conforming', 'cosmetic', 'minor', 'major', 'critical'];

export const unboundedSpecs: UnboundedSpec[] = [
  {
    name: 'pass/fail truncated at 10,000,000 items',
    spec: { model: 'passfail', p0: 0.01, p1: 0.1, ...risks, truncation: 10_000_000 },
    parameter: 'truncation',
    message: /truncation must be an integer from 1 to 100000/,
    flags: ['--model', 'passfail', '--p0', '0.01', '--p1', '0.10', ...riskFlags, '--truncate', '10000000'],
  },
  {
    name: 'pass/fail truncated at 1e9 items',
    spec: { model: 'passfail', p0: 0.01, p1: 0.1, ...risks, truncation: 1e9 },
    parameter: 'truncation',
    message: /truncation must be an integer from 1 to 100000/,
    flags: ['--model', 'passfail', '--p0', '0.01', '--p1', '0.10', ...riskFlags, '--truncate', '1000000000'],
  },
  {
    name: 'pass/fail with p1 within 0.1 % of p0',
    spec: { model: 'passfail', p0: 0.01, p1: 0.01001, ...risks },
    parameter: 'p1',
    message: /p1 within 0\.1 % of p0 would need about \d+ million items per run \(at most 100,000 allowed\); widen the gap/,
    flags: ['--model', 'passfail', '--p0', '0.01', '--p1', '0.01001', ...riskFlags],
  },
  {
    name: 'count with lambda around 1e6 per unit',
    spec: { model: 'count', lambda0: 1e6, lambda1: 2e6, ...risks },
    parameter: 'lambda1',
    message: /exact curves would take about \d+ billion steps .* at most 3 billion allowed/,
    flags: ['--model', 'count', '--lambda0', '1e6', '--lambda1', '2e6', ...riskFlags],
  },
  {
    name: 'count with lambda around 1e-300 per unit',
    spec: { model: 'count', lambda0: 1e-300, lambda1: 2e-300, ...risks },
    parameter: 'lambda1',
    message: /lambda0 = 1e-300 and lambda1 = 2e-300 would need about 9\.4e300 items per run/,
    flags: ['--model', 'count', '--lambda0', '1e-300', '--lambda1', '2e-300', ...riskFlags],
  },
  {
    name: 'measurement truncated at 1,000,000 values',
    spec: { model: 'measurement', mu0: 10, mu1: 10.5, sigma: 1, ...risks, truncation: 1_000_000 },
    parameter: 'truncation',
    message: /truncation must be an integer from 1 to 100000/,
    flags: ['--model', 'measurement', '--mu0', '10', '--mu1', '10.5', '--sigma', '1', ...riskFlags, '--truncate', '1000000'],
  },
  {
    name: 'lifetime stopping at the 1e9th failure',
    spec: { model: 'lifetime', theta0: 1000, theta1: 500, ...risks, maxFailures: 1e9 },
    parameter: 'maxFailures',
    message: /maxFailures must be an integer from 1 to 10000/,
    flags: ['--model', 'lifetime', '--theta0', '1000', '--theta1', '500', ...riskFlags, '--max-failures', '1000000000'],
  },
  {
    name: 'lifetime with theta1 = 999.999 against theta0 = 1000',
    spec: { model: 'lifetime', theta0: 1000, theta1: 999.999, ...risks },
    parameter: 'theta1',
    message: /theta1 within 0\.0001 % of theta0 would need about [\d.]+e12 failures per run/,
    flags: ['--model', 'lifetime', '--theta0', '1000', '--theta1', '999.999', ...riskFlags],
  },
  {
    name: 'graded with 5 classes truncated at 1,000,000 items',
    spec: { model: 'graded', classes: fiveClasses, p0: [0.8, 0.1, 0.05, 0.03, 0.02], p1: [0.79, 0.105, 0.052, 0.031, 0.022], ...risks, truncation: 1_000_000 },
    parameter: 'truncation',
    message: /truncation must be an integer from 1 to 100000/,
    flags: ['--model', 'graded', '--classes', fiveClasses.join(','), '--p0', '0.8,0.1,0.05,0.03,0.02', '--p1', '0.79,0.105,0.052,0.031,0.022', ...riskFlags, '--truncate', '1000000'],
  },
  {
    name: 'graded with 5 close classes truncated at 100,000 items',
    spec: { model: 'graded', classes: fiveClasses, p0: [0.8, 0.1, 0.05, 0.03, 0.02], p1: [0.79, 0.105, 0.052, 0.031, 0.022], ...risks, truncation: 100_000 },
    parameter: 'truncation',
    message: /exact curves would take about \d+ billion steps .* lower the truncation/,
    flags: ['--model', 'graded', '--classes', fiveClasses.join(','), '--p0', '0.8,0.1,0.05,0.03,0.02', '--p1', '0.79,0.105,0.052,0.031,0.022', ...riskFlags, '--truncate', '100000'],
  },
];
