/**
 * Finds the command for the words at the front of argv in a command table (one- or two-word names
 * such as "plan" or "run start") and runs it.
 */
import type { CliIo, Command } from './command.js';
import { EXIT_OK, EXIT_USAGE, runCommand } from './command.js';

/** Command name (one or two words) -> loader of its module, so a command loads only when used. */
export type CommandTable = Record<string, { summary: string; load: () => Promise<{ command: Command }> }>;

export function helpText(table: CommandTable): string {
  const width = Math.max(...Object.keys(table).map((name) => name.length));
  const rows = Object.entries(table).map(([name, entry]) => `  ${name.padEnd(width)}  ${entry.summary}`);
  return ['Usage: tallyline <command> [flags]   (tallyline <command> --help for its flags)', '', ...rows].join('\n');
}

/** Runs the command named at the front of argv; resolves to the exit code. */
export async function dispatch(table: CommandTable, argv: readonly string[], io: CliIo): Promise<number> {
  if (argv.length === 0 || argv[0] === '--help' || argv[0] === 'help') {
    io.stdout(`${helpText(table)}\n`);
    return argv.length === 0 ? EXIT_USAGE : EXIT_OK;
  }
  const twoWords = argv.length >= 2 ? `${argv[0]} ${argv[1]}` : '';
  const name = Object.hasOwn(table, twoWords) ? twoWords : argv[0];
  if (!Object.hasOwn(table, name)) {
    io.stderr(`tallyline: unknown command ${JSON.stringify(argv[0])} (commands: ${Object.keys(table).join(', ')})\n`);
    return EXIT_USAGE;
  }
  const { command } = await table[name].load();
  return runCommand(name, command, argv.slice(name.split(' ').length), io);
}
