/** The readable design of a measurement plan (`plan` without --json). */
import type { MeasurementSpec } from '../../spec.js';
import { formatNumber as f, formatTable } from '../../numberText.js';
import type { MeasurementDesign } from './measurementDesign.js';

export function readableMeasurementPlan(spec: MeasurementSpec, design: MeasurementDesign): string {
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
