/**
 * What every `tallyline` command module exports, and the wrapper that turns usage and parameter
 * errors into one line on stderr and exit code 2.
 */
import { PlanParameterError } from '../engine/index.js';
import { UsageError } from './flags.js';

/** The outside world of a command, so tests can run commands in-process. */
export interface CliIo {
  stdout(text: string): void;
  stderr(text: string): void;
  /** Reads a file, or standard input for "-". */
  readText(path: string): Promise<string>;
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
 * Runs a command, mapping UsageError and PlanParameterError to one stderr line and exit 2.
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
      io.stderr(`tallyline ${name}: ${error.message}\n`);
      return EXIT_USAGE;
    }
    if (error instanceof PlanParameterError) {
      io.stderr(`tallyline ${name}: ${flagForParameter(error.parameter)}: ${error.message}\n`);
      return EXIT_USAGE;
    }
    throw error;
  }
}
