/** Backup: the whole data folder into one `tallyline.archive/1` file (see archiveFormat.ts). */
import { createHash } from 'node:crypto';
import { readFile } from 'node:fs/promises';
import path from 'node:path';
import { promisify } from 'node:util';
import { gzip } from 'node:zlib';
import { analyseJournal, checkAnchor } from '../store/index.js';
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
 * Reads every file of the data folder once and packs it with its SHA-256; each journal's chain, and
 * how it stands against its anchor, is checked from the very bytes packed and written into the
 * manifest.
 */
export async function exportArchive(dataDirectory: string, now: Date = new Date()): Promise<ExportedArchive> {
  const { files, skipped } = await listDataFiles(dataDirectory);
  const read = (file: string) => readFile(path.join(dataDirectory, ...file.split('/')));
  // Anchors before journals: a writer fsyncs the journal before its anchor, so this order never
  // shows a run being written as behind its anchor.
  const anchors = new Map(await Promise.all(files.filter((file) => file.endsWith('.anchor')).map(async (file) => [file, await read(file)] as const)));
  const contents = await Promise.all(files.map((file) => anchors.get(file) ?? read(file)));
  const manifestFiles = files.map((file, index): ManifestFile => {
    const bytes = contents[index];
    const entry: ManifestFile = { path: file, bytes: bytes.length, sha256: sha256(bytes) };
    if (!file.endsWith('.journal')) return entry;
    const analysis = analyseJournal(bytes);
    const anchorIndex = files.indexOf(file.replace(/\.journal$/, '.anchor'));
    const anchor = checkAnchor(analysis, anchorIndex === -1 ? null : contents[anchorIndex]);
    return {
      ...entry,
      journal: {
        ok: analysis.problems.length === 0,
        entries: analysis.entries.length,
        fingerprint: analysis.fingerprint,
        anchor: { status: anchor.status, ...(anchor.anchor ?? {}) },
      },
    };
  });
  const manifest: ArchiveManifest = { format: ARCHIVE_FORMAT, createdAt: now.toISOString(), files: manifestFiles };
  const lines = [
    JSON.stringify(manifest),
    ...files.map((file, index) => JSON.stringify({ path: file, base64: contents[index].toString('base64') })),
    JSON.stringify({ end: true, files: files.length }),
  ];
  return { bytes: await gzipAsync(Buffer.from(lines.join('\n') + '\n', 'utf8')), manifest, skipped };
}
