import { describe, expect, it } from 'vitest';
import { readFile, writeFile } from 'node:fs/promises';
import { JournalTamperedError, JournalWriter, verifyJournal } from '../../src-main/store/journal/index.js';
import { tempFolder, writeSampleJournal } from './helpers.js';

async function rewriteLines(journalPath: string, change: (lines: string[]) => string[]): Promise<void> {
  const lines = (await readFile(journalPath, 'utf8')).split('\n').slice(0, -1);
  await writeFile(journalPath, change(lines).join('\n') + '\n');
}

async function expectTamperedAt(journalPath: string, seq: number): Promise<void> {
  const report = await verifyJournal(journalPath);
  expect(report.ok).toBe(false);
  expect(report.problems[0]).toMatchObject({ seq, kind: 'tampered' });
  const refusal = await JournalWriter.open(journalPath).catch((error: unknown) => error);
  expect(refusal).toBeInstanceOf(JournalTamperedError);
  expect(refusal).toMatchObject({ firstBadSeq: seq });
}

describe('tamper detection in the run journal', () => {
  it('names an edited result line by its seq', async () => {
    const journalPath = await writeSampleJournal(await tempFolder(), 8);
    await rewriteLines(journalPath, (lines) => lines.map((line, index) => (index === 5 ? line.replace('"pass"', '"fail"') : line)));
    await expectTamperedAt(journalPath, 5);
  });

  it('names a deleted line by the seq that went missing', async () => {
    const journalPath = await writeSampleJournal(await tempFolder(), 8);
    await rewriteLines(journalPath, (lines) => lines.filter((_, index) => index !== 3));
    await expectTamperedAt(journalPath, 3);
  });

  it('names two swapped lines by the first seq out of place', async () => {
    const journalPath = await writeSampleJournal(await tempFolder(), 8);
    await rewriteLines(journalPath, (lines) => {
      const swapped = [...lines];
      [swapped[5], swapped[6]] = [swapped[6], swapped[5]];
      return swapped;
    });
    await expectTamperedAt(journalPath, 5);
  });

  it('treats a line that is not JSON in the middle as tampering, not as a torn tail', async () => {
    const journalPath = await writeSampleJournal(await tempFolder(), 8);
    await rewriteLines(journalPath, (lines) => lines.map((line, index) => (index === 2 ? line.slice(0, 20) : line)));
    await expectTamperedAt(journalPath, 2);
  });

  it('treats a renumbered entry as a sequence gap at the seq it replaced', async () => {
    const journalPath = await writeSampleJournal(await tempFolder(), 4);
    await rewriteLines(journalPath, (lines) => lines.map((line, index) => (index === 2 ? line.replace('"seq":2', '"seq":7') : line)));
    await expectTamperedAt(journalPath, 2);
  });

  it('refuses a first entry that is not the open header', async () => {
    const journalPath = await writeSampleJournal(await tempFolder(), 2);
    await rewriteLines(journalPath, (lines) => lines.map((line, index) => (index === 0 ? line.replace('"kind":"open"', '"kind":"result"') : line)));
    await expectTamperedAt(journalPath, 0);
  });
});
