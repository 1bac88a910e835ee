/**
 * The `tallyline` command line under Node: `npm run cli -- <command> ...`, the `tallyline` bin, or
 * `node build/main/cli.js`. The commands are listed in `cli/commandLine.ts`.
 */
import { runCommandLine } from './cli/commandLine.js';

process.exitCode = await runCommandLine(process.argv.slice(2));
