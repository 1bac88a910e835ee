/**
 * The `tallyline` command line process: `npm run cli -- <command> ...` or the `tallyline` bin.
 * The commands live in cli/runCli.ts; this file connects them to the process's streams.
 */
import { readFile } from 'node:fs/promises';
import { createInterface } from 'node:readline';
import type { CliIo } from './cli/command.js';
import { runCli } from './cli/runCli.js';

async function readStdin(): Promise<string> {
  const chunks: Buffer[] = [];
  for await (const chunk of process.stdin) chunks.push(chunk as Buffer);
  return Buffer.concat(chunks).toString('utf8');
}

const io: CliIo = {
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

process.exitCode = await runCli(process.argv.slice(2), io);
