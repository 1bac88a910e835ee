/**
 * `tallyline verify`: re-read a run journal and check its hash chain; with `--pdf`, also check that
 * the fingerprint a printed decision record carries (on the page and in its metadata) is the
 * journal's. Exit 1 when either does not hold.
 */
import { readFile } from 'node:fs/promises';
import { fingerprintFromPdf, recordFingerprintMismatches } from '../record/pdf/fingerprintFromPdf.js';
import { RunNotFoundError, createRunCatalogue } from '../inspection/index.js';
import { anchorHolds, type JournalVerification } from '../store/index.js';
import type { Command } from './command.js';
import { EXIT_FAILURE, EXIT_OK } from './command.js';
import { flag, parseFlags, requireFlag } from './flags.js';
import { checkedDataDirectory, dataDirectoryFlags, requireExistingRun } from './dataFolderFlag.js';

const flags = { ...dataDirectoryFlags, run: flag.id('run'), pdf: flag.path('a decision record PDF'), json: flag.switch() };

/** What a record PDF says against the journal: each copy of its fingerprint, and which differ. */
interface RecordCheck {
  file: string;
  /** The fingerprint printed on the page, null when none is found. */
  printed: string | null;
  /** The copies in the metadata (Info Keywords, XMP). */
  metadata: string[];
  matches: boolean;
  /** "printed" and/or "metadata": the copies that are not the journal's fingerprint. */
  differs: Array<'printed' | 'metadata'>;
}

async function checkRecord(file: string, journalFingerprint: string | null): Promise<RecordCheck> {
  const found = await fingerprintFromPdf(await readFile(file));
  const differs = journalFingerprint === null ? (['printed', 'metadata'] as const).slice() : recordFingerprintMismatches(found, journalFingerprint);
  return { file, printed: found.printed, metadata: found.metadata, matches: differs.length === 0, differs };
}

function recordLines(record: RecordCheck, journal: JournalVerification): string[] {
  const journalFingerprint = journal.fingerprint;
  if (record.matches && !journal.ok) {
    // The fingerprint is the hash of the last line: an edit further up breaks the chain but not it.
    return [`Record ${record.file}: its fingerprint is the journal's final hash, but the chain above does not verify, so the entries it vouches for were altered`];
  }
  if (record.matches) return [`Record ${record.file}: its fingerprint matches the journal (printed and metadata)`];
  return [
    `Record ${record.file}: its fingerprint does NOT match the journal (${record.differs.join(' and ')} differ${record.differs.length === 1 ? 's' : ''})`,
    `  journal:  ${journalFingerprint ?? 'none'}`,
    `  printed:  ${record.printed ?? 'none found'}`,
    `  metadata: ${record.metadata.length === 0 ? 'none found' : [...new Set(record.metadata)].join(', ')}`,
  ];
}

export const command: Command = {
  summary: "re-read a run's journal and verify its hash chain (and a printed record with --pdf)",
  usage: [
    'Usage: tallyline verify --run ID [--pdf FILE] [--data-dir DIR] [--json]',
    '  --pdf FILE                 also check the fingerprint printed in this decision record and in its metadata',
    '  --json                     print {ok, entries, fingerprint, problems: [{seq, line, problem, kind}], anchor: {status, seq, fingerprint}}',
    '                             and with --pdf also record: {file, printed, metadata, matches, differs}',
    '  exit code 0 when the chain verifies (and the record matches), 1 when not',
  ].join('\n'),
  async run(args, io) {
    const values = parseFlags(args, flags);
    const runId = requireFlag<string>(values, 'run', flags);
    const dataDirectory = await checkedDataDirectory(args);
    await requireExistingRun(dataDirectory, runId);
    let report: JournalVerification;
    try {
      const read = await createRunCatalogue(dataDirectory).readRun(runId);
      // The chain, the anchor, and every entry replaying as one this app writes: a re-hashed forgery of a result fails here.
      const anchor = read.anchor ?? { status: 'missing' as const, anchor: null };
      report = {
        ok: read.problems.length === 0 && anchorHolds(anchor.status),
        entries: read.entriesRead,
        fingerprint: read.fingerprint,
        problems: [...read.problems],
        anchor: { status: anchor.status, ...(anchor.anchor ?? {}) },
      };
    } catch (error) {
      if (!(error instanceof RunNotFoundError)) throw error;
      io.stderr(`tallyline verify: ${error.message}\n`);
      return EXIT_FAILURE;
    }
    const record = values.pdf === undefined ? null : await checkRecord(values.pdf, report.fingerprint);
    const ok = report.ok && (record?.matches ?? true);
    if (values.json === true) {
      io.stdout(`${JSON.stringify(record === null ? report : { ...report, ok, record })}\n`);
    } else {
      const anchorLine =
        report.anchor.status === 'missing'
          ? ['  no anchor file beside the journal: its last entries cannot be checked against anything outside it']
          : report.anchor.status === 'one-ahead'
            ? [`  the last entry is one past its anchor (seq ${report.anchor.seq}): a crash between journal and anchor; opening the run anchors it`]
            : [];
      const chain = report.ok
        ? [`Run ${runId}: chain verifies, ${report.entries} entries, fingerprint ${report.fingerprint}`, ...anchorLine]
        : [`Run ${runId}: chain does NOT verify`, ...report.problems.map((p) => `  seq ${p.seq} (line ${p.line}): ${p.problem}`), ...anchorLine];
      io.stdout([...chain, ...(record === null ? [] : recordLines(record, report))].join('\n') + '\n');
    }
    return ok ? EXIT_OK : EXIT_FAILURE;
  },
};
