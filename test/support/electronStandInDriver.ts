/**
 * Runs the BUILT Electron main process (build/main/electron/main.js) under plain Node with the
 * recording `electron` stand-in (electronStandIn.ts), and drives it over the child-process IPC
 * channel. The stand-in and its resolve hook are compiled to JavaScript with esbuild first, so
 * what runs is compiled JS only, as in an installed app.
 */
import { spawn } from 'node:child_process';
import { mkdirSync, mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { build } from 'esbuild';
import type { StandInRecording } from './electronStandIn.js';

export type { StandInRecording, MenuItemSummary, WindowSummary } from './electronStandIn.js';

const repoRoot = fileURLToPath(new URL('../..', import.meta.url));
export const builtMain = join(repoRoot, 'build', 'main', 'electron', 'main.js');

/** Compiles the stand-in, its hook and the register file into `folder`; returns the file for `node --import`. */
export async function buildElectronStandIn(folder = mkdtempSync(join(tmpdir(), 'electron-stand-in-'))): Promise<string> {
  mkdirSync(folder, { recursive: true });
  await build({
    entryPoints: ['electronStandIn', 'electronStandInHooks', 'electronStandInRegister'].map((name) => join(repoRoot, 'test', 'support', `${name}.ts`)),
    outdir: folder,
    outExtension: { '.js': '.mjs' },
    format: 'esm',
    platform: 'node',
    target: 'node20',
    logLevel: 'error',
  });
  return join(folder, 'electronStandInRegister.mjs');
}

export interface StandInOptions {
  registerFile: string;
  args?: string[];
  env?: Record<string, string>;
  /** Which main script to run; the built one by default. */
  main?: string;
}

export interface StandInProcess {
  send<T = unknown>(command: Record<string, unknown>): Promise<T>;
  snapshot(): Promise<StandInRecording>;
  /** Resolves when the process ends, with what it printed and the recording it wrote on exit. */
  exited: Promise<{ code: number | null; stdout: string; stderr: string; recording: StandInRecording | null }>;
  stop(): void;
}

export function startWithStandIn(options: StandInOptions): StandInProcess {
  const recordingFile = join(mkdtempSync(join(tmpdir(), 'electron-stand-in-recording-')), 'recording.json');
  const child = spawn(process.execPath, ['--import', options.registerFile, options.main ?? builtMain, ...(options.args ?? [])], {
    cwd: repoRoot,
    env: { ...process.env, ...options.env, ELECTRON_STAND_IN_RECORDING: recordingFile },
    stdio: ['ignore', 'pipe', 'pipe', 'ipc'],
  });
  let stdout = '';
  let stderr = '';
  child.stdout!.on('data', (chunk) => (stdout += chunk));
  child.stderr!.on('data', (chunk) => (stderr += chunk));
  let nextId = 1;
  const pending = new Map<number, { resolve: (value: any) => void; reject: (error: Error) => void }>();
  child.on('message', (message: { id: number; ok: boolean; value?: unknown; message?: string }) => {
    const waiting = pending.get(message.id);
    pending.delete(message.id);
    if (message.ok) waiting?.resolve(message.value);
    else waiting?.reject(new Error(message.message));
  });
  // Resolved on exit once both output pipes are drained ('close' is not used: it never fires once
  // the parent has disconnected the IPC channel).
  const drained = (stream: NodeJS.ReadableStream) => new Promise<void>((resolve) => stream.once('close', () => resolve()));
  const outputDrained = Promise.all([drained(child.stdout!), drained(child.stderr!)]);
  const exited = new Promise<number | null>((resolve) => child.once('exit', (code) => resolve(code))).then(async (code) => {
    for (const waiting of pending.values()) waiting.reject(new Error(`the process ended (code ${code}); stderr: ${stderr}`));
    await outputDrained;
    let recording: StandInRecording | null = null;
    try {
      recording = JSON.parse(readFileSync(recordingFile, 'utf8'));
    } catch {
      recording = null;
    }
    return { code, stdout, stderr, recording };
  });
  const send = <T>(command: Record<string, unknown>) =>
    new Promise<T>((resolve, reject) => {
      const id = nextId++;
      pending.set(id, { resolve, reject });
      child.send({ id, command }, (error) => {
        if (error) {
          pending.delete(id);
          reject(error);
        }
      });
    });
  return {
    send,
    snapshot: () => send<StandInRecording>({ type: 'snapshot' }),
    exited,
    stop: () => {
      if (child.connected) child.disconnect();
      if (child.exitCode === null) child.kill();
    },
  };
}
