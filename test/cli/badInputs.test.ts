// Every command walked with bad input, in-process through runCli (a spawn costs seconds; the
// process wrapper around runCli is exercised by a handful of real spawns at the end).
import { chmod, mkdir, mkdtemp, readdir, readFile, rm, writeFile } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { CliIo } from '../../src-main/cli/command.js';
import { runCli as runCliInProcess } from '../../src-main/cli/commandLine.js';
import { unboundedSpecs } from '../engine/unboundedSpecs.js';
import { runCli as spawnCli } from './runCli.js';

interface Outcome {
  code: number | 'hang';
  stdout: string;
  stderr: string;
}

/** A bound on one in-process command: past it the command counts as hanging. */
const HANG_MS = 10_000;

async function cli(argv: readonly string[], input = ''): Promise<Outcome> {
  let stdout = '';
  let stderr = '';
  const io: CliIo = {
    stdout: (text) => void (stdout += text),
    stderr: (text) => void (stderr += text),
    readText: async (file) => (file === '-' ? input : readFile(file, 'utf8')),
    inputLines: () => ({
      lines: (async function* () {
        for (const line of input.split('\n')) yield line;
      })(),
      close: () => undefined,
    }),
  };
  let timer: NodeJS.Timeout | undefined;
  const hang = new Promise<'hang'>((resolve) => (timer = setTimeout(() => resolve('hang'), HANG_MS)));
  const code = await Promise.race([runCliInProcess(argv, io), hang]);
  clearTimeout(timer);
  return { code, stdout, stderr };
}

/** A Node stack trace or an error dump, as opposed to one line naming what is wrong. */
function hasStackTrace(text: string): boolean {
  return /^\s+at /m.test(text) || /^(\w*Error|Error):/m.test(text) || /\bError: /.test(text);
}

// Inputs of the NIST/SEMATECH e-Handbook §6.2.6 example (p0 0.01, p1 0.10, alpha 0.05, beta 0.10), first-hand.
const nistFlags = ['--model', 'passfail', '--p0', '0.01', '--p1', '0.10', '--alpha', '0.05', '--beta', '0.10'];

const badValues: Array<[string, string | null]> = [
  ['missing', null],
  ['empty', ''],
  ['whitespace', '   '],
  ['NaN', 'NaN'],
  ['huge', '1e308'],
  ['100 kB', 'x'.repeat(100_000)],
  ['negative', '-1'],
  ['ESC', '\u001b[2J\u001b[31mred'],
  ['NUL', 'a\u0000b'],
  ['bidi override', 'lot\u202Eevil'],
  ['a flag', '--data-dir'],
];

let root: string;
let startingFolder: string;
let data: string;
let runId: string;
let aFile: string;
let readOnly: string;

beforeAll(async () => {
  root = await mkdtemp(path.join(os.tmpdir(), 'tallyline-bad-inputs-'));
  // The walk passes bad values as output paths too (e.g. `--out NaN`): run it inside the temp folder so
  // a value that is a valid file name lands there, never in the repository.
  startingFolder = process.cwd();
  process.chdir(root);
  data = path.join(root, 'data');
  await mkdir(data);
  const started = await cli(['run', 'start', ...nistFlags, '--source', 'Quillfeather Valves (invented)', '--lot', 'QV-0001', '--json', '--data-dir', data]);
  if (started.code !== 0) throw new Error(started.stderr);
  runId = JSON.parse(started.stdout).run;
  aFile = path.join(root, 'a-file.txt');
  await writeFile(aFile, 'not a folder and not an archive\n');
  readOnly = path.join(root, 'read-only');
  await mkdir(readOnly);
  await chmod(readOnly, 0o500);
}, 30_000);

afterAll(async () => {
  process.chdir(startingFolder);
  await chmod(readOnly, 0o700).catch(() => undefined);
  await rm(root, { recursive: true, force: true });
});

