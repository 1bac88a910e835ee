import { mkdtemp, readFile, readdir, rm, writeFile } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import { gunzip, gzip } from 'node:zlib';
import { afterEach, describe, expect, it } from 'vitest';
import { ARCHIVE_FORMAT, ArchiveRefusedError, RestoreBlockedError, exportArchive, restoreArchive, unpackArchive } from '../../src-main/backup/index.js';
import { seedDemo } from '../../src-main/demo/index.js';

const folders: string[] = [];
afterEach(async () => {
  for (const folder of folders.splice(0)) await rm(folder, { recursive: true, force: true });
});
async function tempFolder(): Promise<string> {
  const folder = await mkdtemp(path.join(os.tmpdir(), 'tallyline-backup-'));
  folders.push(folder);
  return folder;
}

/** Every file under a folder, relative path -> contents. */
async function snapshot(folder: string): Promise<Map<string, string>> {
  const files = new Map<string, string>();
  for (const entry of await readdir(folder, { recursive: true, withFileTypes: true })) {
    if (!entry.isFile()) continue;
    const full = path.join(entry.parentPath, entry.name);
    files.set(path.relative(folder, full), (await readFile(full)).toString('base64'));
  }
  return files;
}

/** A demo data folder (as the app would hold) and another with different data to restore over. */
async function setUp(): Promise<{ source: string; current: string; archive: Buffer }> {
  const root = await tempFolder();
  const source = path.join(root, 'backed-up');
  await seedDemo(source, { start: new Date('2026-03-02T00:00:00Z') });
  const current = path.join(root, 'current');
  await seedDemo(current, { start: new Date('2026-05-04T00:00:00Z'), seed: 99 });
  return { source, current, archive: (await exportArchive(source)).bytes };
}

const textOf = async (archive: Buffer) => (await promisify(gunzip)(archive)).toString('utf8');
const packed = async (text: string) => promisify(gzip)(Buffer.from(text, 'utf8'));

async function expectRefusedAndUntouched(archive: Buffer, current: string, reason: RegExp): Promise<void> {
  const before = await snapshot(current);
  const error = await restoreArchive(archive, current).catch((caught: unknown) => caught);
  expect(error).toBeInstanceOf(ArchiveRefusedError);
  expect((error as Error).message).toMatch(reason);
  expect((error as Error).message).toMatch(/Nothing was restored; the current data is untouched\.$/);
  expect(await snapshot(current)).toEqual(before);
  // No staging folder or dated copy is left beside the data folder.
  expect((await readdir(path.dirname(current))).sort()).toEqual(['backed-up', 'current']);
}

