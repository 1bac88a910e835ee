/**
 * `tallyline feed`: results for a run from standard input, one a line, for automated stations.
 * After each entry is written and fsync'd it prints {"seq": N, "state": ...}; it stops right after
 * the line that carries a decision. A bad line: its number on stderr, exit 2, earlier lines kept.
 */
import { planOf } from '../engine/index.js';
import { RunUnreadableError, type RunService } from '../inspection/index.js';
import { parseFeedLine } from './feedParse.js';
import type { CliIo, Command } from './command.js';
import { EXIT_FAILURE, EXIT_OK, EXIT_USAGE } from './command.js';
import { flag, parseFlags, requireFlag } from './flags.js';
import { dataDirectoryFlags, requireExistingRun } from './dataFolderFlag.js';
import { runServiceFor } from './run.js';

const flags = { ...dataDirectoryFlags, run: flag.id('run'), actor: flag.text('The name of who made the entry'), json: flag.switch() };

export interface FeedOptions {
  readonly runId: string;
  readonly actor?: string;
  readonly json: boolean;
}

/** Feed `lines` into a run; resolves to the exit code. Each line's entry is durable before the next is read. */
export async function feedLines(service: RunService, lines: AsyncIterable<string>, options: FeedOptions, io: CliIo): Promise<number> {
  let opened;
  try {
    opened = await service.openRun(options.runId);
  } catch (error) {
    if (!(error instanceof RunUnreadableError)) throw error;
    io.stderr(`tallyline feed: ${error.message}\n`);
    return EXIT_FAILURE;
  }
  if (!opened.writable) {
    const damaged = opened.problems.find((problem) => problem.kind === 'tampered');
    io.stderr(
      damaged === undefined
        ? `tallyline feed: run ${options.runId} cannot be written: it is open elsewhere\n`
        : `tallyline feed: run ${options.runId} is damaged from seq ${damaged.seq} (${damaged.problem}); it can be read, never written\n`,
    );
    return EXIT_FAILURE;
  }
  if (opened.run.status === 'closed') {
    io.stderr(`tallyline feed: run ${options.runId} is already decided (${opened.run.decision}); record an override with a reason first\n`);
    return EXIT_FAILURE;
  }
  if (opened.recovered !== null) {
    io.stderr(`tallyline feed: a torn final line (${opened.recovered.length} bytes) was moved to quarantine\n`);
  }
  const plan = planOf(opened.plan.spec);
  const actor = options.actor ?? opened.run.inspector ?? 'station';
  let lineNumber = 0;
  for await (const line of lines) {
    lineNumber += 1;
    const parsed = parseFeedLine(plan, line);
    if (parsed === null) continue;
    if ('problem' in parsed) {
      io.stderr(`tallyline feed: line ${lineNumber}: ${parsed.problem}\n`);
      return EXIT_USAGE;
    }
    const { result } = parsed;
    let outcome;
    try {
      outcome = await service.recordResult(options.runId, { result, actor });
    } catch (error) {
      io.stderr(`tallyline feed: line ${lineNumber}: ${(error as Error).message}\n`);
      return EXIT_USAGE;
    }
    const state = outcome.state.decision;
    io.stdout(options.json ? `${JSON.stringify({ seq: outcome.seq, state })}\n` : `seq ${outcome.seq}: ${state}\n`);
    if (state !== 'continue') return EXIT_OK;
  }
  return EXIT_OK;
}

export const command: Command = {
  summary: 'record results for a run from standard input, one a line',
  usage: [
    'Usage: tallyline feed --run ID [--actor NAME] [--data-dir DIR] [--json]',
    '  stdin                      one result a line; # comments:',
    '                             passfail: pass/fail or 0/1; count: a whole number; measurement: a number;',
    '                             lifetime: "time T" (accumulated test time), "fail" or "fail T"; graded: a class name or 0-based index',
    '  --json                     after each durable entry print {"seq": N, "state": "continue"|"accept"|"reject"}',
    '  exit 0 after the deciding line or at end of input; exit 2 on a bad line (its number on stderr)',
  ].join('\n'),
  async run(args, io) {
    const values = parseFlags(args, flags);
    const runId = requireFlag<string>(values, 'run', flags);
    const { dataDirectory, service } = await runServiceFor(args);
    const input = io.inputLines();
    try {
      await requireExistingRun(dataDirectory, runId);
      return await feedLines(service, input.lines, { runId, actor: values.actor, json: values.json === true }, io);
    } finally {
      // A station may keep its end open: stop reading so the process can exit after the decision.
      input.close();
      await service.close();
    }
  },
};
