import { describe, expect, it } from 'vitest';
import { spawn } from 'node:child_process';
import { mkdtemp, readFile, rm, writeFile } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterEach } from 'vitest';
import { decideLinearCount } from '../../src-main/engine/index.js';
import { layout } from '../../src-main/store/index.js';
import { compiledCliEntry } from '../cli/runCli.js';

const root = fileURLToPath(new URL('../..', import.meta.url));
const planFlags = ['--model', 'passfail', '--p0', '0.01', '--p1', '0.1', '--alpha', '0.05', '--beta', '0.05'];

interface CliResult {
  readonly code: number | null;
  readonly stdout: string;
  readonly stderr: string;
}

/** Run the real compiled CLI (as `npm run cli` does) with `input` on stdin, closed after it unless `keepOpen`. */
function cli(args: readonly string[], input = '', keepOpen = false): Promise<CliResult> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, [compiledCliEntry, ...args], { cwd: root, env: { ...process.env, TALLYLINE_DATA: '' } });
    let stdout = '';
    let stderr = '';
    child.stdout.on('data', (chunk: Buffer) => (stdout += chunk.toString()));
    child.stderr.on('data', (chunk: Buffer) => (stderr += chunk.toString()));
    child.on('error', reject);
    child.on('close', (code) => resolve({ code, stdout, stderr }));
    if (keepOpen) child.stdin.write(input);
    else child.stdin.end(input);
  });
}

const folders: string[] = [];
afterEach(async () => {
  await Promise.all(folders.splice(0).map((folder) => rm(folder, { recursive: true, force: true })));
});

async function startRun(): Promise<{ data: string; runId: string }> {
  const data = await mkdtemp(path.join(os.tmpdir(), 'tallyline-cli-'));
  folders.push(data);
  const started = await cli(['run', 'start', ...planFlags, '--source', 'Acme Castings', '--lot', 'L-7', '--inspector', 'Ana', '--data-dir', data, '--json']);
  expect(started.stderr).toBe('');
  expect(started.code).toBe(0);
  const { run } = JSON.parse(started.stdout) as { run: string };
  return { data, runId: run };
}

const lines = (text: string): unknown[] => text.trim().split('\n').filter(Boolean).map((line) => JSON.parse(line));

