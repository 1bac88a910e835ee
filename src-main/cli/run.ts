/**
 * `tallyline run start` and `tallyline run show`: start an inspection run from a saved or inline
 * plan, and print a run as it stands. Keys of the JSON output are a contract other code depends on.
 */
import { checkPlanSpec, formatNumber, planOf, type PlanSpec } from '../engine/index.js';
import {
  OUTCOME_WORDS,
  RunNotFoundError,
  createRunCatalogue,
  runView,
  type DecisionEvent,
  type RunService,
  type RunView,
  createRunService,
} from '../inspection/index.js';
import { PlanRepository, SourceRepository } from '../store/index.js';
import { visibleJson, visibleText } from '../store/textFields.js';
import type { Command } from './command.js';
import { CliFailure, EXIT_FAILURE, EXIT_OK } from './command.js';
import { checkedDataDirectory, dataDirectoryFlags, requireExistingRun } from './dataFolderFlag.js';
import { UsageError, flag, parseFlags, rejectFlags, requireFlag } from './flags.js';
import { planFlags, planFlagsUsage, planSpecFromFlags, withPlanFlags } from './planFlags.js';

/** The checked data directory for these args, and a run service on it that the caller must close. */
export async function runServiceFor(args: readonly string[], mayCreate = false): Promise<{ dataDirectory: string; service: RunService }> {
  const dataDirectory = await checkedDataDirectory(args, mayCreate);
  return { dataDirectory, service: createRunService({ dataDirectory }) };
}

const startFlags = withPlanFlags({
  ...dataDirectoryFlags,
  plan: flag.id('plan'),
  'plan-version': flag.integer(1),
  'plan-name': flag.text('A plan name'),
  source: flag.text('A source name'),
  lot: flag.text('A lot or batch id'),
  'lot-size': flag.integer(1),
  inspector: flag.text("The inspector's name"),
  note: flag.note(),
  json: flag.switch(),
});

const PLAN_FLAG_NAMES = Object.keys(planFlags);

export const startCommand: Command = {
  summary: 'start an inspection run from a saved plan (--plan) or plan flags',
  usage: [
    'Usage: tallyline run start (--plan ID [--plan-version N] | <plan flags> [--plan-name NAME]) --source NAME --lot LOT',
    '                           [--lot-size N] [--inspector NAME] [--note TEXT] [--data-dir DIR] [--json]',
    '  --plan ID                  a saved plan (its latest version unless --plan-version is given)',
    planFlagsUsage,
    '  --source NAME              the supplier, line or machine; created when new',
    '  --lot LOT                  the lot or batch id',
    '  --json                     print {"run": ID}',
  ].join('\n'),
  async run(args, io) {
    const values = parseFlags(args, startFlags);
    const sourceName = requireFlag<string>(values, 'source', startFlags);
    const lot = requireFlag<string>(values, 'lot', startFlags);
    // Every input is checked before anything is written: the plan (saved or from flags), then the folder.
    let inlineSpec: PlanSpec | null = null;
    if (values.plan !== undefined) {
      rejectFlags(values, [...PLAN_FLAG_NAMES, 'plan-name'], 'cannot be combined with --plan (a saved plan)');
    } else {
      if (values.model === undefined) {
        throw new UsageError('--plan', 'a saved plan id or plan flags', 'give --plan ID or the plan flags (--model ...)');
      }
      rejectFlags(values, ['plan-version'], 'applies to --plan only');
      // Only the plan flags: the spec reader refuses any flag that is not its model's.
      const planValues = Object.fromEntries(Object.entries(values).filter(([name]) => PLAN_FLAG_NAMES.includes(name)));
      inlineSpec = planSpecFromFlags(planValues);
      checkPlanSpec(inlineSpec);
    }
    const { dataDirectory, service } = await runServiceFor(args, true);
    try {
      const plans = new PlanRepository(dataDirectory);
      if (values.plan !== undefined) {
        const versions = await plans.versions(values.plan).catch((): number[] => []);
        if (versions.length === 0) throw new CliFailure(`there is no saved plan ${values.plan} in the data folder ${dataDirectory}`);
        const version = values['plan-version'];
        if (version !== undefined && !versions.includes(version)) {
          throw new CliFailure(`plan ${values.plan} has no version ${version} (it has ${versions.join(', ')})`);
        }
      }
      const { source } = await new SourceRepository(dataDirectory).findOrCreate(sourceName);
      let planId: string;
      let planVersion: number | undefined;
      if (inlineSpec === null) {
        planId = values.plan as string;
        planVersion = values['plan-version'];
      } else {
        const saved = await plans.save({
          name: values['plan-name'] ?? `${sourceName} ${inlineSpec.model} plan`,
          sourceId: source.id,
          spec: inlineSpec,
        });
        planId = saved.id;
        planVersion = saved.version;
      }
      const { run } = await service.startRun({
        planId,
        planVersion,
        sourceId: source.id,
        lot,
        lotSize: values['lot-size'] ?? null,
        inspector: values.inspector ?? null,
        note: values.note ?? null,
      });
      io.stdout(values.json === true ? `${JSON.stringify({ run: run.id })}\n` : `Started run ${run.id} (plan ${run.planId} v${run.planVersion}, lot ${run.lot})\n`);
      return EXIT_OK;
    } finally {
      await service.close();
    }
  },
};

