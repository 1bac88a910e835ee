import { describe, expect, it } from 'vitest';
import { spawn, type ChildProcess } from 'node:child_process';
import { readFile, readdir, rm, writeFile } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import {
  JournalBusyError,
  JournalChangedError,
  JournalWriter,
  lockPathFor,
  verifyJournal,
} from '../../src-main/store/journal/index.js';
import { processStart } from '../../src-main/store/journal/lock.js';
import { tempFolder, writeSampleJournal } from './helpers.js';

/** The pid of a process that has exited (reaped, so no process has it unless the system reused it). */
async function deadPid(): Promise<number> {
  const child = spawn(process.execPath, ['-e', ''], { stdio: 'ignore' });
  await new Promise((resolve) => child.on('exit', resolve));
  return child.pid!;
}

/** A process that keeps running until killed. */
async function livingProcess(): Promise<ChildProcess> {
  const child = spawn(process.execPath, ['-e', 'setInterval(() => {}, 1000)'], { stdio: 'ignore' });
  await new Promise((resolve) => child.on('spawn', resolve));
  return child;
}

async function withLivingProcess(run: (child: ChildProcess) => Promise<void>): Promise<void> {
  const child = await livingProcess();
  try {
    await run(child);
  } finally {
    child.kill('SIGKILL');
  }
}

const lockOf = async (journalPath: string) => JSON.parse(await readFile(lockPathFor(journalPath), 'utf8'));
const strays = async (folder: string) => (await readdir(folder)).filter((name) => name.startsWith('.'));

describe('the lock of a run journal', () => {
  it('records its owner whole: pid, a random token, the process start and the host', async () => {
    const journalPath = await writeSampleJournal(await tempFolder(), 1);
    const { writer } = await JournalWriter.open(journalPath);
    const owner = await lockOf(journalPath);
    expect(owner).toEqual({ pid: process.pid, token: expect.stringMatching(/^[0-9a-f]{32}$/), started: await processStart(process.pid), host: os.hostname() });
    await writer.close();
    await expect(readFile(lockPathFor(journalPath))).rejects.toMatchObject({ code: 'ENOENT' });
    expect(await strays(path.dirname(journalPath))).toEqual([]);
  });

  it('takes over a lock whose process has exited, and the lock then names the new owner', async () => {
    const journalPath = await writeSampleJournal(await tempFolder(), 1);
    await writeFile(lockPathFor(journalPath), JSON.stringify({ pid: await deadPid(), token: 'f'.repeat(32), started: null, host: os.hostname() }));
    const { writer } = await JournalWriter.open(journalPath);
    expect(await lockOf(journalPath)).toMatchObject({ pid: process.pid });
    await writer.close();
    expect(await strays(path.dirname(journalPath))).toEqual([]);
  });

  it('takes over a lock that is empty or unreadable, as a power cut can leave one', async () => {
    const journalPath = await writeSampleJournal(await tempFolder(), 1);
    await writeFile(lockPathFor(journalPath), '');
    const { writer } = await JournalWriter.open(journalPath);
    await writer.close();
  });

  it('refuses while the recorded owner runs, naming its pid (also for a lock holding only a pid)', async () => {
    await withLivingProcess(async (child) => {
      const journalPath = await writeSampleJournal(await tempFolder(), 1);
      await writeFile(lockPathFor(journalPath), JSON.stringify({ pid: child.pid, token: 'a'.repeat(32), started: await processStart(child.pid!), host: os.hostname() }));
      await expect(JournalWriter.open(journalPath)).rejects.toMatchObject({ name: 'JournalBusyError', holderPid: child.pid });
      await writeFile(lockPathFor(journalPath), String(child.pid));
      await expect(JournalWriter.open(journalPath)).rejects.toBeInstanceOf(JournalBusyError);
    });
  });

  // /proc/<pid>/stat gives a process's start time on Linux only; elsewhere the pid alone decides.
  it.runIf(process.platform === 'linux')('takes over a lock whose pid now belongs to a process started at another time (a reused pid)', async () => {
    await withLivingProcess(async (child) => {
      const journalPath = await writeSampleJournal(await tempFolder(), 1);
      await writeFile(lockPathFor(journalPath), JSON.stringify({ pid: child.pid, token: 'b'.repeat(32), started: 'linux:1', host: os.hostname() }));
      const { writer } = await JournalWriter.open(journalPath);
      await writer.close();
    });
  });

  it('leaves a lock of another host alone: its pid says nothing here', async () => {
    const journalPath = await writeSampleJournal(await tempFolder(), 1);
    await writeFile(lockPathFor(journalPath), JSON.stringify({ pid: await deadPid(), token: 'c'.repeat(32), started: null, host: 'station-7.invalid' }));
    await expect(JournalWriter.open(journalPath)).rejects.toThrow(/open for writing by process \d+ on station-7\.invalid/);
  });

  it('gives a stale lock to exactly one of many takers in one process, and a free one likewise', async () => {
    for (const stale of [true, false]) {
      const journalPath = await writeSampleJournal(await tempFolder(), 1);
      if (stale) await writeFile(lockPathFor(journalPath), JSON.stringify({ pid: await deadPid(), token: 'd'.repeat(32), started: null, host: os.hostname() }));
      const tries = await Promise.allSettled(Array.from({ length: 12 }, () => JournalWriter.open(journalPath)));
      const opened = tries.filter((attempt) => attempt.status === 'fulfilled');
      expect(opened).toHaveLength(1);
      for (const attempt of tries) if (attempt.status === 'rejected') expect(attempt.reason).toBeInstanceOf(JournalBusyError);
      await (opened[0] as PromiseFulfilledResult<Awaited<ReturnType<typeof JournalWriter.open>>>).value.writer.close();
      expect(await strays(path.dirname(journalPath))).toEqual([]);
    }
  });

  it('keeps a lock it no longer owns when it closes', async () => {
    const journalPath = await writeSampleJournal(await tempFolder(), 1);
    const { writer } = await JournalWriter.open(journalPath);
    await writeFile(lockPathFor(journalPath), 'someone else\n');
    await writer.close();
    expect(await readFile(lockPathFor(journalPath), 'utf8')).toBe('someone else\n');
  });
});

