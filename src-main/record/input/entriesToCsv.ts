import type { RecordEntry } from './decisionRecordInput.js';

/** Column names of the entries CSV, in order. */
export const ENTRY_CSV_COLUMNS = [
  'sequence',
  'recorded_at',
  'item_id',
  'result',
  'nonconformities',
  'category',
  'note',
  'actor',
  'voided',
  'void_reason',
  'void_sequence',
  'voided_at',
  'void_actor',
] as const;

const NEEDS_QUOTES = /[",\r\n]/;

/** One CSV field: quoted when it holds a comma, a double quote or a line break; quotes doubled. */
function csvField(value: string): string {
  return NEEDS_QUOTES.test(value) ? `"${value.replaceAll('"', '""')}"` : value;
}

/**
 * The entries of a run as CSV text (RFC 4180: CRLF line ends, header row, fields with commas,
 * quotes or line breaks quoted with inner quotes doubled). Encode the result as UTF-8.
 *
 * References: Shafranovich, 2005, RFC 4180 "Common Format and MIME Type for CSV Files", section 2.
 */
export function entriesToCsv(entries: readonly RecordEntry[]): string {
  const lines = [ENTRY_CSV_COLUMNS.join(',')];
  for (const entry of entries) {
    const row = [
      String(entry.sequence),
      entry.recordedAt,
      entry.itemId,
      entry.resultText,
      String(entry.nonconformities),
      entry.category ?? '',
      entry.note ?? '',
      entry.actor,
      entry.voided ? 'yes' : 'no',
      entry.voided?.reason ?? '',
      entry.voided ? String(entry.voided.voidSequence) : '',
      entry.voided?.voidedAt ?? '',
      entry.voided?.actor ?? '',
    ];
    lines.push(row.map(csvField).join(','));
  }
  return lines.join('\r\n') + '\r\n';
}
