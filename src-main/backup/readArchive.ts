/**
 * Unpacks and checks a `tallyline.archive/1` in memory: it must unzip, carry our manifest, hold
 * exactly the files the manifest lists, in its order, with matching size and SHA-256, each at a
 * path of the data folder's layout. Anything else refuses the whole archive.
 */
import { promisify } from 'node:util';
import { gunzip } from 'node:zlib';
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

const gunzipAsync = promisify(gunzip);

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

export async function unpackArchive(bytes: Uint8Array): Promise<UnpackedArchive> {
  let text: string;
  try {
    text = (await gunzipAsync(bytes)).toString('utf8');
  } catch (error) {
    throw new ArchiveRefusedError(`it does not unpack as gzip (${(error as Error).message}): the file is damaged, cut short or not a Tallyline archive`);
  }
  const lines = text.split('\n');
  if (lines.at(-1) === '') lines.pop();
  const first = lines[0] ?? '';
  if (!first.includes(`"format":"${ARCHIVE_FORMAT}"`)) {
    throw new ArchiveRefusedError(`it does not start with a "${ARCHIVE_FORMAT}" manifest, so it is not a Tallyline archive of this version`);
  }
  const manifest = parseLine(first, manifestSchema, 'manifest');
  const expectedLines = manifest.files.length + 2;
  if (lines.length !== expectedLines) {
    throw new ArchiveRefusedError(`the manifest lists ${manifest.files.length} files but the archive holds ${Math.max(0, lines.length - 2)} (it is cut short or edited)`);
  }
  const end = parseLine(lines.at(-1), endLineSchema, 'closing line');
  if (end.files !== manifest.files.length) {
    throw new ArchiveRefusedError(`its closing line counts ${end.files} files, the manifest ${manifest.files.length}`);
  }
  const files = manifest.files.map((listed, index): ArchivedFile => {
    if (!isArchivedPath(listed.path)) throw new ArchiveRefusedError(`it holds "${listed.path}", which is not a file of a Tallyline data folder`);
    const line = parseLine(lines[index + 1], fileLineSchema, `file line ${index + 1}`);
    if (line.path !== listed.path) throw new ArchiveRefusedError(`file ${index + 1} is "${line.path}" where the manifest lists "${listed.path}"`);
    const contents = Buffer.from(line.base64, 'base64');
    if (contents.length !== listed.bytes || sha256(contents) !== listed.sha256) {
      throw new ArchiveRefusedError(`"${listed.path}" does not match its SHA-256 in the manifest (it was changed after the backup)`);
    }
    return { ...listed, contents };
  });
  const seen = new Set<string>();
  for (const file of files) {
    if (seen.has(file.path)) throw new ArchiveRefusedError(`it holds "${file.path}" twice`);
    seen.add(file.path);
  }
  return { manifest, files };
}
