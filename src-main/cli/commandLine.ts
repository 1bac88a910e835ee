/**
 * The `tallyline` command line as a function of argv: the table of commands and the process's own
 * stdin/stdout/stderr. `src-main/cli.ts` runs it from Node; the desktop app's main process runs it
 * when it is started with a command (`tallyline plan ...` in an installed app opens no window).
 * Add a command by writing `src-main/cli/<name>.ts` exporting `command: Command` and one line below.
 */
import { readFile } from 'node:fs/promises';
import { createInterface } from 'node:readline';
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

/**
 * Whether these arguments ask for the command line rather than the window: they start with a
 * command's first word, or with `help` / `--help`. Flags alone (`--data-dir DIR`) open the window.
 */
export function isCommandLine(args: readonly string[]): boolean {
  const first = args[0];
  if (first === undefined) return false;
  if (first === 'help' || first === '--help') return true;
  return Object.keys(commands).some((name) => name.split(' ')[0] === first);
}

async function readStdin(): Promise<string> {
  const chunks: Buffer[] = [];
  for await (const chunk of process.stdin) chunks.push(chunk as Buffer);
  return Buffer.concat(chunks).toString('utf8');
}

const processIo: CliIo = {
  stdout: (text) => void process.stdout.write(text),
  stderr: (text) => void process.stderr.write(text),
  readText: (path) => (path === '-' ? readStdin() : readFile(path, 'utf8')),
  inputLines() {
    const reader = createInterface({ input: process.stdin, crlfDelay: Infinity });
    // Take the iterator now: it buffers lines that arrive (and the end of input) while a run opens.
    const iterator = reader[Symbol.asyncIterator]();
    return {
      lines: { [Symbol.asyncIterator]: () => iterator },
      close() {
        reader.close();
        process.stdin.destroy();
      },
    };
  },
};

/**
 * Runs `tallyline <argv>` against the given streams, so tests can walk every command in-process;
 * every failure ends as one line on `io.stderr` and an exit code, never a throw.
 */
export async function runCli(argv: readonly string[], io: CliIo): Promise<number> {
  try {
    return await dispatch(commands, argv, io);
  } catch (error) {
    io.stderr(`tallyline: ${errorLine(error)}\n`);
    return EXIT_FAILURE;
  }
}

/** Runs the command named at the front of `args` against the process's own streams; resolves to the exit code. */
export function runCommandLine(args: readonly string[]): Promise<number> {
  return runCli(args, processIo);
}
