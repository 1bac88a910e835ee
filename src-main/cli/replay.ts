/**
 * `tallyline replay`: feeds recorded results through a plan, one a line, and stops at the decision.
 * The live path, not a second one: each line is read by the `feed` parser (feedParse.ts), checked
 * as the run service checks an entry, and accumulated by the run's evidence
 * (inspection/runEvidence.ts), so the same results give the same decision here, in `feed` and in
 * the app.
 */
import { RunEvidence, type RunState } from '../inspection/index.js';
import { countOf } from '../engine/index.js';
import type { Command } from './command.js';
import { EXIT_OK } from './command.js';
import { parseFeedLine } from './feedParse.js';
import { UsageError, flag, parseFlags, requireFlag } from './flags.js';
import { planSpecFromFlags, modelPlanFlags, modelPlanFlagsUsage, planFlagsUsage } from './planFlags.js';
import { resultText } from './run.js';
import { formatNumber, formatTable } from './table.js';

const flags = { ...modelPlanFlags, results: flag.path('a file path, or - for standard input'), json: flag.switch() };

/** The JSON summary per model: {decision, n, total | sum, llr, rule}, lifetime {decision, time, failures, llr, rule}, graded {decision, n, counts, llr, rule}. */
function summaryOf(state: RunState, rule: string): Record<string, unknown> {
  const { decision, n, llr } = state;
  if (state.model === 'measurement') return { decision, n, sum: state.sum, llr, rule };
  if (state.model === 'lifetime') return { decision, time: state.time, failures: state.failures, llr, rule };
  if (state.model === 'graded') return { decision, n, counts: state.counts, llr, rule };
  return { decision, n, total: state.total, llr, rule };
}

/** The evidence after a line, for the readable table. */
function evidenceCell(state: RunState): string {
  if (state.model === 'measurement') return formatNumber(state.sum);
  if (state.model === 'lifetime') return `T ${formatNumber(state.time)}, r ${state.failures}`;
  if (state.model === 'graded') return state.counts.join('/');
  return String(state.total);
}

export const command: Command = {
  summary: 'replay recorded results through a plan and stop at the decision',
  usage: [
    'Usage: tallyline replay --model passfail --p0 P --p1 P --alpha A --beta B [--truncate N] --results FILE [--json]',
    planFlagsUsage,
    modelPlanFlagsUsage,
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
    const evidence = new RunEvidence(spec);
    let state = evidence.state();
    const rows: string[][] = [];
    const lines = text.split(/\r?\n/);
    for (let index = 0; index < lines.length && state.decision === 'continue'; index += 1) {
      const parsed = parseFeedLine(spec, lines[index]);
      if (parsed === null) continue;
      const problem = 'problem' in parsed ? parsed.problem : evidence.problem(parsed.result);
      if (problem !== null || 'problem' in parsed) {
        throw new UsageError('--results', 'one result a line, as feed reads them', `--results line ${index + 1}: ${problem}`);
      }
      evidence.add(parsed.result);
      state = evidence.state();
      rows.push([String(state.n), resultText(parsed.result), evidenceCell(state), formatNumber(state.llr)]);
    }
    const summary = summaryOf(state, state.rule ?? state.standing);
    if (values.json) {
      io.stdout(`${JSON.stringify(summary)}\n`);
    } else {
      const linear = state.model === undefined;
      const table = formatTable(['n', 'result', linear ? 'total' : 'evidence', 'LLR'], rows);
      const counted = linear ? `after ${countOf(state.n, 'item')}, total ${state.total}` : `after ${countOf(state.n, 'entry', 'entries')}, ${evidenceCell(state)}`;
      io.stdout(`${table}\n\nDecision: ${state.decision} ${counted} (${summary.rule})\n`);
    }
    return EXIT_OK;
  },
};
