import { describe, expect, it } from 'vitest';
import { readFile, rm, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { JournalWriter, analyseJournal, quarantinePathFor, verifyJournal } from '../../src-main/store/journal/index.js';
import { tempFolder, writeSampleJournal } from './helpers.js';

describe('a torn final line in the run journal', () => {
  it('is cut off, quarantined and reported at every cut inside the last record', async () => {
    const folder = await tempFolder();
    const original = await writeSampleJournal(folder, 4);
    const bytes = await readFile(original);
    const lastStart = bytes.subarray(0, -1).lastIndexOf(0x0a) + 1;
    const intact = bytes.subarray(0, lastStart);
    const intactReport = await verifyJournal(original);
    const journalPath = path.join(folder, 'cut.journal');
    // Every length from one byte of the last record up to all of it but its newline.
    for (let cut = lastStart + 1; cut < bytes.length; cut += 1) {
      await writeFile(journalPath, bytes.subarray(0, cut));
      await rm(quarantinePathFor(journalPath), { force: true });
      const before = await verifyJournal(journalPath);
      expect(before.ok).toBe(false);
      expect(before.problems).toEqual([expect.objectContaining({ seq: 4, line: 5, kind: 'torn' })]);

      const { writer, entries, recovered } = await JournalWriter.open(journalPath);
      await writer.close();
      expect(entries).toHaveLength(4);
      expect(recovered?.record.base64).toBe(bytes.subarray(lastStart, cut).toString('base64'));
      expect(await readFile(journalPath)).toEqual(intact);
      const quarantined = (await readFile(quarantinePathFor(journalPath), 'utf8')).trim().split('\n');
      expect(quarantined).toHaveLength(1);
      expect(JSON.parse(quarantined[0])).toMatchObject({ fromByte: lastStart, length: cut - lastStart });
      const after = await verifyJournal(journalPath);
      expect(after).toMatchObject({ ok: true, entries: 4 });
      expect(after.fingerprint).not.toBe(intactReport.fingerprint);
    }
  });

  it('is a whole chain when the cut falls exactly after a newline, and the anchor names the entry dropped from the end', async () => {
    const folder = await tempFolder();
    const original = await writeSampleJournal(folder, 4);
    const bytes = await readFile(original);
    const lastStart = bytes.subarray(0, -1).lastIndexOf(0x0a) + 1;
    await writeFile(original, bytes.subarray(0, lastStart));
    expect(analyseJournal(await readFile(original)).problems).toEqual([]);
    const report = await verifyJournal(original);
    expect(report).toMatchObject({ ok: false, entries: 4, anchor: { status: 'behind', seq: 4 } });
    expect(report.problems).toEqual([expect.objectContaining({ seq: 4, line: 5, kind: 'tampered', problem: expect.stringMatching(/ends at seq 3 but its anchor records seq 4: 1 entry was removed from the end/) })]);
  });

  it('includes a complete last line of zeros, as a power cut can leave, and keeps appending after it', async () => {
    const folder = await tempFolder();
    const journalPath = await writeSampleJournal(folder, 2);
    await writeFile(journalPath, Buffer.concat([await readFile(journalPath), Buffer.alloc(40), Buffer.from('\n')]));
    expect((await verifyJournal(journalPath)).problems).toEqual([expect.objectContaining({ seq: 3, kind: 'torn' })]);
    const { writer, recovered } = await JournalWriter.open(journalPath);
    expect(recovered?.record.length).toBe(41);
    expect((await writer.append('result', 'a', { result: 'pass' })).seq).toBe(3);
    await writer.close();
    expect(await verifyJournal(journalPath)).toMatchObject({ ok: true, entries: 4 });
  });

  it('appends a second quarantined tail to the same quarantine file with its time', async () => {
    const folder = await tempFolder();
    const journalPath = await writeSampleJournal(folder, 1);
    for (const junk of ['{"seq":2,"ti', '{"seq":2']) {
      await writeFile(journalPath, Buffer.concat([await readFile(journalPath), Buffer.from(junk)]));
      const { writer } = await JournalWriter.open(journalPath);
      await writer.close();
    }
    const records = (await readFile(quarantinePathFor(journalPath), 'utf8')).trim().split('\n').map((line) => JSON.parse(line));
    expect(records.map((record) => record.text)).toEqual(['{"seq":2,"ti', '{"seq":2']);
    expect(records[0].time).toMatch(/Z$/);
    expect((await verifyJournal(journalPath)).ok).toBe(true);
  });
});
