/**
 * What every `tallyline` command module exports, and the one place that turns what a command
 * throws into one line on stderr and an exit code: usage and parameter errors exit 2, everything
 * else (files, folders, runs, archives) exits 1. Never a stack trace.
 */
import { PlanParameterError } from '../engine/index.js';
import { visibleText } from '../store/textFields.js';
import { UsageError, messageInTypedUnits } from './flags.js';

/** A failure that is not a usage error (a missing run, a data folder that is a file): exit 1 with this one line. */
export class CliFailure extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'CliFailure';
  }
}

/** What the system error codes mean, in words. */
const SYSTEM_ERRORS: Record<string, string> = {
  ENOENT: 'no such file or folder',
  ENOTDIR: 'a part of the path is a file, not a folder',
  EISDIR: 'it is a folder, not a file',
  EACCES: 'permission denied',
  EPERM: 'operation not permitted',
  EROFS: 'the file system is read-only',
  EEXIST: 'it already exists',
  ENOSPC: 'no space left on the device',
  EMFILE: 'too many open files',
  ENAMETOOLONG: 'the name is too long',
  EBUSY: 'it is busy',
  ELOOP: 'too many symbolic links',
};

/** One line for an error: a system error by what it means and its path, anything else by its first line. */
export function errorLine(error: unknown): string {
  const system = error as NodeJS.ErrnoException;
  if (error instanceof Error && typeof system.code === 'string' && typeof system.syscall === 'string') {
    const meaning = SYSTEM_ERRORS[system.code] ?? system.code;
    const where = system.path === undefined ? '' : ` ${system.path}`;
    return visibleText(`cannot ${system.syscall}${where}: ${meaning} (${system.code})`);
  }
  const message = error instanceof Error ? error.message : String(error);
  const firstLine = message.split('\n').find((line) => line.trim() !== '') ?? 'failed';
  return visibleText(firstLine.length > 500 ? `${firstLine.slice(0, 500)}...` : firstLine);
}

/** The outside world of a command, so tests can run commands in-process. */
export interface CliIo {
  stdout(text: string): void;
  stderr(text: string): void;
  /** Reads a file, or standard input for "-". */
  readText(path: string): Promise<string>;
  /** Standard input one line at a time, buffered from the call on; `close` stops reading it. */
  inputLines(): { lines: AsyncIterable<string>; close(): void };
}

/** A command module: `export const command: Command = { ... }`. */
export interface Command {
  /** One line for the help listing. */
  summary: string;
  /** Usage text for `tallyline <command> --help`. */
  usage: string;
  /** Runs with the arguments after the command words; resolves to the exit code. */
  run(args: readonly string[], io: CliIo): Promise<number>;
}

export const EXIT_OK = 0;
export const EXIT_FAILURE = 1;
export const EXIT_USAGE = 2;

/** Engine parameter names that a flag of a different name sets. */
const PARAMETER_FLAGS: Record<string, string> = {
  truncation: 'truncate',
  curvePoints: 'points',
  maxTime: 'max-time',
  maxFailures: 'max-failures',
  overshootCorrection: 'correct-overshoot',
};

/** The flag that set an engine parameter, e.g. "p0" -> "--p0", "truncation" -> "--truncate". */
export function flagForParameter(parameter: string): string {
  return `--${PARAMETER_FLAGS[parameter] ?? parameter}`;
}

/**
 * Runs a command, mapping UsageError and PlanParameterError to one stderr line and exit 2, and any
 * other error to one stderr line and exit 1.
 *
 * @param name the command words, for the message prefix ("tallyline plan: ...").
 */
export async function runCommand(name: string, command: Command, args: readonly string[], io: CliIo): Promise<number> {
  if (args.includes('--help')) {
    io.stdout(`${command.usage}\n`);
    return EXIT_OK;
  }
  try {
    return await command.run(args, io);
  } catch (error) {
    if (error instanceof UsageError) {
      io.stderr(`tallyline ${name}: ${errorLine(error)}\n`);
      return EXIT_USAGE;
    }
    if (error instanceof PlanParameterError) {
      io.stderr(`tallyline ${name}: ${flagForParameter(error.parameter)}: ${messageInTypedUnits(errorLine(error), args)}\n`);
      return EXIT_USAGE;
    }
    io.stderr(`tallyline ${name}: ${errorLine(error)}\n`);
    return EXIT_FAILURE;
  }
}
