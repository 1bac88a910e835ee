/**
 * The command line as a function: the table of commands and `runCli`, which resolves to the exit
 * code and writes only to the given streams, so tests can walk every command in-process.
 * Add a command by writing `src-main/cli/<name>.ts` exporting `command: Command` and one line below.
 */
import type { CliIo } from './command.js';
import { EXIT_FAILURE, errorLine } from './command.js';
import { dispatch } from './dispatch.js';
import type { CommandTable } from './dispatch.js';

export const commands: CommandTable = {
  plan: { summary: 'design a sequential plan (lines, OC/ASN, single plan)', load: () => import('./plan.js') },
  replay: { summary: 'replay recorded results through a plan to its decision', load: () => import('./replay.js') },
  'run start': { summary: 'start an inspection run (saved plan or plan flags)', load: async () => ({ command: (await import('./run.js')).startCommand }) },
  'run show': { summary: 'print a run: plan, entries and state', load: async () => ({ command: (await import('./run.js')).showCommand }) },
  feed: { summary: 'record results for a run from stdin, one a line', load: () => import('./feed.js') },
  verify: { summary: "re-read a run's journal and verify its hash chain (and a printed record with --pdf)", load: () => import('./verify.js') },
  record: { summary: 'write the decision record PDF of a run (interim while undecided)', load: () => import('./record.js') },
  export: { summary: "export a run's entries as CSV (RFC 4180)", load: () => import('./export.js') },
  backup: { summary: 'write the whole data folder to one archive file', load: () => import('./backup.js') },
  restore: { summary: 'replace the data folder with a verified archive (the old one is kept)', load: () => import('./restore.js') },
  demo: { summary: 'fill an empty data folder with the invented demo scenario', load: () => import('./demo.js') },
};

/** Runs `tallyline <argv>`; every failure ends as one line on `io.stderr` and an exit code, never a throw. */
export async function runCli(argv: readonly string[], io: CliIo): Promise<number> {
  try {
    return await dispatch(commands, argv, io);
  } catch (error) {
    io.stderr(`tallyline: ${errorLine(error)}\n`);
    return EXIT_FAILURE;
  }
}