/** Each command with arguments that work, and the flags whose values the walk replaces. */
function commands(): Array<{ name: string; argv: string[]; flags: string[]; input?: string }> {
  const out = (file: string) => path.join(root, file);
  return [
    { name: 'plan', argv: ['plan', ...nistFlags, '--truncate', '50', '--points', '11', '--json'], flags: ['--p0', '--p1', '--alpha', '--beta', '--truncate', '--points', '--model'] },
    { name: 'replay', argv: ['replay', ...nistFlags, '--results', '-', '--json'], flags: ['--p1', '--results'], input: 'pass\nfail\n' },
    {
      name: 'run start',
      argv: ['run', 'start', ...nistFlags, '--source', 'Quillfeather Valves (invented)', '--lot', 'QV-0002', '--inspector', 'M. Osei', '--json', '--data-dir', data],
      flags: ['--source', '--lot', '--inspector', '--note', '--lot-size', '--plan-name', '--truncate'],
    },
    { name: 'run start --plan', argv: ['run', 'start', '--plan', 'plan-nope', '--source', 'S', '--lot', 'L', '--data-dir', data], flags: ['--plan', '--plan-version'] },
    { name: 'run show', argv: ['run', 'show', '--run', 'RUN', '--data-dir', data], flags: ['--run', '--data-dir'] },
    { name: 'feed', argv: ['feed', '--run', 'RUN', '--json', '--data-dir', data], flags: ['--run', '--actor', '--data-dir'], input: 'pass\n' },
    { name: 'verify', argv: ['verify', '--run', 'RUN', '--data-dir', data], flags: ['--run', '--pdf', '--data-dir'] },
    { name: 'record', argv: ['record', '--run', 'RUN', '--out', out('record.pdf'), '--data-dir', data], flags: ['--run', '--out', '--data-dir'] },
    { name: 'export', argv: ['export', '--run', 'RUN', '--out', '-', '--data-dir', data], flags: ['--run', '--out', '--data-dir'] },
    { name: 'backup', argv: ['backup', '--out', out('backup.tallyline'), '--data-dir', data], flags: ['--out', '--data-dir'] },
    { name: 'restore', argv: ['restore', '--from', aFile, '--data-dir', path.join(root, 'restored')], flags: ['--from', '--data-dir'] },
    { name: 'demo', argv: ['demo', '--data-dir', data], flags: ['--seed', '--data-dir'] },
  ];
}

/** argv with one flag's value replaced (or the flag added), or the flag left without a value at the end. */
function withValue(argv: readonly string[], flagName: string, value: string | null): string[] {
  const at = argv.indexOf(flagName);
  const rest = at < 0 ? [...argv] : [...argv.slice(0, at), ...argv.slice(at + 2)];
  return value === null ? [...rest, flagName] : [...rest, flagName, value];
}

describe('the bad-input walk over every command', () => {
  it('answers every bad value and every bad data folder with one line and an exit code: 0 stack traces, 0 hangs', { timeout: 600_000 }, async () => {
    const counts = { invocations: 0, stackTraces: 0, hangs: 0, multiLine: 0 };
    const failures: string[] = [];
    const check = (label: string, outcome: Outcome) => {
      counts.invocations += 1;
      const both = outcome.stdout + outcome.stderr;
      if (outcome.code === 'hang') {
        counts.hangs += 1;
        failures.push(`${label}: hang`);
      } else if (hasStackTrace(both)) {
        counts.stackTraces += 1;
        failures.push(`${label}: ${both.slice(0, 300)}`);
      } else if (outcome.code !== 0 && outcome.stderr.trimEnd().split('\n').length !== 1) {
        counts.multiLine += 1;
        failures.push(`${label}: ${outcome.stderr.slice(0, 300)}`);
      }
    };
    const table = commands();
    for (const command of table) {
      const argv = command.argv.map((word) => (word === 'RUN' ? runId : word));
      for (const flagName of command.flags) {
        for (const [kind, value] of badValues) {
          const outcome = await cli(withValue(argv, flagName, value), command.input);
          check(`${command.name} ${flagName} ${kind}`, outcome);
          // Input that cannot be right is refused: control characters and flag-like values always.
          if (kind === 'ESC' || kind === 'NUL' || kind === 'a flag' || kind === 'missing') {
            if (outcome.code === 0) failures.push(`${command.name} ${flagName} ${kind}: accepted`);
          }
        }
      }
      if (command.name === 'plan' || command.name === 'replay') continue;
      for (const [kind, folder] of [['a file', aFile], ['missing', path.join(root, 'does-not-exist')], ['read-only', readOnly]] as const) {
        const outcome = await cli(withValue(argv, '--data-dir', folder), command.input);
        check(`${command.name} data folder ${kind}`, outcome);
        if (kind === 'a file' && outcome.code !== 1) failures.push(`${command.name} data folder ${kind}: exit ${outcome.code}, expected 1`);
      }
    }
    console.log(`bad-input walk: ${table.length} commands, ${counts.invocations} invocations, ${counts.stackTraces} stack traces, ${counts.hangs} hangs, ${counts.multiLine} multi-line errors`);
    expect(failures).toEqual([]);
    expect(counts).toMatchObject({ stackTraces: 0, hangs: 0, multiLine: 0 });
  });
});

