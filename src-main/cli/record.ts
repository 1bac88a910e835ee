/**
 * `tallyline record`: write the decision record PDF of a run. A run not yet decided gets a record
 * marked interim on every page; a journal that does not verify gets no record (exit 1).
 */
import { decisionRecordForRun } from '../record/input/decisionRecordFromRun.js';
import { writeDecisionRecord } from '../record/pdf/renderDecisionRecord.js';
import { RunJournalUnverifiedError, RunNotFoundError } from '../inspection/index.js';
import type { CliIo, Command } from './command.js';
import type { DecisionRecordInput } from '../record/input/decisionRecordInput.js';
import { EXIT_FAILURE, EXIT_OK } from './command.js';
import { UsageError, flag, parseFlags, requireFlag } from './flags.js';
import { checkedDataDirectory, dataDirectoryFlags, requireExistingRun } from './dataFolderFlag.js';

const flags = { ...dataDirectoryFlags, run: flag.id('run'), out: flag.path('a file path ending in .pdf') };

export const command: Command = {
  summary: 'write the decision record PDF of a run (interim while undecided)',
  usage: [
    'Usage: tallyline record --run ID --out FILE.pdf [--data-dir DIR]',
    '  --out FILE.pdf             where to write the record (replaced if it exists)',
    '  a run not yet decided gets a record marked INTERIM on every page',
    '  exit code 0 when written, 1 when the run is missing or its journal does not verify',
  ].join('\n'),
  async run(args, io) {
    const values = parseFlags(args, flags);
    const runId = requireFlag<string>(values, 'run', flags);
    const out = requireFlag<string>(values, 'out', flags);
    if (!/\.pdf$/i.test(out)) throw new UsageError('--out', flags.out.allowed, `--out must be ${flags.out.allowed} (got ${JSON.stringify(out)})`);
    const input = await recordInputFor(args, runId, 'record', io);
    if (input === null) return EXIT_FAILURE;
    await writeDecisionRecord(input, out);
    const kind = input.interim ? 'Interim record (run not decided)' : `Decision record (${input.decision.state})`;
    io.stdout(`${kind} ${input.header.recordId} of run ${runId} written to ${out}; fingerprint ${input.fingerprint}\n`);
    return EXIT_OK;
  },
};

/**
 * The record input of a run for a command, or null after one line on stderr when the run does not
 * exist or its journal does not verify.
 */
export async function recordInputFor(args: readonly string[], runId: string, name: string, io: CliIo): Promise<DecisionRecordInput | null> {
  const dataDirectory = await checkedDataDirectory(args);
  await requireExistingRun(dataDirectory, runId);
  try {
    return await decisionRecordForRun(dataDirectory, runId);
  } catch (error) {
    if (error instanceof RunNotFoundError || error instanceof RunJournalUnverifiedError) {
      io.stderr(`tallyline ${name}: ${error.message}\n`);
      return null;
    }
    throw error;
  }
}

/** A run id that cannot name a journal file is a bad flag, not a missing run. */
