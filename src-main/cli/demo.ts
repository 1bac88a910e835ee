/** `tallyline demo`: fill an empty data folder with the invented demo scenario. */
import { DataFolderNotEmptyError, describeDemo, seedDemo } from '../demo/index.js';
import type { Command } from './command.js';
import { EXIT_FAILURE, EXIT_OK } from './command.js';
import { flag, parseFlags } from './flags.js';
import { checkedDataDirectory, dataDirectoryFlags } from './dataFolderFlag.js';

const flags = { ...dataDirectoryFlags, seed: flag.integer(0, 2 ** 32 - 1), json: flag.switch() };

export const command: Command = {
  summary: 'fill an empty data folder with the invented demo scenario',
  usage: [
    'Usage: tallyline demo [--data-dir DIR] [--seed N] [--json]',
    '  fills DIR (which must hold no Tallyline data) with invented sources, plans and runs',
    '  --seed N                   seed of the random results (default: the documented scenario)',
    '  --json                     print {dataDirectory, sources, plans, runs}',
  ].join('\n'),
  async run(args, io) {
    const values = parseFlags(args, flags);
    try {
      const report = await seedDemo(await checkedDataDirectory(args, true), { seed: values.seed });
      io.stdout(values.json === true ? `${JSON.stringify(report)}\n` : `${describeDemo(report)}\n`);
      return EXIT_OK;
    } catch (error) {
      if (!(error instanceof DataFolderNotEmptyError)) throw error;
      io.stderr(`tallyline demo: ${error.message}\n`);
      return EXIT_FAILURE;
    }
  },
};