describe('a journal writer whose file changed under it', () => {
  it('refuses to append after another writer appended, and the other writer\'s entry stays', async () => {
    const journalPath = await writeSampleJournal(await tempFolder(), 2);
    const first = await JournalWriter.open(journalPath);
    // The lock is removed behind the first writer's back, so a second writer gets in.
    await rm(lockPathFor(journalPath));
    const second = await JournalWriter.open(journalPath);
    const kept = await second.writer.append('result', 'second', { result: 'fail' });
    const refusal = await first.writer.append('result', 'first', { result: 'pass' }).catch((error: unknown) => error);
    expect(refusal).toBeInstanceOf(JournalChangedError);
    expect((refusal as Error).message).toMatch(/changed on disk while this process held it \(\d+ bytes expected, \d+ found\)/);
    await expect(first.writer.append('result', 'first', { result: 'pass' })).rejects.toThrow(/failed earlier and must be reopened/);
    await second.writer.close();
    await first.writer.close();
    const lines = (await readFile(journalPath, 'utf8')).trimEnd().split('\n');
    expect(lines).toHaveLength(4);
    expect(JSON.parse(lines[3])).toMatchObject({ seq: kept.seq, actor: 'second' });
    expect(await verifyJournal(journalPath)).toMatchObject({ ok: true, entries: 4 });
  });

  it('refuses to append after the journal was cut shorter under it', async () => {
    const journalPath = await writeSampleJournal(await tempFolder(), 2);
    const { writer } = await JournalWriter.open(journalPath);
    const bytes = await readFile(journalPath);
    await writeFile(journalPath, bytes.subarray(0, bytes.length - 10));
    await expect(writer.append('result', 'a', { result: 'pass' })).rejects.toBeInstanceOf(JournalChangedError);
    await writer.close();
  });
});
