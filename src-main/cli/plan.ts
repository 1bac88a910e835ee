/**
 * `tallyline plan`: designs a sequential plan and prints it, as JSON (--json) or as readable tables.
 */
import { checkAnyPlanSpec, designAnyPlan, designPlan, isExtendedPlanSpec } from '../engine/index.js';
import type { LimitRow, PlanDesign, PlanSpec } from '../engine/index.js';
import type { Command } from './command.js';
import { EXIT_OK } from './command.js';
import { flag, parseFlags } from './flags.js';
import { anyPlanSpecFromFlags, modelPlanFlags, modelPlanFlagsUsage, planFlagsUsage } from './planFlags.js';
import { readableExtendedPlan } from './planModels.js';
import { formatNumber, formatPercent, formatTable } from './table.js';

const flags = { ...modelPlanFlags, points: flag.integer(2, 10001), json: flag.switch() };

export const command: Command = {
  summary: 'design a sequential plan: lines, Wald and exact OC/ASN, single plan, limits, curve',
  usage: [
    'Usage: tallyline plan --model passfail --p0 P --p1 P --alpha A --beta B [--truncate N] [--points K] [--fit exact] [--json]',
    '       tallyline plan --model count --lambda0 L --lambda1 L --alpha A --beta B [...]',
    '       tallyline plan --model measurement|lifetime|graded ... (flags below)',
    planFlagsUsage,
    modelPlanFlagsUsage,
    '  --points K                 qualities on the OC/ASN curve, 2 to 10001 (default 51)',
    '  --json                     print JSON instead of tables',
  ].join('\n'),
  async run(args, io) {
    const values = parseFlags(args, flags);
    const spec = anyPlanSpecFromFlags(values);
    checkAnyPlanSpec(spec, { curvePoints: values.points ?? 51 });
    if (values.json) {
      io.stdout(`${JSON.stringify(designAnyPlan(spec, { curvePoints: values.points ?? 51 }), null, 2)}\n`);
    } else if (isExtendedPlanSpec(spec)) {
      io.stdout(`${readableExtendedPlan(spec)}\n`);
    } else {
      io.stdout(`${readablePlan(spec, designPlan(spec, { curvePoints: values.points ?? 51 }))}\n`);
    }
    return EXIT_OK;
  },
};

function describeSpec(spec: PlanSpec): string {
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

function readablePlan(spec: PlanSpec, design: PlanDesign): string {
  const { boundaries: b, kl, wald, exact, single } = design;
  const q = design.quality;
  const quantiles = (x: PlanDesign['exact']['quantilesH0']): string =>
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
