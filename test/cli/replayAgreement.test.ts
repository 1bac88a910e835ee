/** `replay` and `feed` read the same lines into the same evidence: per model, the same results give the same decision. */
import { mkdtemp, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { CliIo } from '../../src-main/cli/command.js';
import { runCommand } from '../../src-main/cli/command.js';
import { feedLines } from '../../src-main/cli/feed.js';
import { command as replayCommand } from '../../src-main/cli/replay.js';
import { startCommand } from '../../src-main/cli/run.js';
import { createRunService } from '../../src-main/inspection/index.js';

/** Invented plans and result lines; each case reaches a decision within its lines. */
const cases: Array<[model: string, planFlags: string[], lines: string[]]> = [
  ['passfail', ['--model', 'passfail', '--p0', '0.01', '--p1', '0.1', '--alpha', '0.05', '--beta', '0.05'], ['pass', '1', 'fail', 'pass']],
  ['count', ['--model', 'count', '--lambda0', '0.1', '--lambda1', '0.5', '--alpha', '0.05', '--beta', '0.05'], ['0', '2', '3']],
  ['measurement', ['--model', 'measurement', '--mu0', '10', '--mu1', '10.5', '--sigma', '0.4', '--alpha', '0.05', '--beta', '0.1'], ['10.2', '# a comment', '10.9', '10.9']],
  // The last reading passes the acceptance line: the test decided where the line was reached.
  ['lifetime', ['--model', 'lifetime', '--theta0', '4000', '--theta1', '1000', '--alpha', '0.05', '--beta', '0.05'], ['time 3000', 'fail', 'fail 3500', 'time 20000']],
  ['graded', ['--model', 'graded', '--classes', 'conforming,minor,major', '--p0', '0.9,0.08,0.02', '--p1', '0.75,0.17,0.08', '--alpha', '0.05', '--beta', '0.1'], ['major', '2', 'MAJOR', 'minor']],
];

function capture(): { io: CliIo; out: () => string; err: () => string } {
  let out = '';
  let err = '';
  return {
    io: { stdout: (text) => void (out += text), stderr: (text) => void (err += text), readText: () => Promise.reject(new Error('not used')), inputLines: () => ({ lines: (async function* () {})(), close: () => undefined }) },
    out: () => out,
    err: () => err,
  };
}

describe('replay and feed agree', () => {
  let data: string;
  beforeAll(async () => {
    data = await mkdtemp(path.join(os.tmpdir(), 'tallyline-replay-feed-'));
  });
  afterAll(() => rm(data, { recursive: true, force: true }));

  it.each(cases)('for a %s plan: the same lines give the same decision, evidence, LLR and rule', async (_model, planFlags, lines) => {
    const replayed = capture();
    const io = { ...replayed.io, readText: async () => lines.join('\n') };
    expect(await runCommand('replay', replayCommand, [...planFlags, '--results', '-', '--json'], io)).toBe(0);
    const summary = JSON.parse(replayed.out()) as Record<string, unknown>;

    const started = capture();
    expect(await runCommand('run start', startCommand, [...planFlags, '--source', 'Larkspur Components (invented)', '--lot', 'LK-1', '--data-dir', data, '--json'], started.io)).toBe(0);
    const runId = (JSON.parse(started.out()) as { run: string }).run;
    const service = createRunService({ dataDirectory: data });
    try {
      const fed = capture();
      const lineSource = (async function* () {
        yield* lines;
      })();
      expect(await feedLines(service, lineSource, { runId, json: true }, fed.io)).toBe(0);
      const { state } = await service.openRun(runId);
      expect(state.decision).not.toBe('continue');
      const { decision, llr, rule, ...evidence } = summary;
      expect({ decision, llr, rule }).toEqual({ decision: state.decision, llr: state.llr, rule: state.rule });
      expect(state).toMatchObject(evidence);
    } finally {
      await service.close();
    }
  });

  it('refuses a test time going down in the words feed uses, naming the line', async () => {
    const replayed = capture();
    const io = { ...replayed.io, readText: async () => 'time 50\nfail 20\n' };
    expect(await runCommand('replay', replayCommand, [...cases[3][1], '--results', '-'], io)).toBe(2);
    expect(replayed.err()).toBe('tallyline replay: --results line 2: accumulated test time never goes down: it is 50 now, so 20 is not allowed\n');
  });
});
