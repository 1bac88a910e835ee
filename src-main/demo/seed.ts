/** `npm run demo [-- --data-dir DIR]`: the `tallyline demo` command, run directly. */
import { command } from '../cli/demo.js';
import { runCommand } from '../cli/command.js';

process.exitCode = await runCommand('demo', command, process.argv.slice(2), {
  stdout: (text) => void process.stdout.write(text),
  stderr: (text) => void process.stderr.write(text),
  readText: () => Promise.reject(new Error('the demo reads no files')),
  inputLines: () => ({ lines: (async function* () {})(), close: () => undefined }),
});
