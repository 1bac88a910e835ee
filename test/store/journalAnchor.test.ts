import { describe, expect, it } from 'vitest';
import { readFile, rm, writeFile } from 'node:fs/promises';
import {
  GENESIS_HASH,
  JournalTamperedError,
  JournalWriter,
  analyseJournal,
  anchorPathFor,
  entryLine,
  lineHash,
  parseAnchor,
  verifyJournal,
  type JournalEntry,
} from '../../src-main/store/journal/index.js';
import { tempFolder, writeSampleJournal } from './helpers.js';

const linesOf = async (journalPath: string): Promise<string[]> => (await readFile(journalPath, 'utf8')).split('\n').slice(0, -1);

/** Re-links every line after an edit, as a forger who knows the format would: the chain verifies again. */
function rehash(lines: readonly string[]): string[] {
  let previous = GENESIS_HASH;
  return lines.map((line) => {
    const entry = JSON.parse(line) as JournalEntry;
    const relinked = entryLine({ ...entry, previous });
    previous = lineHash(relinked);
    return relinked;
  });
}

/** One more entry, correctly linked to the journal's last line, written straight into the file. */
async function appendBehindTheWriter(journalPath: string, count = 1): Promise<void> {
  const lines = await linesOf(journalPath);
  for (let index = 0; index < count; index += 1) {
    const last = JSON.parse(lines.at(-1)!) as JournalEntry;
    lines.push(entryLine({ ...last, seq: last.seq + 1, kind: 'result', payload: { result: 'pass' }, previous: lineHash(lines.at(-1)!) }));
  }
  await writeFile(journalPath, lines.join('\n') + '\n');
}

describe('the anchor beside a run journal', () => {
  it('holds the seq and hash of the last acknowledged entry after every append', async () => {
    const journalPath = await writeSampleJournal(await tempFolder(), 0);
    const { writer } = await JournalWriter.open(journalPath);
    for (let index = 1; index <= 5; index += 1) {
      const entry = await writer.append('result', 'a', { result: 'pass' });
      expect(parseAnchor(await readFile(anchorPathFor(journalPath)))).toEqual({ seq: entry.seq, fingerprint: writer.fingerprint });
    }
    await writer.close();
    expect(await verifyJournal(journalPath)).toMatchObject({ ok: true, entries: 6, anchor: { status: 'anchored', seq: 5 } });
  });

  it('shows a re-hashed forged chain: the chain verifies, the anchored entry does not', async () => {
    const journalPath = await writeSampleJournal(await tempFolder(), 6);
    const forged = rehash((await linesOf(journalPath)).map((line, index) => (index === 2 ? line.replace('"pass"', '"fail"') : line)));
    await writeFile(journalPath, forged.join('\n') + '\n');
    expect(analyseJournal(await readFile(journalPath)).problems).toEqual([]);
    const report = await verifyJournal(journalPath);
    expect(report).toMatchObject({ ok: false, anchor: { status: 'differs', seq: 6 } });
    expect(report.problems).toEqual([expect.objectContaining({ seq: 6, kind: 'tampered', problem: expect.stringMatching(/entry 6 does not have the hash its anchor records/) })]);
    await expect(JournalWriter.open(journalPath)).rejects.toMatchObject({ name: 'JournalTamperedError', firstBadSeq: 6 });
  });

  it('shows lines dropped from the end, and refuses to open that journal for writing', async () => {
    const journalPath = await writeSampleJournal(await tempFolder(), 6);
    const lines = await linesOf(journalPath);
    await writeFile(journalPath, lines.slice(0, -2).join('\n') + '\n');
    const report = await verifyJournal(journalPath);
    expect(report).toMatchObject({ ok: false, entries: 5, anchor: { status: 'behind', seq: 6 } });
    expect(report.problems[0]?.problem).toMatch(/ends at seq 4 but its anchor records seq 6: 2 entries were removed from the end/);
    const refusal = await JournalWriter.open(journalPath).catch((error: unknown) => error);
    expect(refusal).toBeInstanceOf(JournalTamperedError);
    expect(refusal).toMatchObject({ firstBadSeq: 5 });
  });

  it('takes a journal one entry ahead of its anchor for a crash between the two, and anchors it on open', async () => {
    const journalPath = await writeSampleJournal(await tempFolder(), 3);
    await appendBehindTheWriter(journalPath);
    expect(await verifyJournal(journalPath)).toMatchObject({ ok: true, entries: 5, problems: [], anchor: { status: 'one-ahead', seq: 3 } });
    const { writer } = await JournalWriter.open(journalPath);
    await writer.close();
    expect(await verifyJournal(journalPath)).toMatchObject({ ok: true, anchor: { status: 'anchored', seq: 4 } });
  });

  it('reports entries added more than one past the anchor', async () => {
    const journalPath = await writeSampleJournal(await tempFolder(), 3);
    await appendBehindTheWriter(journalPath, 2);
    const report = await verifyJournal(journalPath);
    expect(report).toMatchObject({ ok: false, anchor: { status: 'ahead', seq: 3 } });
    expect(report.problems[0]).toMatchObject({ seq: 4, kind: 'tampered', problem: expect.stringMatching(/runs 2 entries past its anchor/) });
  });

  it('does not vouch for a journal without an anchor, and anchors it when the run is next opened for writing', async () => {
    const journalPath = await writeSampleJournal(await tempFolder(), 2);
    await rm(anchorPathFor(journalPath));
    expect(await verifyJournal(journalPath)).toMatchObject({ ok: false, problems: [], anchor: { status: 'missing' } });
    const { writer } = await JournalWriter.open(journalPath);
    await writer.close();
    expect(await verifyJournal(journalPath)).toMatchObject({ ok: true, anchor: { status: 'anchored', seq: 2 } });
  });

  it('reports an anchor file that holds no anchor', async () => {
    const journalPath = await writeSampleJournal(await tempFolder(), 2);
    await writeFile(anchorPathFor(journalPath), 'seq 2\n');
    const report = await verifyJournal(journalPath);
    expect(report).toMatchObject({ ok: false, anchor: { status: 'unreadable' } });
    expect(report.problems[0]?.problem).toMatch(/not a tallyline.anchor\/1 record/);
  });

  it('falls back to the other slot when the newest slot is spoilt (a torn anchor write), reading one-ahead', async () => {
    const journalPath = await writeSampleJournal(await tempFolder(), 3);
    const anchorFile = await readFile(anchorPathFor(journalPath));
    // Entry 3 sits in slot 3 % 2 = 1 (at 4096); entry 2 in slot 0.
    anchorFile.fill(0x00, 4096, 4096 + 60);
    await writeFile(anchorPathFor(journalPath), anchorFile);
    expect(await verifyJournal(journalPath)).toMatchObject({ ok: true, anchor: { status: 'one-ahead', seq: 2 } });
  });
});