describe('bad command-line input gets one line and the right exit code', () => {
  it('run show of a run that does not exist exits 1 naming it', async () => {
    const outcome = await cli(['run', 'show', '--run', 'nope', '--data-dir', data]);
    expect(outcome.code).toBe(1);
    expect(outcome.stderr).toBe(`tallyline run show: there is no run nope in the data folder ${data}\n`);
  });

  it('feed and verify of a run that does not exist exit 1 naming it', async () => {
    for (const argv of [['feed', '--run', 'nope'], ['verify', '--run', 'nope']]) {
      const outcome = await cli([...argv, '--data-dir', data], 'pass\n');
      expect(outcome.code).toBe(1);
      expect(outcome.stderr).toMatch(/: there is no run nope in the data folder /);
    }
  });

  it('a run id that is not an id exits 2 naming --run and what an id is', async () => {
    const outcome = await cli(['run', 'show', '--run', '../../etc/passwd', '--data-dir', data]);
    expect(outcome.code).toBe(2);
    expect(outcome.stderr).toMatch(/^tallyline run show: --run must be a run id \(letters, digits, "\.", "_" or "-", at most 80\) \(got "\.\.\/\.\.\/etc\/passwd"\)\n$/);
  });

  it('run start --plan of a plan that does not exist exits 1 and writes nothing, not even the source', async () => {
    const fresh = path.join(root, 'fresh-plan-nope');
    await mkdir(fresh);
    const outcome = await cli(['run', 'start', '--plan', 'plan-nope', '--source', 'Nettlefold Springs (invented)', '--lot', 'NS-1', '--data-dir', fresh]);
    expect(outcome.code).toBe(1);
    expect(outcome.stderr).toBe(`tallyline run start: there is no saved plan plan-nope in the data folder ${fresh}\n`);
    expect(await readdir(fresh)).toEqual([]);
  });

  it('run start with a refused plan writes nothing either', async () => {
    const fresh = path.join(root, 'fresh-refused');
    await mkdir(fresh);
    const outcome = await cli(['run', 'start', ...nistFlags, '--truncate', '10000000', '--source', 'Nettlefold Springs (invented)', '--lot', 'NS-2', '--data-dir', fresh]);
    expect(outcome.code).toBe(2);
    expect(outcome.stderr).toMatch(/^tallyline run start: --truncate: truncation must be an integer from 1 to 100000 or none/);
    expect(await readdir(fresh)).toEqual([]);
  });

  it('backup of a data folder that does not exist exits 1 and writes no archive', async () => {
    const archive = path.join(root, 'none.tallyline');
    const outcome = await cli(['backup', '--out', archive, '--data-dir', '/does-not-exist']);
    expect(outcome.code).toBe(1);
    expect(outcome.stderr).toBe('tallyline backup: the data folder /does-not-exist does not exist (give --data-dir an existing folder)\n');
    await expect(readFile(archive)).rejects.toMatchObject({ code: 'ENOENT' });
  });

  it('feed --run --data-dir X does not take --data-dir as the run id: exit 2 naming --run', async () => {
    const outcome = await cli(['feed', '--run', '--data-dir', data], 'pass\n');
    expect(outcome.code).toBe(2);
    expect(outcome.stderr).toMatch(/^tallyline feed: --run needs a value: a run id .*\(got the flag "--data-dir"\)\n$/);
  });

  it('restore --from a folder exits 1 with one line saying it is a folder', async () => {
    const outcome = await cli(['restore', '--from', root, '--data-dir', path.join(root, 'restore-target')]);
    expect(outcome.code).toBe(1);
    expect(outcome.stderr).toBe(`tallyline restore: cannot read ${root}: it is a folder, not a file (EISDIR)\n`);
  });

  it('verify --pdf of a file that is not a PDF exits 1 without a stack trace', async () => {
    const outcome = await cli(['verify', '--run', runId, '--pdf', aFile, '--data-dir', data]);
    expect(outcome.code).toBe(1);
    expect(hasStackTrace(outcome.stdout + outcome.stderr)).toBe(false);
  });

  it('record --out into a folder that does not exist exits 1 with one line', async () => {
    const outcome = await cli(['record', '--run', runId, '--out', path.join(root, 'no', 'such', 'record.pdf'), '--data-dir', data]);
    expect(outcome.code).toBe(1);
    expect(outcome.stderr).toMatch(/^tallyline record: cannot open .*record\.pdf: no such file or folder \(ENOENT\)\n$/);
  });

  it('whitespace-only --source or --lot exits 2 naming the flag', async () => {
    for (const flagName of ['--source', '--lot']) {
      const argv = withValue(['run', 'start', ...nistFlags, '--source', 'S', '--lot', 'L', '--data-dir', data], flagName, '   ');
      const outcome = await cli(argv);
      expect(outcome.code).toBe(2);
      expect(outcome.stderr).toMatch(new RegExp(`^tallyline run start: ${flagName} must be .*printable text, 1 to 120 characters \\(got "   "\\)\\n$`));
    }
  });

  it('--lot with ESC or 100 kB of text exits 2 with a short line that does not echo the escape', async () => {
    const escaped = await cli(['run', 'start', ...nistFlags, '--source', 'S', '--lot', '\u001b[2Jlot', '--data-dir', data]);
    expect(escaped.code).toBe(2);
    expect(escaped.stderr).not.toContain('\u001b');
    expect(escaped.stderr).toContain('\\u001b[2Jlot');
    const huge = await cli(['run', 'start', ...nistFlags, '--source', 'S', '--lot', 'L'.repeat(100_000), '--data-dir', data]);
    expect(huge.code).toBe(2);
    expect(huge.stderr.length).toBeLessThan(300);
    expect(huge.stderr).toContain('(100000 characters)');
  });

  it('p1 next to p0 exits 2 with the engine message, not a RangeError', async () => {
    const outcome = await cli(['plan', '--model', 'passfail', '--p0', '0.01', '--p1', '0.0100001', '--alpha', '0.05', '--beta', '0.1', '--json']);
    expect(outcome.code).toBe(2);
    expect(outcome.stderr).toMatch(/^tallyline plan: --p1: p1 within 0\.001 % of p0 would need about .* items per run .*; widen the gap/);
  });

  it('run show escapes the control characters an older journal holds', async () => {
    const started = await cli(['run', 'start', ...nistFlags, '--source', 'Quillfeather Valves (invented)', '--lot', 'QV-OLD', '--json', '--data-dir', data]);
    const oldRun = JSON.parse(started.stdout).run as string;
    // One open entry only (seq 0, previous = 64 zeros): changing its lot keeps the chain intact, as an old record would be.
    const journal = path.join(data, 'runs', `${oldRun}.journal`);
    const text = await readFile(journal, 'utf8');
    expect(text).toContain('"lot":"QV-OLD"');
    await writeFile(journal, text.replace('"lot":"QV-OLD"', '"lot":"QV\\u001b[2J\\u009bOLD"'));
    // A run written before anchors existed has no anchor file beside its journal.
    await rm(journal.replace(/\.journal$/, '.anchor'));
    const shown = await cli(['run', 'show', '--run', oldRun, '--data-dir', data]);
    expect(shown.code).toBe(0);
    expect(shown.stdout).toContain('lot QV\\u{1B}[2J\\u{9B}OLD');
    expect(shown.stdout).not.toMatch(/[\u001b\u009b]/);
    const json = await cli(['run', 'show', '--run', oldRun, '--json', '--data-dir', data]);
    expect(json.stdout).not.toMatch(/[\u001b\u009b]/);
    expect(JSON.parse(json.stdout).run.lot).toBe('QV\u001b[2J\u009bOLD');
  });
});