describe('the run command line', () => {
  it('run start with plan flags saves the plan and the source and prints {"run": ID}', async () => {
    const { data, runId } = await startRun();
    const shown = await cli(['run', 'show', '--run', runId, '--data-dir', data, '--json']);
    const view = JSON.parse(shown.stdout);
    // The first four keys are the shape station scripts read; the rest were added after them.
    expect(Object.keys(view)).toEqual(['run', 'plan', 'entries', 'state', 'outcome', 'history', 'problems', 'writable', 'fingerprint']);
    expect(view).toMatchObject({ outcome: 'open', history: [], problems: [], writable: true, fingerprint: view.run.fingerprint });
    expect(view.fingerprint).toMatch(/^[0-9a-f]{64}$/);
    expect(view.plan).toMatchObject({ format: 'tallyline.plan/1', version: 1, spec: { model: 'passfail', p0: 0.01, p1: 0.1 } });
    expect(view.run).toMatchObject({ id: runId, lot: 'L-7', sourceName: 'Acme Castings', inspector: 'Ana' });
    expect(view.state).toEqual({ decision: 'continue', n: 0, total: 0, llr: 0 });
  });

  it('run start --plan reuses a saved plan and the existing source', async () => {
    const { data, runId } = await startRun();
    const first = JSON.parse((await cli(['run', 'show', '--run', runId, '--data-dir', data, '--json'])).stdout);
    const again = await cli(['run', 'start', '--plan', first.plan.id, '--source', 'acme castings', '--lot', 'L-8', '--data-dir', data, '--json']);
    const second = JSON.parse((await cli(['run', 'show', '--run', JSON.parse(again.stdout).run, '--data-dir', data, '--json'])).stdout);
    expect(second.run).toMatchObject({ planId: first.plan.id, planVersion: 1, sourceId: first.run.sourceId, lot: 'L-8' });
  });

  it('feed prints one line per durable entry and stops right after the deciding line', async () => {
    const { data, runId } = await startRun();
    const fed = await cli(['feed', '--run', runId, '--data-dir', data, '--json'], 'pass\n0\nfail\n1\n1\n1\n1\n1\n');
    expect(fed.code).toBe(0);
    const printed = lines(fed.stdout) as { seq: number; state: string }[];
    const expected = decideLinearCount({ model: 'passfail', p0: 0.01, p1: 0.1, alpha: 0.05, beta: 0.05 }, printed.length, printed.length - 2);
    expect(printed.at(-1)).toEqual({ seq: printed.length, state: expected.decision });
    expect(expected.decision).toBe('reject');
    expect(printed.slice(0, -1).every((line) => line.state === 'continue')).toBe(true);
    expect(printed.map((line) => line.seq)).toEqual(printed.map((_, index) => index + 1));
    const shown = JSON.parse((await cli(['run', 'show', '--run', runId, '--data-dir', data, '--json'])).stdout);
    expect(shown.entries).toHaveLength(printed.length);
    expect(shown.run).toMatchObject({ status: 'closed', decision: 'reject' });
  });

  it('feed exits after the deciding line even when its input stays open', async () => {
    const { data, runId } = await startRun();
    const fed = await cli(['feed', '--run', runId, '--data-dir', data, '--json'], '1\n1\n1\n', true);
    expect(fed.code).toBe(0);
    expect((lines(fed.stdout) as { state: string }[]).at(-1)?.state).toBe('reject');
  });

  it('feed rejects a bad line with its number on stderr and exit 2, keeping the lines before it', async () => {
    const { data, runId } = await startRun();
    const fed = await cli(['feed', '--run', runId, '--data-dir', data, '--json'], 'pass\n# a comment\npass\nmaybe\npass\n');
    expect(fed.code).toBe(2);
    expect(fed.stderr).toMatch(/line 4/);
    expect(lines(fed.stdout)).toEqual([{ seq: 1, state: 'continue' }, { seq: 2, state: 'continue' }]);
    const shown = JSON.parse((await cli(['run', 'show', '--run', runId, '--data-dir', data, '--json'])).stdout);
    expect(shown.entries.map((entry: { seq: number; result: string }) => [entry.seq, entry.result])).toEqual([[1, 'pass'], [2, 'pass']]);
  });

  it('a second feed on the same run continues its sequence', async () => {
    const { data, runId } = await startRun();
    await cli(['feed', '--run', runId, '--data-dir', data, '--json'], 'pass\npass\n');
    const second = await cli(['feed', '--run', runId, '--data-dir', data, '--json'], 'pass\n');
    expect(lines(second.stdout)).toEqual([{ seq: 3, state: 'continue' }]);
  });

  it('verify prints ok and the fingerprint, and names the first bad seq of an edited journal with exit 1', async () => {
    const { data, runId } = await startRun();
    await cli(['feed', '--run', runId, '--data-dir', data, '--json'], 'pass\npass\npass\n');
    const good = await cli(['verify', '--run', runId, '--data-dir', data, '--json']);
    expect(good.code).toBe(0);
    expect(JSON.parse(good.stdout)).toMatchObject({ ok: true, entries: 4, fingerprint: expect.stringMatching(/^[0-9a-f]{64}$/), problems: [] });
    const journal = layout.runJournal(data, runId);
    const text = (await readFile(journal, 'utf8')).split('\n');
    text[2] = text[2].replace('"pass"', '"fail"');
    await writeFile(journal, text.join('\n'));
    const bad = await cli(['verify', '--run', runId, '--data-dir', data, '--json']);
    expect(bad.code).toBe(1);
    expect(JSON.parse(bad.stdout)).toMatchObject({ ok: false, problems: [{ seq: 2 }] });
  });
});
