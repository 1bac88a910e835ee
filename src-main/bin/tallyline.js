#!/usr/bin/env node
// The `tallyline` bin: runs the TypeScript CLI (src-main/cli.ts) under tsx in a child Node process.
// Paths resolve from this file's location, so it works from any working directory.
import { spawn } from 'node:child_process';
import { fileURLToPath } from 'node:url';

const cli = fileURLToPath(new URL('../cli.ts', import.meta.url));
const tsx = import.meta.resolve('tsx');

const child = spawn(process.execPath, ['--import', tsx, cli, ...process.argv.slice(2)], { stdio: 'inherit' });
child.on('exit', (code, signal) => {
  if (signal !== null) process.kill(process.pid, signal);
  else process.exit(code ?? 1);
});
