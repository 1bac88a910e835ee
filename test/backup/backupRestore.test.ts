import { mkdtemp, readFile, readdir, rm, writeFile } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import { gunzip, gzip } from 'node:zlib';
import { afterEach, describe, expect, it } from 'vitest';
import { createHash } from 'node:crypto';
import { ARCHIVE_FORMAT, ArchiveRefusedError, RestoreBlockedError, exportArchive, restoreArchive, unpackArchive } from '../../src-main/backup/index.js';
import { seedDemo } from '../../src-main/demo/index.js';
import { GENESIS_HASH, anchorFileBytes, entryLine, lineHash, verifyJournal, type JournalEntry } from '../../src-main/store/index.js';

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
    const runs = (await readdir(path.join(current, 'runs'))).filter((name) => name.endsWith('.journal'));
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

  it('refuses an archive that unpacks to far more than its manifest accounts for', async () => {
    const { current } = await setUp();
    const settings = Buffer.from('{}');
    const manifest = { format: ARCHIVE_FORMAT, createdAt: '2026-06-01T00:00:00.000Z', files: [{ path: 'settings.json', bytes: settings.length, sha256: createHash('sha256').update(settings).digest('hex') }] };
    // 64 MB of base64 where the manifest lists 2 bytes: about 64 KB once gzip'd.
    const bomb = `${JSON.stringify(manifest)}\n{"path":"settings.json","base64":"${'A'.repeat(64 * 1024 * 1024)}"}\n{"end":true,"files":1}\n`;
    const archive = await packed(bomb);
    expect(archive.length).toBeLessThan(1024 * 1024);
    await expectRefusedAndUntouched(archive, current, /it unpacks to more than the \d+ bytes its manifest accounts for \(1 files\)/);
    await expectRefusedAndUntouched(await packed('x'.repeat(20 * 1024 * 1024)), current, /its first line runs past 16777216 bytes without ending/);
  });

  it('refuses an archive whose journal, consistently re-hashed and re-listed, holds a result the run cannot replay', async () => {
    const { current, archive } = await setUp();
    const doctored = await doctorJournal(archive, (lines) => lines.map((line) => line.replace('"result":"pass"', '"result":"maybe"')), true);
    await expectRefusedAndUntouched(doctored.archive, current, new RegExp(`the journal "${doctored.path}" does not replay: seq ${doctored.firstChangedSeq}: payload field "result"`));
  });

  it('refuses an archive whose journal lost its last line when the anchor archived beside it still names that line', async () => {
    const { current, archive } = await setUp();
    const doctored = await doctorJournal(archive, (lines) => lines.slice(0, -1), false);
    await expectRefusedAndUntouched(doctored.archive, current, new RegExp(`the journal "${doctored.path}" does not stand against its anchor as it did at backup \\(anchored then, behind now`));
  });

  it('restores an archive made before anchors were kept and anchors its journals', async () => {
    const { archive } = await setUp();
    const lines = (await textOf(archive)).trimEnd().split('\n');
    const manifest = JSON.parse(lines[0]);
    const keep = manifest.files.map((file: { path: string }) => !file.path.endsWith('.anchor'));
    const files = manifest.files.filter((_: unknown, index: number) => keep[index]).map(({ journal, ...file }: { journal?: Record<string, unknown> }) =>
      journal === undefined ? file : { ...file, journal: { ok: journal.ok, entries: journal.entries, fingerprint: journal.fingerprint } },
    );
    const older = [JSON.stringify({ ...manifest, files }), ...lines.slice(1, -1).filter((_, index) => keep[index]), JSON.stringify({ end: true, files: files.length })];
    const fresh = path.join(await tempFolder(), 'from-older');
    const report = await restoreArchive(await packed(older.join('\n') + '\n'), fresh);
    expect(report.damagedAtBackup).toEqual([]);
    const journals = (await readdir(path.join(fresh, 'runs'))).filter((name) => name.endsWith('.journal'));
    expect(journals).toHaveLength(13);
    for (const name of journals) expect(await verifyJournal(path.join(fresh, 'runs', name))).toMatchObject({ ok: true, anchor: { status: 'anchored' } });
  });
});

/**
 * Changes one journal inside an archive as a forger who knows every format would: the chain is
 * re-linked, the manifest's size, SHA-256 and chain check rewritten; with `reanchor` the anchor
 * file and its manifest entry too (so only the replay can tell).
 */
async function doctorJournal(archive: Buffer, change: (lines: string[]) => string[], reanchor: boolean) {
  const lines = (await textOf(archive)).trimEnd().split('\n');
  const manifest = JSON.parse(lines[0]);
  const index = manifest.files.findIndex((file: { path: string; journal?: { entries: number } }) => file.path.endsWith('.journal') && (file.journal?.entries ?? 0) > 8);
  const journalPath: string = manifest.files[index].path;
  const original = Buffer.from(JSON.parse(lines[index + 1]).base64, 'base64').toString('utf8').trimEnd().split('\n');
  const changed = change(original);
  let previous = GENESIS_HASH;
  const relinked = changed.map((line) => {
    const out = entryLine({ ...(JSON.parse(line) as JournalEntry), previous });
    previous = lineHash(out);
    return out;
  });
  const firstChangedSeq = changed.findIndex((line, seq) => line !== original[seq]);
  const sha = (bytes: Buffer) => createHash('sha256').update(bytes).digest('hex');
  const put = (at: number, bytes: Buffer, extra: Record<string, unknown>) => {
    manifest.files[at] = { ...manifest.files[at], bytes: bytes.length, sha256: sha(bytes), ...extra };
    lines[at + 1] = JSON.stringify({ path: manifest.files[at].path, base64: bytes.toString('base64') });
  };
  const anchor = { seq: relinked.length - 1, fingerprint: previous };
  put(index, Buffer.from(relinked.join('\n') + '\n'), {
    journal: { ok: true, entries: relinked.length, fingerprint: previous, anchor: reanchor ? { status: 'anchored', ...anchor } : manifest.files[index].journal.anchor },
  });
  if (reanchor) put(manifest.files.findIndex((file: { path: string }) => file.path === journalPath.replace('.journal', '.anchor')), anchorFileBytes(anchor), {});
  lines[0] = JSON.stringify(manifest);
  return { archive: await packed(lines.join('\n') + '\n'), path: journalPath, firstChangedSeq };
}
