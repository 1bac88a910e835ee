/**
 * `tallyline replay`: feeds recorded results through a plan, one a line, and stops at the decision.
 * The live path, not a second one: each line is read by the `feed` parser (feedParse.ts), checked
 * as the run service checks an entry, and accumulated by the run's evidence
 * (inspection/runEvidence.ts), so the same results give the same decision here, in `feed` and in
 * the app.
 */
import { RunEvidence } from '../inspection/index.js';
import { formatNumber, formatTable, planOf } from '../engine/index.js';
import type { Command } from './command.js';
import { EXIT_OK } from './command.js';
import { parseFeedLine } from './feedParse.js';
import { UsageError, flag, parseFlags, requireFlag } from './flags.js';
import { planFlagsUsage, planSpecFromFlags, withPlanFlags } from './planFlags.js';

const flags = withPlanFlags({ results: flag.path('a file path, or - for standard input'), json: flag.switch() });

export const command: Command = {
  summary: 'replay recorded results through a plan and stop at the decision',
  usage: [
    'Usage: tallyline replay --model passfail --p0 P --p1 P --alpha A --beta B [--truncate N] --results FILE [--json]',
    planFlagsUsage,
    '  --results FILE             one result a line, as `feed` reads them: pass/fail or 0/1 (passfail), a count (count); - reads stdin',
    '                             measurement: a value; lifetime: "time T", "fail" or "fail T"; graded: a class name or 0-based index',
    '  --json                     print {decision, n, total, llr, rule} as JSON instead of a table (measurement: sum for total;',
    '                             lifetime: {decision, time, failures, llr, rule}; graded: counts for total)',
  ].join('\n'),
  async run(args, io) {
    const values = parseFlags(args, flags);
    const spec = planSpecFromFlags(values);
    const path = requireFlag<string>(values, 'results', flags);
    let text: string;
    try {
      text = await io.readText(path);
    } catch (error) {
      const reason = (error as NodeJS.ErrnoException).code ?? (error as Error).message;
      throw new UsageError('--results', 'a readable file', `--results: cannot read ${JSON.stringify(path)} (${reason})`);
    }
    const plan = planOf(spec);
    const evidence = new RunEvidence(spec);
    let state = evidence.state();
    const rows: string[][] = [];
    const lines = text.split(/\r?\n/);
    for (let index = 0; index < lines.length && state.decision === 'continue'; index += 1) {
      const parsed = parseFeedLine(plan, lines[index]);
      if (parsed === null) continue;
      const problem = 'problem' in parsed ? parsed.problem : evidence.problem(parsed.result);
      if (problem !== null || 'problem' in parsed) {
        throw new UsageError('--results', 'one result a line, as feed reads them', `--results line ${index + 1}: ${problem}`);
      }
      evidence.add(parsed.result);
      state = evidence.state();
      rows.push([String(state.n), plan.text.result(parsed.result), plan.text.evidenceCell(state), formatNumber(state.llr)]);
    }
    const rule = state.rule ?? state.standing;
    if (values.json) {
      // {decision, <the model's summary fields>, llr, rule}: the shape the README documents.
      io.stdout(`${JSON.stringify({ decision: state.decision, ...plan.json.summary(state), llr: state.llr, rule })}\n`);
    } else {
      const table = formatTable(['n', 'result', plan.text.evidenceColumn, 'LLR'], rows);
      io.stdout(`${table}\n\nDecision: ${state.decision} ${plan.text.reached(state)} (${rule})\n`);
    }
    return EXIT_OK;
  },
};
