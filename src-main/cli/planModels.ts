/**
 * `tallyline plan` for the models with their own design path (measurement, lifetime, graded):
 * a short readable summary (the JSON is the engine's design as it is).
 */
import { countOf, designGradedPlan, designLifetimePlan, designMeasurementPlan } from '../engine/index.js';
import type { ExtendedPlanSpec } from '../engine/index.js';
import { formatNumber, formatPercent, formatTable } from './table.js';

/** The readable form of an extended design. */
export function readableExtendedPlan(spec: ExtendedPlanSpec): string {
  const f = (value: number | null | undefined) => formatNumber(value);
  if (spec.model === 'measurement') {
    const design = designMeasurementPlan(spec, { curvePoints: 11 });
    const b = design.boundaries;
    const [acceptSign, rejectSign, acceptOp, rejectOp] = b.rejectWhen === 'above' ? ['-', '+', '<=', '>='] : ['+', '-', '>=', '<='];
    return [
      `Sequential plan, measurement: mu0 = ${spec.mu0}, mu1 = ${spec.mu1}, sigma = ${spec.sigma}, alpha = ${spec.alpha}, beta = ${spec.beta}`,
      `Lines: accept if sum ${acceptOp} ${f(b.slope)} n ${acceptSign} ${f(b.h1)}; reject if sum ${rejectOp} ${f(b.slope)} n ${rejectSign} ${f(b.h2)}` +
        (b.correction > 0 ? ` (limits pulled in by ${f(b.correction)} nats)` : ''),
      formatTable(
        ['', 'alpha', 'beta', 'ASN at mu0', 'ASN at mu1'],
        [
          ['Wald', f(design.wald.alpha), f(design.wald.beta), f(design.wald.asnH0), f(design.wald.asnH1)],
          ['Siegmund-corrected', f(design.corrected.alpha), f(design.corrected.beta), f(design.corrected.asnH0), f(design.corrected.asnH1)],
          ['exact', f(design.exact.alpha), f(design.exact.beta), f(design.exact.asnH0), f(design.exact.asnH1)],
        ],
      ),
      `Fixed-sample plan: n = ${design.single.n}, accept on mu0's side of mean ${f(design.single.criticalMean)}`,
      `Truncation: ${design.truncationRule}`,
    ].join('\n');
  }
  if (spec.model === 'lifetime') {
    const design = designLifetimePlan(spec, { curvePoints: 11 });
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
  const design = designGradedPlan(spec, { curvePoints: 11 });
  const b = design.boundaries;
  const method = design.exact !== null ? design.exact : design.simulated === null ? null : { alpha: 1 - design.simulated.h0.accept, beta: design.simulated.h1.accept, asnH0: design.simulated.h0.asn, asnH1: design.simulated.h1.asn };
  return [
    `Sequential plan, graded: classes ${spec.classes.join(', ')}, p0 = ${spec.p0.join(', ')}, p1 = ${spec.p1.join(', ')}, alpha = ${spec.alpha}, beta = ${spec.beta}`,
    `Demerits per item: ${b.demerits.map((row) => `${row.className} ${f(row.demerits)}`).join(', ')}`,
    `Lines: accept if demerits <= ${f(b.slope)} n - ${f(b.h1)}; reject if demerits >= ${f(b.slope)} n + ${f(b.h2)}`,
    formatTable(
      ['', 'alpha', 'beta', 'ASN at p0', 'ASN at p1'],
      [
        ['Wald', f(design.wald.alpha), f(design.wald.beta), f(design.wald.asnH0), f(design.wald.asnH1)],
        [design.exact !== null ? 'exact' : 'simulated', f(method?.alpha), f(method?.beta), f(method?.asnH0), f(method?.asnH1)],
      ],
    ),
    `Truncation: ${design.truncationRule}`,
  ].join('\n');
}
