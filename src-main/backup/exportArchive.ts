/** Backup: the whole data folder into one `tallyline.archive/1` file (see archiveFormat.ts). */
import { createHash } from 'node:crypto';
import { readFile } from 'node:fs/promises';
import path from 'node:path';
import { promisify } from 'node:util';
import { gzip } from 'node:zlib';
import { analyseJournal } from '../store/index.js';
import { ARCHIVE_FORMAT, type ArchiveManifest, type ManifestFile } from './archiveFormat.js';
import { listDataFiles } from './dataFiles.js';

const gzipAsync = promisify(gzip);

export interface ExportedArchive {
  readonly bytes: Buffer;
  readonly manifest: ArchiveManifest;
  /** Files in the data folder that are not Tallyline's and were left out. */
  readonly skipped: string[];
}

export function sha256(bytes: Uint8Array): string {
  return createHash('sha256').update(bytes).digest('hex');
}

/**
 * Reads every file of the data folder once and packs it with its SHA-256; each journal's chain is
 * verified from the very bytes packed, and the result written into the manifest.
 */
export async function exportArchive(dataDirectory: string, now: Date = new Date()): Promise<ExportedArchive> {
  const { files, skipped } = await listDataFiles(dataDirectory);
  const contents = await Promise.all(files.map((file) => readFile(path.join(dataDirectory, ...file.split('/')))));
  const manifestFiles = files.map((file, index): ManifestFile => {
    const bytes = contents[index];
    const entry: ManifestFile = { path: file, bytes: bytes.length, sha256: sha256(bytes) };
    if (!file.endsWith('.journal')) return entry;
    const analysis = analyseJournal(bytes);
    return { ...entry, journal: { ok: analysis.problems.length === 0, entries: analysis.entries.length, fingerprint: analysis.fingerprint } };
  });
  const manifest: ArchiveManifest = { format: ARCHIVE_FORMAT, createdAt: now.toISOString(), files: manifestFiles };
  const lines = [
    JSON.stringify(manifest),
    ...files.map((file, index) => JSON.stringify({ path: file, base64: contents[index].toString('base64') })),
    JSON.stringify({ end: true, files: files.length }),
  ];
  return { bytes: await gzipAsync(Buffer.from(lines.join('\n') + '\n', 'utf8')), manifest, skipped };
}
