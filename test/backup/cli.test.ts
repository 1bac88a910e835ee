import { mkdtemp, readFile, readdir, rm, writeFile } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { runCli } from '../cli/runCli.js';

const folders: string[] = [];
afterEach(async () => {
  for (const folder of folders.splice(0)) await rm(folder, { recursive: true, force: true });
});

describe('tallyline demo, backup and restore on the real command line', () => {
  it('demo fills a fresh folder, refuses it the second time; backup then restore gives the same files', { timeout: 60_000 }, async () => {
    const root = await mkdtemp(path.join(os.tmpdir(), 'tallyline-backup-cli-'));
    folders.push(root);
    const data = path.join(root, 'data');

    const seeded = await runCli(['demo', '--data-dir', data]);
    expect(seeded.code).toBe(0);
    expect(seeded.stdout).toMatch(/3 sources .*\n.*3 plans, 13 runs: \d+ accepted, \d+ rejected, 1 still open/);
    const again = await runCli(['demo', '--data-dir', data]);
    expect(again.code).toBe(1);
    expect(again.stderr).toMatch(/^tallyline demo: .* already holds Tallyline data \(settings\.json\); the demo fills only an empty folder/);

    const archive = path.join(root, 'all.tallyline-archive');
    const backup = await runCli(['backup', '--out', archive, '--data-dir', data, '--json']);
    expect(backup.code).toBe(0);
    // settings, 3 sources, 3 plan versions, 13 journals and their 13 anchors
    expect(JSON.parse(backup.stdout)).toMatchObject({ file: archive, files: 33, skipped: [], damagedJournals: [] });

    const restoredInto = path.join(root, 'restored');
    const restore = await runCli(['restore', '--from', archive, '--data-dir', restoredInto]);
    expect(restore.code).toBe(0);
    expect(restore.stdout).toMatch(/^Restored 33 files \(3 sources, 3 plans, 13 runs\)/);
    const runs = (await readdir(path.join(data, 'runs'))).sort();
    expect((await readdir(path.join(restoredInto, 'runs'))).sort()).toEqual(runs);
    for (const name of runs) expect(await readFile(path.join(restoredInto, 'runs', name))).toEqual(await readFile(path.join(data, 'runs', name)));

    const cut = path.join(root, 'cut.tallyline-archive');
    await writeFile(cut, (await readFile(archive)).subarray(0, 500));
    const refused = await runCli(['restore', '--from', cut, '--data-dir', restoredInto]);
    expect(refused.code).toBe(1);
    expect(refused.stderr).toMatch(/^tallyline restore: The archive was refused: it does not unpack as gzip .*current data is untouched\.\n$/);

    expect((await runCli(['backup', '--data-dir', data])).stderr).toMatch(/^tallyline backup: --out is required/);
  });
});
