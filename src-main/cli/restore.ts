/** `tallyline restore --from FILE`: replace the data folder with a verified archive, keeping the old one. */
import { readFile } from 'node:fs/promises';
import { ArchiveRefusedError, RestoreBlockedError, restoreArchive } from '../backup/index.js';
import type { Command } from './command.js';
import { EXIT_FAILURE, EXIT_OK } from './command.js';
import { flag, parseFlags, requireFlag } from './flags.js';
import { checkedDataDirectory, dataDirectoryFlags } from './dataFolderFlag.js';

const flags = { ...dataDirectoryFlags, from: flag.path('an archive written by tallyline backup'), json: flag.switch() };

export const command: Command = {
  summary: 'replace the data folder with a verified archive (the old folder is kept)',
  usage: [
    'Usage: tallyline restore --from FILE [--data-dir DIR] [--json]',
    '  checks every file and journal in a folder beside DIR first; a damaged archive is refused and DIR left as it is',
    '  the replaced folder is kept as DIR.before-restore-<UTC time>',
    '  exit code 0 when restored, 1 when refused',
  ].join('\n'),
  async run(args, io) {
    const values = parseFlags(args, flags);
    const from = requireFlag<string>(values, 'from', flags);
    try {
      const archive = await readFile(from).catch((error: NodeJS.ErrnoException) => {
        error.path ??= from; // readFile of a folder does not say which
        throw error;
      });
      const report = await restoreArchive(archive, await checkedDataDirectory(args, true));
      if (values.json === true) {
        io.stdout(`${JSON.stringify(report)}\n`);
      } else {
        io.stdout(
          [
            `Restored ${report.files} files (${report.sources} sources, ${report.plans} plans, ${report.runs} runs) backed up at ${report.backedUpAt}.`,
            report.previousDataKeptAt === null ? 'There was no data folder before.' : `The previous data folder is kept at ${report.previousDataKeptAt}.`,
            ...(report.damagedAtBackup.length > 0 ? [`Already damaged when backed up, restored as they were: ${report.damagedAtBackup.join(', ')}`] : []),
          ].join('\n') + '\n',
        );
      }
      return EXIT_OK;
    } catch (error) {
      if (!(error instanceof ArchiveRefusedError || error instanceof RestoreBlockedError)) throw error;
      io.stderr(`tallyline restore: ${error.message}\n`);
      return EXIT_FAILURE;
    }
  },
};
