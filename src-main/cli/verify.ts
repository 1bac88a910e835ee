/**
 * `tallyline verify`: re-read a run journal and check its hash chain; exit 1 when it does not verify.
 */
import { layout, verifyJournal } from '../store/index.js';
import type { Command } from './command.js';
import { EXIT_FAILURE, EXIT_OK } from './command.js';
import { flag, parseFlags, requireFlag } from './flags.js';
import { dataDirectoryFlags, dataDirectoryFor } from './run.js';

const flags = { ...dataDirectoryFlags, run: flag.text('a run id'), json: flag.switch() };

export const command: Command = {
  summary: "re-read a run's journal and verify its hash chain",
  usage: [
    'Usage: tallyline verify --run ID [--data-dir DIR] [--json]',
    '  --json                     print {ok, entries, fingerprint, problems: [{seq, line, problem, kind}]}',
    '  exit code 0 when the chain verifies, 1 when it does not',
  ].join('\n'),
  async run(args, io) {
    const values = parseFlags(args, flags);
    const runId = requireFlag<string>(values, 'run', flags);
    const report = await verifyJournal(layout.runJournal(dataDirectoryFor(args), runId));
    if (values.json === true) {
      io.stdout(`${JSON.stringify(report)}\n`);
    } else {
      io.stdout(
        report.ok
          ? `Run ${runId}: chain verifies, ${report.entries} entries, fingerprint ${report.fingerprint}\n`
          : [`Run ${runId}: chain does NOT verify`, ...report.problems.map((p) => `  seq ${p.seq} (line ${p.line}): ${p.problem}`)].join('\n') + '\n',
      );
    }
    return report.ok ? EXIT_OK : EXIT_FAILURE;
  },
};
