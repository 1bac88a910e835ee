/**
 * `tallyline replay`: feeds recorded results through a plan, one a line, and stops at the decision.
 */
import { countOf, decideLinearCount } from '../engine/index.js';
import type { LinearCountSpec } from '../engine/index.js';
import type { Command } from './command.js';
import { EXIT_OK } from './command.js';
import { UsageError, flag, parseFlags, requireFlag } from './flags.js';
import { planSpecFromFlags, modelPlanFlags, modelPlanFlagsUsage, planFlagsUsage } from './planFlags.js';
import { replayExtended } from './replayModels.js';
import { formatNumber, formatTable } from './table.js';

const flags = { ...modelPlanFlags, results: flag.path('a file path, or - for standard input'), json: flag.switch() };

const PASS_FAIL_WORDS: Record<string, number> = { pass: 0, fail: 1, '0': 0, '1': 1 };

/**
 * One result from a line of the results file: pass/fail or 0/1 for pass/fail items, a count of
 * nonconformities for count data; null for a blank or # comment line.
 */
export function parseResult(spec: LinearCountSpec, line: string, lineNumber: number): number | null {
  const text = line.trim();
  if (text === '' || text.startsWith('#')) return null;
  const value =
    spec.model === 'passfail'
      ? PASS_FAIL_WORDS[text.toLowerCase()]
      : /^\d+$/.test(text)
        ? Number(text)
        : null;
  if (value === undefined || value === null) {
    const allowed = spec.model === 'passfail' ? 'pass, fail, 0 or 1' : 'a whole number of nonconformities >= 0';
    throw new UsageError('--results', allowed, `--results line ${lineNumber}: ${JSON.stringify(text)} is not ${allowed}`);
  }
  return value;
}

export interface ReplayStep {
  n: number;
  result: number;
  total: number;
  llr: number;
}

export const command: Command = {
  summary: 'replay recorded results through a plan and stop at the decision',
  usage: [
    'Usage: tallyline replay --model passfail --p0 P --p1 P --alpha A --beta B [--truncate N] --results FILE [--json]',
    planFlagsUsage,
    modelPlanFlagsUsage,
    '  --results FILE             one result a line: pass/fail or 0/1 (passfail), a count (count); - reads stdin',
    '                             measurement: a value; lifetime: "time T", "fail" or "fail T"; graded: a class name or 0-based index',
    '  --json                     print {decision, n, total, llr, rule} as JSON instead of a table',
  ].join('\n'),
  async run(args, io) {
    const values = parseFlags(args, flags);
    const planSpec = planSpecFromFlags(values);
    const path = requireFlag<string>(values, 'results', flags);
    let text: string;
    try {
      text = await io.readText(path);
    } catch (error) {
      const reason = (error as NodeJS.ErrnoException).code ?? (error as Error).message;
      throw new UsageError('--results', 'a readable file', `--results: cannot read ${JSON.stringify(path)} (${reason})`);
    }
    if (planSpec.model === 'measurement' || planSpec.model === 'lifetime' || planSpec.model === 'graded') {
      const { summary, rows } = replayExtended(planSpec, text);
      if (values.json) io.stdout(`${JSON.stringify(summary)}\n`);
      else {
        const table = formatTable(['step', 'entry', 'evidence', 'LLR'], rows.map((row) => [row[0], row[1], row[2], formatNumber(Number(row[3]))]));
        io.stdout(`${table}\n\nDecision: ${summary.decision} (${summary.rule})\n`);
      }
      return EXIT_OK;
    }
    const spec: LinearCountSpec = planSpec;
    let state = decideLinearCount(spec, 0, 0);
    let n = 0;
    let total = 0;
    const steps: ReplayStep[] = [];
    const lines = text.split(/\r?\n/);
    for (let i = 0; i < lines.length && state.decision === 'continue'; i++) {
      const result = parseResult(spec, lines[i], i + 1);
      if (result === null) continue;
      n += 1;
      total += result;
      state = decideLinearCount(spec, n, total);
      steps.push({ n, result, total, llr: state.llr });
    }
    const summary = { decision: state.decision, n, total, llr: state.llr, rule: state.rule };
    if (values.json) {
      io.stdout(`${JSON.stringify(summary)}\n`);
    } else {
      const table = formatTable(
        ['n', 'result', 'total', 'LLR'],
        steps.map((step) => [String(step.n), String(step.result), String(step.total), formatNumber(step.llr)]),
      );
      io.stdout(`${table}\n\nDecision: ${summary.decision} after ${countOf(n, 'item')}, total ${total} (${summary.rule})\n`);
    }
    return EXIT_OK;
  },
};
