import { mkdir, mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { electronLaunchArguments, findElectronRuntime, tryDownloadElectronRuntime } from '../../src-main/launch/electronRuntime.js';

const made: string[] = [];
async function fakeAppRoot(): Promise<string> {
  const root = await mkdtemp(join(tmpdir(), 'tallyline-launch-'));
  made.push(root);
  await mkdir(join(root, 'node_modules', 'electron', 'dist'), { recursive: true });
  return root;
}
afterEach(async () => {
  await Promise.all(made.splice(0).map((folder) => rm(folder, { recursive: true, force: true })));
});

describe('finding the Electron runtime for npm start', () => {
  it('reports no runtime when the package never wrote path.txt (the download failed)', async () => {
    expect(findElectronRuntime(await fakeAppRoot())).toBeNull();
  });

  it('reports no runtime when path.txt names a binary that is not there', async () => {
    const root = await fakeAppRoot();
    await writeFile(join(root, 'node_modules', 'electron', 'path.txt'), 'electron');
    expect(findElectronRuntime(root)).toBeNull();
  });

  it('finds the binary that path.txt names under dist/', async () => {
    const root = await fakeAppRoot();
    await writeFile(join(root, 'node_modules', 'electron', 'path.txt'), 'electron');
    await writeFile(join(root, 'node_modules', 'electron', 'dist', 'electron'), '');
    expect(findElectronRuntime(root)).toBe(join(root, 'node_modules', 'electron', 'dist', 'electron'));
  });

  it('reports a failed download attempt as false', async () => {
    const root = await fakeAppRoot();
    await writeFile(join(root, 'node_modules', 'electron', 'install.js'), 'process.exit(1)');
    expect(tryDownloadElectronRuntime(root)).toBe(false);
  });
});

describe('launching the Electron runtime for npm start', () => {
  it('passes the app folder, not the main script, so Electron reads package.json and names the app after it', () => {
    expect(electronLaunchArguments('/opt/tallyline', ['--data-dir', './lab-data'])).toEqual(['/opt/tallyline', '--data-dir', './lab-data']);
  });
});
