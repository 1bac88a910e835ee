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

describe('tamper detection on the fast reload path', () => {
  it('catches a one-character edit of any entry, in its time, offset, actor or link, by that entry', async () => {
    const folder = await tempFolder();
    const journalPath = await writeSampleJournal(folder, 6);
    const original = await readFile(journalPath, 'utf8');
    const lines = original.split('\n').slice(0, -1);
    for (let seq = 1; seq < lines.length - 1; seq += 1) {
      for (const [pattern, replacement] of [
        [/"time":"(\d)/, '"time":"9'],
        [/"offset":"[+-]/, (match: string) => match.replace(/[+-]$/, (sign) => (sign === '+' ? '-' : '+'))],
        [/"actor":"(.)/, '"actor":"Z'],
        [/"previous":"(.)/, (match: string) => `"previous":"${match.endsWith('0') ? '1' : '0'}`],
      ] as const) {
        const edited = lines.map((line, index) => (index === seq ? line.replace(pattern, replacement as string) : line));
        expect(edited[seq]).not.toBe(lines[seq]);
        await writeFile(journalPath, edited.join('\n') + '\n');
        const report = await verifyJournal(journalPath);
        expect(report.ok).toBe(false);
        // An edited link is found where it no longer matches (the line before); anything else names the line's own entry.
        expect(report.problems[0]).toMatchObject({ seq: String(pattern).includes('previous') ? seq - 1 : seq, kind: 'tampered' });
      }
    }
    await writeFile(journalPath, original);
    expect((await verifyJournal(journalPath)).ok).toBe(true);
  });

  it('refuses an entry whose time, offset or link has the wrong shape even when the chain is re-hashed around it', async () => {
    const { entryLine, lineHash } = await import('../../src-main/store/journal/format.js');
    const journalPath = await writeSampleJournal(await tempFolder(), 4);
    const lines = (await readFile(journalPath, 'utf8')).split('\n').slice(0, -1);
    for (const [field, value, named] of [
      ['time', '2026-12-05T09:14:03Z', 'time'],
      ['time', '2026-12-05T09:14:03.120z', 'time'],
      ['offset', '+1:00', 'offset'],
      ['offset', '±01:00', 'offset'],
      ['previous', 'A'.repeat(64), 'previous'],
    ] as const) {
      // Rewrite entry 2 with a bad field and re-link every later entry, so only the shape check can catch it.
      const rebuilt = [...lines];
      rebuilt[2] = entryLine({ ...JSON.parse(lines[2]!), [field]: value });
      for (let index = 3; index < rebuilt.length; index += 1) rebuilt[index] = entryLine({ ...JSON.parse(rebuilt[index]!), previous: lineHash(rebuilt[index - 1]!) });
      await writeFile(journalPath, rebuilt.join('\n') + '\n');
      const report = await verifyJournal(journalPath);
      expect(report.problems.find((problem) => problem.seq === 2)).toMatchObject({ kind: 'tampered', problem: expect.stringContaining(`field "${named}"`) });
    }
  });
});
