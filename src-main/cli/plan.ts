/**
 * `tallyline plan`: designs a sequential plan and prints it, as JSON (--json) or as readable tables.
 */
import { designPlan, planOf } from '../engine/index.js';
import type { Command } from './command.js';
import { EXIT_OK } from './command.js';
import { flag, parseFlags } from './flags.js';
import { planFlagsUsage, planSpecFromFlags, withPlanFlags } from './planFlags.js';

const flags = withPlanFlags({ points: flag.integer(2, 10001), json: flag.switch() });

export const command: Command = {
  summary: 'design a sequential plan: lines, Wald and exact OC/ASN, single plan, limits, curve',
  usage: [
    'Usage: tallyline plan --model passfail --p0 P --p1 P --alpha A --beta B [--truncate N] [--points K] [--fit exact] [--json]',
    '       tallyline plan --model count --lambda0 L --lambda1 L --alpha A --beta B [...]',
    '       tallyline plan --model measurement|lifetime|graded ... (flags below)',
    planFlagsUsage,
    '  --points K                 qualities on the OC/ASN curve, 2 to 10001 (default 51)',
    '  --json                     print JSON instead of tables',
  ].join('\n'),
  async run(args, io) {
    const values = parseFlags(args, flags);
    const spec = planSpecFromFlags(values);
    const design = designPlan(spec, { curvePoints: values.points ?? 51 });
    io.stdout(values.json ? `${JSON.stringify(design, null, 2)}\n` : `${planOf(spec).text.design(design)}\n`);
    return EXIT_OK;
  },
};