const showFlags = { ...dataDirectoryFlags, run: flag.id('run'), json: flag.switch() };

/**
 * The `run show --json` shape: {run, plan, entries: [{seq, time, result, voided}], state: {decision, n, total, llr}},
 * the state with its model's fields for measurement (sum, mean), lifetime (time, failures) and graded (counts, demerits);
 * then outcome (open, accepted, rejected, reopened, damaged), history (every decision and reopening), problems
 * ([{seq, line, problem, kind}], empty when the journal verifies), writable (false for a damaged journal) and
 * fingerprint (SHA-256 of the journal's last intact line).
 */
export function showJson(view: RunView, history: readonly DecisionEvent[]): unknown {
  return {
    run: view.run,
    plan: view.plan,
    entries: view.entries.map((entry) => ({ seq: entry.seq, time: entry.time, result: entry.result, voided: entry.voided })),
    state: { decision: view.state.decision, n: view.state.n, total: view.state.total, llr: view.state.llr, ...planOf(view.plan.spec).json.state(view.state) },
    outcome: view.outcome,
    history,
    problems: view.problems,
    writable: view.writable,
    fingerprint: view.run.fingerprint,
  };
}

/** A decision or a reopening as a line of `run show`. */
function historyText(event: DecisionEvent): string {
  return event.kind === 'decision'
    ? `  seq ${event.seq}  ${event.at}  ${event.actor}: ${event.decision} (${event.rule})`
    : `  seq ${event.seq}  ${event.at}  ${event.actor}: ${OUTCOME_WORDS.reopened}: ${event.reason}`;
}


export const showCommand: Command = {
  summary: 'print a run: its plan, entries and state',
  usage: 'Usage: tallyline run show --run ID [--data-dir DIR] [--json]',
  async run(args, io) {
    const values = parseFlags(args, showFlags);
    const runId = requireFlag<string>(values, 'run', showFlags);
    const dataDirectory = await checkedDataDirectory(args);
    await requireExistingRun(dataDirectory, runId);
    let read;
    try {
      read = await createRunCatalogue(dataDirectory).readRun(runId);
    } catch (error) {
      if (!(error instanceof RunNotFoundError)) throw error;
      io.stderr(`tallyline run show: ${error.message}\n`);
      return EXIT_FAILURE;
    }
    if (read.replay === null) {
      io.stderr(`tallyline run show: run ${runId} is damaged from seq ${read.damage?.firstBadSeq ?? 0} (${read.damage?.problem ?? 'no header'}); nothing of it can be read\n`);
      return EXIT_FAILURE;
    }
    const view = runView(read.replay, { writable: read.damage === null, problems: [...read.problems], recovered: null, fingerprint: read.fingerprint, damage: read.damage });
    if (values.json === true) {
      io.stdout(`${visibleJson(showJson(view, read.history))}\n`);
    } else {
      const { run, state } = view;
      const plan = planOf(view.plan.spec);
      io.stdout(
        [
          `Run ${run.id}: lot ${run.lot}, source ${run.sourceName}, plan ${run.planId} v${run.planVersion}`,
          `Outcome: ${OUTCOME_WORDS[view.outcome]}${read.damage === null ? '' : ` from seq ${read.damage.firstBadSeq}; the entries before it are shown, read-only`}`,
          `State: ${state.decision}${state.rule === null ? '' : ` (${state.rule})`}, ${plan.text.evidence(state)}, LLR = ${formatNumber(state.llr)}`,
          ...view.entries.map((entry) => `  ${entry.seq}  ${entry.time}  ${plan.text.result(entry.result)}${entry.voided ? `  VOID: ${entry.voidReason}` : ''}`),
          ...(read.history.length === 0 ? [] : ['Decisions:', ...read.history.map(historyText)]),
          ...view.problems.map((problem) => `Problem at seq ${problem.seq}: ${problem.problem}`),
        ]
          // Text from the journal is escaped: records written before the printable rule may hold control characters.
          .map(visibleText)
          .join('\n') + '\n',
      );
    }
    return EXIT_OK;
  },
};
