/**
 * Unpacks and checks a `tallyline.archive/1`: it must unzip, carry our manifest, hold exactly the
 * files the manifest lists, in its order, with matching size and SHA-256, each at a path of the
 * data folder's layout. Anything else refuses the whole archive.
 *
 * Method: the gzip stream is inflated piece by piece and cut into lines as it comes, never held
 * whole. Until the manifest line is complete at most MANIFEST_LINE_LIMIT bytes are inflated; then
 * the manifest fixes how long the rest must be (each file's line is its path and its bytes in
 * base64, so its length follows from the listed size), and inflating past that, plus a small
 * margin, refuses the archive at once: a small file that unpacks to far more than it declares
 * (a "zip bomb") costs no more memory than its honest contents would.
 */
import { createGunzip } from 'node:zlib';
import type { z } from 'zod';
import {
  ARCHIVE_FORMAT,
  ArchiveRefusedError,
  endLineSchema,
  fileLineSchema,
  isArchivedPath,
  manifestSchema,
  type ArchiveManifest,
  type ManifestFile,
} from './archiveFormat.js';
import { sha256 } from './exportArchive.js';

/** The longest manifest line read (about 60,000 files' entries). */
export const MANIFEST_LINE_LIMIT = 16 * 1024 * 1024;
/** Slack allowed past the size the manifest accounts for (e.g. a line written with other spacing). */
export const INFLATE_MARGIN = 64 * 1024;

export interface ArchivedFile extends ManifestFile {
  readonly contents: Buffer;
}

export interface UnpackedArchive {
  readonly manifest: ArchiveManifest;
  readonly files: ArchivedFile[];
}

function parseLine<Schema extends z.ZodType>(line: string | undefined, schema: Schema, what: string): z.infer<Schema> {
  let value: unknown;
  try {
    value = JSON.parse(line ?? '');
  } catch {
    throw new ArchiveRefusedError(`its ${what} is not readable JSON (the file is cut short or edited)`);
  }
  const parsed = schema.safeParse(value);
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    throw new ArchiveRefusedError(`its ${what} is not valid at "${issue?.path.join('.') ?? ''}": ${issue?.message ?? 'invalid'}`);
  }
  return parsed.data;
}

/** The inflated size an archive with this manifest has when written by exportArchive. */
export function expectedArchiveSize(manifestLineBytes: number, manifest: ArchiveManifest): number {
  let total = manifestLineBytes + 1;
  for (const file of manifest.files) {
    total += JSON.stringify({ path: file.path, base64: '' }).length + 4 * Math.ceil(file.bytes / 3) + 1;
  }
  return total + JSON.stringify({ end: true, files: manifest.files.length }).length + 1;
}

const NEWLINE = 0x0a;

export async function unpackArchive(bytes: Uint8Array): Promise<UnpackedArchive> {
  let manifest = null as ArchiveManifest | null;
  let cap = MANIFEST_LINE_LIMIT;
  let inflated = 0;
  const files: ArchivedFile[] = [];
  /** Lines after the last listed file: there must be exactly one, the closing line. */
  let trailingLines = 0;
  let lastLine = '';
  let pending: Buffer[] = [];

  const takeLine = (line: Buffer): void => {
    if (manifest === null) {
      const text = line.toString('utf8');
      if (!text.includes(`"format":"${ARCHIVE_FORMAT}"`)) {
        throw new ArchiveRefusedError(`it does not start with a "${ARCHIVE_FORMAT}" manifest, so it is not a Tallyline archive of this version`);
      }
      manifest = parseLine(text, manifestSchema, 'manifest');
      cap = expectedArchiveSize(line.length, manifest) + INFLATE_MARGIN;
      return;
    }
    if (files.length < manifest.files.length) {
      files.push(fileFromLine(manifest.files[files.length], files.length + 1, line.toString('utf8')));
      return;
    }
    trailingLines += 1;
    lastLine = line.toString('utf8');
  };

  const gunzip = createGunzip();
  gunzip.end(bytes);
  try {
    for await (const chunk of gunzip as AsyncIterable<Buffer>) {
      inflated += chunk.length;
      if (inflated > cap) {
        throw new ArchiveRefusedError(
          manifest === null
            ? `its first line runs past ${MANIFEST_LINE_LIMIT} bytes without ending, so it is no manifest (the file is damaged or built to exhaust memory)`
            : `it unpacks to more than the ${cap} bytes its manifest accounts for (${manifest.files.length} files), so it is damaged or built to exhaust memory`,
        );
      }
      let start = 0;
      for (let newline = chunk.indexOf(NEWLINE, start); newline !== -1; newline = chunk.indexOf(NEWLINE, start)) {
        pending.push(chunk.subarray(start, newline));
        takeLine(pending.length === 1 ? pending[0] : Buffer.concat(pending));
        pending = [];
        start = newline + 1;
      }
      if (start < chunk.length) pending.push(chunk.subarray(start));
    }
  } catch (error) {
    gunzip.destroy();
    if (error instanceof ArchiveRefusedError) throw error;
    throw new ArchiveRefusedError(`it does not unpack as gzip (${(error as Error).message}): the file is damaged, cut short or not a Tallyline archive`);
  }
  if (pending.length > 0) takeLine(Buffer.concat(pending));
  if (manifest === null) throw new ArchiveRefusedError(`it does not start with a "${ARCHIVE_FORMAT}" manifest, so it is not a Tallyline archive of this version`);
  const listed: ArchiveManifest = manifest;
  if (files.length < listed.files.length || trailingLines !== 1) {
    const held = files.length + Math.max(0, trailingLines - 1);
    throw new ArchiveRefusedError(`the manifest lists ${listed.files.length} files but the archive holds ${held} (it is cut short or edited)`);
  }
  const end = parseLine(lastLine, endLineSchema, 'closing line');
  if (end.files !== listed.files.length) {
    throw new ArchiveRefusedError(`its closing line counts ${end.files} files, the manifest ${listed.files.length}`);
  }
  const seen = new Set<string>();
  for (const file of files) {
    if (seen.has(file.path)) throw new ArchiveRefusedError(`it holds "${file.path}" twice`);
    seen.add(file.path);
  }
  return { manifest: listed, files };
}

function fileFromLine(listed: ManifestFile, position: number, text: string): ArchivedFile {
  if (!isArchivedPath(listed.path)) throw new ArchiveRefusedError(`it holds "${listed.path}", which is not a file of a Tallyline data folder`);
  const line = parseLine(text, fileLineSchema, `file line ${position}`);
  if (line.path !== listed.path) throw new ArchiveRefusedError(`file ${position} is "${line.path}" where the manifest lists "${listed.path}"`);
  const contents = Buffer.from(line.base64, 'base64');
  if (contents.length !== listed.bytes || sha256(contents) !== listed.sha256) {
    throw new ArchiveRefusedError(`"${listed.path}" does not match its SHA-256 in the manifest (it was changed after the backup)`);
  }
  return { ...listed, contents };
}
