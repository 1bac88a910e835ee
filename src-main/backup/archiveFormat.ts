/**
 * The backup archive, `tallyline.archive/1`: one gzip stream (node:zlib) of JSON lines.
 *
 *   line 1      {"format":"tallyline.archive/1","createdAt":…,"files":[{"path","bytes","sha256","journal"?}]}
 *   one a file  {"path":"runs/<id>.journal","base64":"…"}        in the manifest's order
 *   last line   {"end":true,"files":<count>}                       so a cut at a line boundary is seen
 *
 * Paths are relative, with "/" separators, and only those of the data folder's layout. A journal's
 * manifest entry carries its chain verification and how it stood against its anchor (the
 * `runs/<id>.anchor` file, archived too) at backup time, so restore can tell a journal damaged
 * since (refused) from one that was already damaged when backed up (restored as it was).
 */
import { z } from 'zod';

export const ARCHIVE_FORMAT = 'tallyline.archive/1';
export const ARCHIVE_EXTENSION = '.tallyline-archive';

const SEGMENT = '[A-Za-z0-9][A-Za-z0-9._-]{0,79}';
/** The files of the data folder an archive may hold (see store/layout.ts). */
const ARCHIVED_PATHS = [
  /^settings\.json$/,
  new RegExp(`^sources/${SEGMENT}\\.json$`),
  new RegExp(`^plans/${SEGMENT}/v[1-9]\\d{0,8}\\.json$`),
  new RegExp(`^runs/${SEGMENT}\\.(journal|quarantine|anchor)$`),
];

/** Whether a relative path is one of the data folder's own files (and cannot leave the folder). */
export function isArchivedPath(relativePath: string): boolean {
  return !relativePath.includes('..') && ARCHIVED_PATHS.some((pattern) => pattern.test(relativePath));
}

/** How a journal stood against its anchor at backup (see store/journal/anchor.ts); absent in older archives. */
export const anchorCheckSchema = z.object({
  status: z.enum(['anchored', 'one-ahead', 'missing', 'behind', 'differs', 'ahead', 'unreadable']),
  seq: z.number().int().nonnegative().optional(),
  fingerprint: z.string().regex(/^[0-9a-f]{64}$/).optional(),
});

export const journalCheckSchema = z.object({
  /** The hash chain alone verifies. */
  ok: z.boolean(),
  entries: z.number().int().nonnegative(),
  fingerprint: z.string().nullable(),
  anchor: anchorCheckSchema.optional(),
});
export type JournalCheck = z.infer<typeof journalCheckSchema>;

export const manifestFileSchema = z.object({
  path: z.string().min(1).max(300),
  bytes: z.number().int().nonnegative(),
  sha256: z.string().regex(/^[0-9a-f]{64}$/),
  journal: journalCheckSchema.optional(),
});
export type ManifestFile = z.infer<typeof manifestFileSchema>;

export const manifestSchema = z.object({
  format: z.literal(ARCHIVE_FORMAT),
  createdAt: z.string(),
  files: z.array(manifestFileSchema),
});
export type ArchiveManifest = z.infer<typeof manifestSchema>;

export const fileLineSchema = z.object({ path: z.string(), base64: z.string() });
export const endLineSchema = z.object({ end: z.literal(true), files: z.number().int().nonnegative() });

/** An archive that restore will not use; the message says what is wrong and that nothing changed. */
export class ArchiveRefusedError extends Error {
  readonly code = 'ARCHIVE_REFUSED';
  constructor(reason: string) {
    super(`The archive was refused: ${reason}. Nothing was restored; the current data is untouched.`);
    this.name = 'ArchiveRefusedError';
  }
}

/** Restore cannot run now (e.g. a run is open for writing); the data is untouched. */
export class RestoreBlockedError extends Error {
  readonly code = 'RESTORE_BLOCKED';
  constructor(reason: string) {
    super(`Restore cannot run now: ${reason}. Nothing was restored; the current data is untouched.`);
    this.name = 'RestoreBlockedError';
  }
}

/** A file name for a new archive, e.g. `tallyline-backup-20261201-2250.tallyline-archive`. */
export function archiveFileName(now: Date): string {
  const stamp = now.toISOString().slice(0, 16).replaceAll('-', '').replace(':', '').replace('T', '-');
  return `tallyline-backup-${stamp}${ARCHIVE_EXTENSION}`;
}
