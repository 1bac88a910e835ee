/**
 * `tallyline plan` without --json: the readable form of each model's design, one function per model
 * in one map (the JSON is the engine's design as it is).
 */
import { countOf } from '../engine/index.js';
import type { DesignOf, LimitRow, LinearCountDesign, ModelName, PlanDesign, PlanSpec, SpecOf } from '../engine/index.js';
import { formatNumber, formatPercent, formatTable } from './table.js';

const f = (value: number | null | undefined) => formatNumber(value);

function readableMeasurementPlan(spec: SpecOf<'measurement'>, design: DesignOf<'measurement'>): string {
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

function readableLifetimePlan(spec: SpecOf<'lifetime'>, design: DesignOf<'lifetime'>): string {
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

function readableGradedPlan(spec: SpecOf<'graded'>, design: DesignOf<'graded'>): string {
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

function describeSpec(spec: SpecOf<'passfail' | 'count'>): string {
  const qualities = spec.model === 'passfail' ? `p0 = ${spec.p0}, p1 = ${spec.p1}` : `lambda0 = ${spec.lambda0}, lambda1 = ${spec.lambda1}`;
  return `Sequential plan, ${spec.model}: ${qualities}, alpha = ${spec.alpha}, beta = ${spec.beta}`;
}

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

function readableLinearCountPlan(spec: SpecOf<'passfail' | 'count'>, design: LinearCountDesign): string {
  const { boundaries: b, kl, wald, exact, single } = design;
  const q = design.quality;
  const quantiles = (x: LinearCountDesign['exact']['quantilesH0']): string =>
    `${x.p50 ?? '-'} / ${x.p90 ?? '-'} / ${x.p99 ?? '-'}`;
  const lines = [
    describeSpec(spec),
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
    formatTable(['n', 'accept', 'reject'], limitRanges(design.limits, spec.model === 'count')),
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

const readablePlans: { [M in ModelName]: (spec: SpecOf<M>, design: DesignOf<M>) => string } = {
  passfail: readableLinearCountPlan,
  count: readableLinearCountPlan,
  measurement: readableMeasurementPlan,
  lifetime: readableLifetimePlan,
  graded: readableGradedPlan,
};

/** The readable form of a design of any model. */
export function readablePlan(spec: PlanSpec, design: PlanDesign): string {
  return (readablePlans[spec.model] as (spec: PlanSpec, design: PlanDesign) => string)(spec, design);
}
