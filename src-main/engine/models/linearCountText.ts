/**
 * How a terminal shows a pass/fail or count plan and its runs: the readable design (`plan` without
 * --json), the evidence in words and the JSON fields of `run show` and `replay`.
 */
import { countOf } from '../countWords.js';
import type { LimitRow, LinearCountDesign } from '../planDesignTypes.js';
import type { LinearCountSpec } from '../spec.js';
import { formatNumber, formatPercent, formatTable } from '../numberText.js';
import type { EvidenceDecision } from './sequentialModel.js';

/** Collapses consecutive rows with equal numbers into ranges, as the handbook tables print them. */
export function limitRanges(rows: readonly LimitRow[], countCanExceedItems: boolean): string[][] {
  const ranges: string[][] = [];
  const show = (row: LimitRow): [string, string] => [
    row.accept === null ? 'x' : String(row.accept),
    !countCanExceedItems && row.reject > row.n ? 'x' : String(row.reject),
  ];
  let start = 0;
  for (let i = 1; i <= rows.length; i++) {
    const same = i < rows.length && show(rows[i]).join() === show(rows[start]).join();
    if (same) continue;
    const label = i - 1 === start ? `${rows[start].n}` : `${rows[start].n}-${rows[i - 1].n}`;
    ranges.push([label, ...show(rows[start])]);
    start = i;
  }
  return ranges;
}

/**
 * The readable design of a linear-count plan.
 *
 * @param qualities the hypotheses as the model names them, e.g. "p0 = 0.01, p1 = 0.1".
 * @param countCanExceedItems true when one item can carry more than one count (nonconformities), so a rejection number above n is possible.
 */
export function readableLinearCountPlan(spec: LinearCountSpec, design: LinearCountDesign, qualities: string, countCanExceedItems: boolean): string {
  const { boundaries: b, kl, wald, exact, single } = design;
  const q = design.quality;
  const quantiles = (x: LinearCountDesign['exact']['quantilesH0']): string =>
    `${x.p50 ?? '-'} / ${x.p90 ?? '-'} / ${x.p99 ?? '-'}`;
  const lines = [
    `Sequential plan, ${spec.model}: ${qualities}, alpha = ${spec.alpha}, beta = ${spec.beta}`,
    '',
    `Lines: accept if count <= ${formatNumber(b.slope)} n - ${formatNumber(b.h1)}; ` +
      `reject if count >= ${formatNumber(b.slope)} n + ${formatNumber(b.h2)}`,
    `       (ln A = ${formatNumber(b.lnA)}, ln B = ${formatNumber(b.lnB)}; fit: ${design.fit.mode})`,
    `KL divergence: D(H0||H1) = ${formatNumber(kl.h0h1)}, D(H1||H0) = ${formatNumber(kl.h1h0)} nats`,
    '',
    formatTable(
      ['', 'at H0', 'at H1'],
      [
        ['Wald ASN', formatNumber(wald.asnH0), formatNumber(wald.asnH1)],
        ['exact ASN', formatNumber(exact.asnH0), formatNumber(exact.asnH1)],
        ['exact risk (alpha, beta)', formatPercent(exact.alpha), formatPercent(exact.beta)],
        ['items to decision p50/p90/p99', quantiles(exact.quantilesH0), quantiles(exact.quantilesH1)],
      ],
    ),
    `Wald ASN peaks at ${formatNumber(wald.asnMax)} items (${q} = ${formatNumber(design.neutral.theta)}); ` +
      `undecided remainder ${formatNumber(exact.undecided, 2)}`,
    single === null
      ? 'Single plan: none found up to 1,000,000 items'
      : `Single plan: n = ${single.n}, c = ${single.c}` +
        (design.saving === null
          ? ''
          : `; sequential saves ${formatPercent(design.saving.h0)} of items at H0, ${formatPercent(design.saving.h1)} at H1`),
    `Truncation: ${design.truncationRule}`,
    `  suggested truncation (exact risks within 10% of nominal): ${design.suggestedTruncation ?? 'none'}; ` +
      `3 x single plan: ${design.threeTimesSingle ?? '-'}`,
    '',
    'Limits (x: not possible yet)',
    formatTable(['n', 'accept', 'reject'], limitRanges(design.limits, countCanExceedItems)),
    '',
    'OC and ASN curve',
    formatTable(
      [q, 'OC Wald', 'OC exact', 'ASN Wald', 'ASN exact'],
      design.curve.map((point) => [
        formatNumber(point.theta),
        formatNumber(point.ocWald),
        formatNumber(point.ocExact),
        formatNumber(point.asnWald),
        formatNumber(point.asnExact),
      ]),
    ),
  ];
  return lines.join('\n');
}

/** The evidence of a linear-count run in words: items and the running count. */
export const linearCountEvidenceText = {
  evidence: (state: EvidenceDecision) => `n = ${state.n}, total = ${state.total}`,
  evidenceColumn: 'total',
  evidenceCell: (state: EvidenceDecision) => String(state.total),
  reached: (state: EvidenceDecision) => `after ${countOf(state.n, 'item')}, total ${state.total}`,
};
