/** `tallyline backup --out FILE`: the whole data folder into one `tallyline.archive/1` file. */
import { exportArchive } from '../backup/index.js';
import { writeFileAtomic } from '../store/index.js';
import type { Command } from './command.js';
import { EXIT_OK } from './command.js';
import { flag, parseFlags, requireFlag } from './flags.js';
import { checkedDataDirectory, dataDirectoryFlags } from './dataFolderFlag.js';

const flags = { ...dataDirectoryFlags, out: flag.path('a file to write the archive to'), json: flag.switch() };

export const command: Command = {
  summary: 'write the whole data folder to one archive file',
  usage: [
    'Usage: tallyline backup --out FILE [--data-dir DIR] [--json]',
    '  --out FILE                 the archive (tallyline.archive/1: gzip, a SHA-256 per file, each journal verified)',
    '  --json                     print {file, files, bytes, skipped, damagedJournals}',
  ].join('\n'),
  async run(args, io) {
    const values = parseFlags(args, flags);
    const out = requireFlag<string>(values, 'out', flags);
    const archive = await exportArchive(await checkedDataDirectory(args));
    await writeFileAtomic(out, archive.bytes);
    const damaged = archive.manifest.files.filter((file) => file.journal !== undefined && !file.journal.ok).map((file) => file.path);
    const summary = { file: out, files: archive.manifest.files.length, bytes: archive.bytes.length, skipped: archive.skipped, damagedJournals: damaged };
    if (values.json === true) {
      io.stdout(`${JSON.stringify(summary)}\n`);
    } else {
      io.stdout(`Wrote ${out}: ${summary.files} files, ${summary.bytes} bytes.\n`);
      if (archive.skipped.length > 0) io.stdout(`Left out (not Tallyline's): ${archive.skipped.join(', ')}\n`);
      if (damaged.length > 0) io.stdout(`Already damaged, archived as they are: ${damaged.join(', ')}\n`);
    }
    return EXIT_OK;
  },
};
