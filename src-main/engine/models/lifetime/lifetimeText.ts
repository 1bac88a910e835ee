/** The readable design of a lifetime plan (`plan` without --json). */
import { countOf } from '../../countWords.js';
import type { LifetimeSpec } from '../../spec.js';
import { formatNumber as f, formatPercent, formatTable } from '../../numberText.js';
import type { LifetimeDesign } from './lifetimeDesign.js';

export function readableLifetimePlan(spec: LifetimeSpec, design: LifetimeDesign): string {
  const b = design.boundaries;
  return [
    `Sequential plan, lifetime: theta0 = ${spec.theta0}, theta1 = ${spec.theta1} (d = ${f(b.discriminationRatio)}), alpha = ${spec.alpha}, beta = ${spec.beta}`,
    `Lines: accept when T >= ${f(b.acceptTimeAtZero)} + ${f(b.timePerFailure)} r; reject at the r-th failure if T <= ${f(b.timePerFailure)} r - ${f(b.rejectOffset)} (from r = ${b.firstRejectFailures})`,
    formatTable(
      ['', 'alpha', 'beta', 'E[T] at theta0', 'E[T] at theta1'],
      [
        ['Wald', f(design.wald.alpha), f(design.wald.beta), f(design.wald.expectedTimeH0), f(design.wald.expectedTimeH1)],
        ['exact', f(design.exact.alpha), f(design.exact.beta), f(design.exact.expectedTimeH0), f(design.exact.expectedTimeH1)],
      ],
    ),
    `Fixed-duration test: T = ${f(design.single.time)}, accept with at most ${countOf(design.single.acceptFailures, 'failure')} ` +
      `(true risks ${formatPercent(design.single.alpha)} / ${formatPercent(design.single.beta)})`,
    `Truncation: ${design.truncationRule}`,
    '',
    formatTable(['failures', 'accept at T >=', 'reject if T <='], design.limits.map((row) => [String(row.failures), row.acceptTime === null ? '-' : f(row.acceptTime), row.rejectTime === null ? 'x' : f(row.rejectTime)])),
  ].join('\n');
}
