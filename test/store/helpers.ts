/** Shared test helpers for the store: temp folders and small journals. */
import { mkdtemp, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { afterEach } from 'vitest';
import { JournalWriter } from '../../src-main/store/journal/index.js';

const made: string[] = [];

/** A fresh temp folder, removed after the test. */
export async function tempFolder(): Promise<string> {
  const folder = await mkdtemp(path.join(os.tmpdir(), 'tallyline-store-'));
  made.push(folder);
  return folder;
}

afterEach(async () => {
  await Promise.all(made.splice(0).map((folder) => rm(folder, { recursive: true, force: true })));
});

/** Write a journal with a header and `results` result entries; returns its path. */
export async function writeSampleJournal(folder: string, results: number): Promise<string> {
  const journalPath = path.join(folder, 'runs', 'sample.journal');
  const { writer } = await JournalWriter.create(journalPath, 'test', { run: { id: 'sample' } });
  for (let index = 0; index < results; index += 1) {
    await writer.append('result', 'inspector', { result: index % 3 === 0 ? 'fail' : 'pass' });
  }
  await writer.close();
  return journalPath;
}
