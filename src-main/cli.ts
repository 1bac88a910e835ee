/**
 * The `tallyline` command line: `npm run cli -- <command> ...` or the `tallyline` bin.
 * Add a command by writing `src-main/cli/<name>.ts` exporting `command: Command` and one line below.
 */
import { readFile } from 'node:fs/promises';
import type { CliIo } from './cli/command.js';
import { dispatch } from './cli/dispatch.js';
import type { CommandTable } from './cli/dispatch.js';

const commands: CommandTable = {
  plan: { summary: 'design a sequential plan (lines, OC/ASN, single plan)', load: () => import('./cli/plan.js') },
  replay: { summary: 'replay recorded results through a plan to its decision', load: () => import('./cli/replay.js') },
  'run start': { summary: 'start an inspection run (saved plan or plan flags)', load: async () => ({ command: (await import('./cli/run.js')).startCommand }) },
  'run show': { summary: 'print a run: plan, entries and state', load: async () => ({ command: (await import('./cli/run.js')).showCommand }) },
  feed: { summary: 'record results for a run from stdin, one a line', load: () => import('./cli/feed.js') },
  verify: { summary: "re-read a run's journal and verify its hash chain (and a printed record with --pdf)", load: () => import('./cli/verify.js') },
  record: { summary: 'write the decision record PDF of a run (interim while undecided)', load: () => import('./cli/record.js') },
  export: { summary: "export a run's entries as CSV (RFC 4180)", load: () => import('./cli/export.js') },
  backup: { summary: 'write the whole data folder to one archive file', load: () => import('./cli/backup.js') },
  restore: { summary: 'replace the data folder with a verified archive (the old one is kept)', load: () => import('./cli/restore.js') },
  demo: { summary: 'fill an empty data folder with the invented demo scenario', load: () => import('./cli/demo.js') },
};

async function readStdin(): Promise<string> {
  const chunks: Buffer[] = [];
  for await (const chunk of process.stdin) chunks.push(chunk as Buffer);
  return Buffer.concat(chunks).toString('utf8');
}

const io: CliIo = {
  stdout: (text) => void process.stdout.write(text),
  stderr: (text) => void process.stderr.write(text),
  readText: (path) => (path === '-' ? readStdin() : readFile(path, 'utf8')),
};

process.exitCode = await dispatch(commands, process.argv.slice(2), io);