describe('the command line refuses a spec whose work has no bound', () => {
  for (const { name, flags, parameter, message } of unboundedSpecs) {
    // A hang is the failure this guards against; the timeout bounds it.
    it(`plan refuses ${name} with exit 2 and one line`, { timeout: 5000 }, async () => {
      const outcome = await cli(['plan', ...flags, '--json']);
      expect(outcome.code).toBe(2);
      expect(outcome.stderr.trimEnd().split('\n')).toHaveLength(1);
      expect(outcome.stderr).toMatch(message);
      expect(outcome.stderr).toContain(`--${parameter === 'truncation' ? 'truncate' : parameter === 'maxFailures' ? 'max-failures' : parameter}: `);
    });
  }
});

describe('the process around runCli (real spawns)', () => {
  it('the process prints the refusal of an unbounded plan as one line and exits 2', { timeout: 30_000 }, async () => {
    const outcome = await spawnCli(['plan', ...unboundedSpecs[0].flags, '--json']);
    expect(outcome.code).toBe(2);
    expect(outcome.stderr).toMatch(/^tallyline plan: --truncate: truncation must be an integer from 1 to 100000 or none \(got 10000000\)\n$/);
  });

  it('the process answers a missing run and a data folder that is a file with one line, exit 1', { timeout: 30_000 }, async () => {
    const missing = await spawnCli(['run', 'show', '--run', 'nope', '--data-dir', data]);
    expect(missing.code).toBe(1);
    expect(missing.stderr).toBe(`tallyline run show: there is no run nope in the data folder ${data}\n`);
    const file = await spawnCli(['backup', '--out', path.join(root, 'x.tallyline'), '--data-dir', aFile]);
    expect(file.code).toBe(1);
    expect(file.stderr).toBe(`tallyline backup: the data folder ${aFile} is a file, not a folder\n`);
  });

  it('feed in its own process reads standard input to the decision', { timeout: 30_000 }, async () => {
    const outcome = await spawnCli(['feed', '--run', runId, '--json', '--data-dir', data], { input: 'pass\npass\n' });
    expect(outcome.stderr).toBe('');
    expect(outcome.code).toBe(0);
    expect(outcome.stdout.trim().split('\n').map((line) => JSON.parse(line).state)).toEqual(['continue', 'continue']);
  });
});
