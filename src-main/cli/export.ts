/**
 * `tallyline export`: a run's entries as CSV (RFC 4180, UTF-8, header row), voided entries kept
 * and marked with their void's reason, sequence, time and actor.
 */
import { writeFile } from 'node:fs/promises';
import { entriesToCsv } from '../record/input/entriesToCsv.js';
import type { Command } from './command.js';
import { EXIT_FAILURE, EXIT_OK } from './command.js';
import { flag, parseFlags, requireFlag } from './flags.js';
import { recordInputFor } from './record.js';
import { dataDirectoryFlags } from './dataFolderFlag.js';

const flags = { ...dataDirectoryFlags, run: flag.id('run'), out: flag.path('a file path, or - for standard output') };

export const command: Command = {
  summary: "export a run's entries as CSV (RFC 4180, UTF-8)",
  usage: [
    'Usage: tallyline export --run ID --out FILE.csv [--data-dir DIR]',
    '  --out FILE.csv             where to write the CSV ("-" for standard output)',
  ].join('\n'),
  async run(args, io) {
    const values = parseFlags(args, flags);
    const runId = requireFlag<string>(values, 'run', flags);
    const out = requireFlag<string>(values, 'out', flags);
    const input = await recordInputFor(args, runId, 'export', io);
    if (input === null) return EXIT_FAILURE;
    const csv = entriesToCsv(input.entries);
    if (out === '-') io.stdout(csv);
    else await writeFile(out, csv, 'utf8');
    return EXIT_OK;
  },
};
