import { describe, expect, it } from 'vitest';
import { readFile } from 'node:fs/promises';
import path from 'node:path';
import {
  GENESIS_HASH,
  JOURNAL_FORMAT,
  JournalBusyError,
  JournalWriter,
  lineHash,
  verifyJournal,
} from '../../src-main/store/journal/index.js';
import { tempFolder, writeSampleJournal } from './helpers.js';

describe('the run journal', () => {
  it('starts with an open header naming tallyline.journal/1 linked to the genesis value', async () => {
    const journalPath = await writeSampleJournal(await tempFolder(), 0);
    const [line] = (await readFile(journalPath, 'utf8')).split('\n');
    const header = JSON.parse(line);
    expect(header).toMatchObject({ seq: 0, kind: 'open', payload: { format: JOURNAL_FORMAT }, previous: GENESIS_HASH });
    expect(header.time).toMatch(/^\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d\.\d{3}Z$/);
    expect(header.offset).toMatch(/^[+-]\d\d:\d\d$/);
  });

  it('links each entry to the SHA-256 of the previous line and ends in the fingerprint', async () => {
    const journalPath = await writeSampleJournal(await tempFolder(), 5);
    const lines = (await readFile(journalPath, 'utf8')).split('\n').filter(Boolean);
    for (let index = 1; index < lines.length; index += 1) {
      expect(JSON.parse(lines[index]).previous).toBe(lineHash(lines[index - 1]));
    }
    const report = await verifyJournal(journalPath);
    expect(report).toEqual({ ok: true, entries: 6, fingerprint: lineHash(lines[5]), problems: [], anchor: { status: 'anchored', seq: 5, fingerprint: lineHash(lines[5]) } });
  });

  it('keeps concurrent appends in call order with consecutive sequence numbers', async () => {
    const journalPath = path.join(await tempFolder(), 'runs', 'c.journal');
    const { writer } = await JournalWriter.create(journalPath, 'test', {});
    const taken = await Promise.all(Array.from({ length: 50 }, (_, index) => writer.append('result', 'a', { index })));
    await writer.close();
    expect(taken.map((entry) => entry.seq)).toEqual(Array.from({ length: 50 }, (_, index) => index + 1));
    expect(taken.map((entry) => (entry.payload as { index: number }).index)).toEqual(Array.from({ length: 50 }, (_, i) => i));
    expect((await verifyJournal(journalPath)).ok).toBe(true);
  });

  it('continues the sequence and the chain after a reopen', async () => {
    const journalPath = await writeSampleJournal(await tempFolder(), 3);
    const { writer, entries } = await JournalWriter.open(journalPath);
    expect(entries).toHaveLength(4);
    const next = await writer.append('result', 'a', { result: 'pass' });
    await writer.close();
    expect(next.seq).toBe(4);
    expect(await verifyJournal(journalPath)).toMatchObject({ ok: true, entries: 5 });
  });

  it('refuses a second writer on the same journal while the first holds it', async () => {
    const journalPath = await writeSampleJournal(await tempFolder(), 1);
    const first = await JournalWriter.open(journalPath);
    await expect(JournalWriter.open(journalPath)).rejects.toBeInstanceOf(JournalBusyError);
    await first.writer.close();
    const second = await JournalWriter.open(journalPath);
    await second.writer.close();
  });

  it('refuses to create a journal that already exists', async () => {
    const journalPath = await writeSampleJournal(await tempFolder(), 1);
    await expect(JournalWriter.create(journalPath, 'test', {})).rejects.toMatchObject({ code: 'EEXIST' });
  });
});
