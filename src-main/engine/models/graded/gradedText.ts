/** The readable design of a graded plan (`plan` without --json). */
import type { GradedSpec } from '../../spec.js';
import { formatNumber as f, formatTable } from '../../numberText.js';
import type { GradedDesign } from './gradedDesign.js';

export function readableGradedPlan(spec: GradedSpec, design: GradedDesign): string {
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