describe('backup and restore', () => {
  it('restores exactly the files that were backed up and keeps the replaced folder, dated', async () => {
    const { source, current, archive } = await setUp();
    const replaced = await snapshot(current);
    const report = await restoreArchive(archive, current, { clock: () => new Date('2026-06-01T10:20:30.456Z') });
    expect(await snapshot(current)).toEqual(await snapshot(source));
    expect(report).toMatchObject({ sources: 3, plans: 3, runs: 13, damagedAtBackup: [], previousDataKeptAt: `${current}.before-restore-20260601T102030Z` });
    expect(await snapshot(report.previousDataKeptAt!)).toEqual(replaced);
  });

  it('restores into a data folder that does not exist yet', async () => {
    const { source, archive } = await setUp();
    const fresh = path.join(await tempFolder(), 'new-home');
    expect((await restoreArchive(archive, fresh)).previousDataKeptAt).toBeNull();
    expect(await snapshot(fresh)).toEqual(await snapshot(source));
  });

  it('writes a manifest with the format, a SHA-256 per file and each journal verified', async () => {
    const { archive } = await setUp();
    const { manifest } = await unpackArchive(archive);
    expect(manifest.format).toBe(ARCHIVE_FORMAT);
    const journals = manifest.files.filter((file) => file.path.endsWith('.journal'));
    expect(journals).toHaveLength(13);
    for (const journal of journals) expect(journal.journal).toMatchObject({ ok: true, fingerprint: expect.stringMatching(/^[0-9a-f]{64}$/) });
    expect(manifest.files.map((file) => file.path)).toContain('settings.json');
  });

  it('refuses an archive with one flipped byte', async () => {
    const { current, archive } = await setUp();
    const flipped = Buffer.from(archive);
    flipped[Math.floor(flipped.length / 2)] ^= 0x01;
    await expectRefusedAndUntouched(flipped, current, /does not unpack as gzip|does not match its SHA-256|not readable JSON/);
  });

  it('refuses a truncated archive', async () => {
    const { current, archive } = await setUp();
    await expectRefusedAndUntouched(archive.subarray(0, archive.length - 100), current, /does not unpack as gzip.*cut short/);
  });

  it('refuses an archive cut at a line boundary and packed again', async () => {
    const { current, archive } = await setUp();
    const lines = (await textOf(archive)).trimEnd().split('\n');
    await expectRefusedAndUntouched(await packed(lines.slice(0, -3).join('\n') + '\n'), current, /manifest lists \d+ files but the archive holds/);
  });

  it('refuses an archive whose journal was edited inside, even when its SHA-256 was edited to match', async () => {
    const { current, archive } = await setUp();
    const lines = (await textOf(archive)).trimEnd().split('\n');
    const manifest = JSON.parse(lines[0]);
    const index = manifest.files.findIndex((file: { path: string }) => file.path.endsWith('.journal'));
    const line = JSON.parse(lines[index + 1]);
    const edited = Buffer.from(Buffer.from(line.base64, 'base64').toString('utf8').replace('"result":"pass"', '"result":"fail"'), 'utf8');
    lines[index + 1] = JSON.stringify({ path: line.path, base64: edited.toString('base64') });
    // Edited inside, manifest as it was: the SHA-256 no longer matches.
    await expectRefusedAndUntouched(await packed(lines.join('\n') + '\n'), current, new RegExp(`"${line.path}" does not match its SHA-256`));
    // Edited inside and the manifest's size and SHA-256 rewritten: the journal's own hash chain still gives it away.
    const { createHash } = await import('node:crypto');
    manifest.files[index] = { ...manifest.files[index], bytes: edited.length, sha256: createHash('sha256').update(edited).digest('hex') };
    lines[0] = JSON.stringify(manifest);
    await expectRefusedAndUntouched(await packed(lines.join('\n') + '\n'), current, new RegExp(`journal "${line.path}" does not verify as it did at backup`));
  });

  it('refuses a file that is not Tallyline data and a file that is not an archive', async () => {
    const { current, archive } = await setUp();
    const lines = (await textOf(archive)).trimEnd().split('\n');
    const manifest = JSON.parse(lines[0]);
    manifest.files[0].path = '../outside.json';
    lines[0] = JSON.stringify(manifest);
    await expectRefusedAndUntouched(await packed(lines.join('\n') + '\n'), current, /"\.\.\/outside\.json", which is not a file of a Tallyline data folder/);
    await expectRefusedAndUntouched(await packed('{"format":"something else"}\n'), current, /not a Tallyline archive/);
  });

  it('refuses to restore while a live process holds a run of the current data open', async () => {
    const { current, archive } = await setUp();
    const runs = await readdir(path.join(current, 'runs'));
    await writeFile(path.join(current, 'runs', runs[0].replace('.journal', '.lock')), String(process.pid));
    await expect(restoreArchive(archive, current)).rejects.toThrow(RestoreBlockedError);
    await expect(restoreArchive(archive, current)).rejects.toThrow(/open for entry in this Tallyline/);
  });

  it('leaves lock files and foreign files out of the archive', async () => {
    const { source } = await setUp();
    await writeFile(path.join(source, 'runs', 'x.lock'), '1');
    await writeFile(path.join(source, 'notes.txt'), 'not ours');
    const exported = await exportArchive(source);
    expect(exported.skipped).toEqual(['notes.txt']);
    expect(exported.manifest.files.some((file) => file.path.endsWith('.lock'))).toBe(false);
  });
});
