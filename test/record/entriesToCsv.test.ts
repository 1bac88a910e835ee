import { describe, expect, it } from 'vitest';
import { ENTRY_CSV_COLUMNS, entriesToCsv } from '../../src-main/record/input/entriesToCsv.js';
import type { RecordEntry } from '../../src-main/record/input/decisionRecordInput.js';
import { decidedDemoRun } from './demoRun.js';

/** An independent RFC 4180 reader (quoted fields, doubled quotes, CRLF records) for the round trip. */
function parseCsv(text: string): string[][] {
  const rows: string[][] = [];
  let row: string[] = [];
  let field = '';
  let quoted = false;
  for (let i = 0; i < text.length; i++) {
    const char = text[i];
    if (quoted) {
      if (char === '"' && text[i + 1] === '"') {
        field += '"';
        i++;
      } else if (char === '"') quoted = false;
      else field += char;
    } else if (char === '"') quoted = true;
    else if (char === ',') {
      row.push(field);
      field = '';
    } else if (char === '\r' && text[i + 1] === '\n') {
      row.push(field);
      rows.push(row);
      row = [];
      field = '';
      i++;
    } else field += char;
  }
  if (field !== '' || row.length > 0) throw new Error('CSV does not end with CRLF');
  return rows;
}

const awkward: RecordEntry = {
  sequence: 7,
  recordedAt: '2025-03-14T08:02:11+01:00',
  itemId: 'KF,0007',
  nonconformities: 1,
  resultText: 'nonconforming',
  category: 'burr "sharp"',
  note: 'line one\nline two, with comma\r\nand "quotes" – Müller, 25 µm',
  actor: 'Ó. Ní Bhriain',
  voided: { reason: 'wrong item, "tray 4"', voidSequence: 8, voidedAt: '2025-03-14T08:03:00+01:00', actor: 'T. Okafor' },
};

describe('entriesToCsv', () => {
  it('writes a header row and CRLF line ends', () => {
    const csv = entriesToCsv([awkward]);
    expect(csv.startsWith(`${ENTRY_CSV_COLUMNS.join(',')}\r\n`)).toBe(true);
    expect(csv.endsWith('\r\n')).toBe(true);
  });

  it('quotes commas, double quotes and line breaks, and they survive a round trip', () => {
    const csv = entriesToCsv([awkward]);
    expect(csv).toContain('"KF,0007"');
    expect(csv).toContain('"burr ""sharp"""');
    const [header, row] = parseCsv(csv);
    const record = Object.fromEntries(header.map((name, i) => [name, row[i]]));
    expect(record).toEqual({
      sequence: '7',
      recorded_at: '2025-03-14T08:02:11+01:00',
      item_id: 'KF,0007',
      result: 'nonconforming',
      nonconformities: '1',
      category: 'burr "sharp"',
      note: awkward.note,
      actor: 'Ó. Ní Bhriain',
      voided: 'yes',
      void_reason: 'wrong item, "tray 4"',
      void_sequence: '8',
      voided_at: '2025-03-14T08:03:00+01:00',
      void_actor: 'T. Okafor',
    });
  });

  it('keeps non-ASCII text intact when encoded as UTF-8', () => {
    const bytes = Buffer.from(entriesToCsv([awkward]), 'utf8');
    expect(bytes.toString('utf8')).toContain('Müller, 25 µm');
    expect(bytes.includes(Buffer.from('µ', 'utf8'))).toBe(true);
  });

  it('has one row per entry of the demo run, voided entries included', () => {
    const run = decidedDemoRun();
    const rows = parseCsv(entriesToCsv(run.entries));
    expect(rows.length).toBe(run.entries.length + 1);
    expect(rows.every((row) => row.length === ENTRY_CSV_COLUMNS.length)).toBe(true);
    expect(rows.filter((row) => row[8] === 'yes').length).toBe(run.entries.filter((entry) => entry.voided).length);
  });
});
