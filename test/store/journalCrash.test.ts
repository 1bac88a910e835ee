import { describe, expect, it } from 'vitest';
import { spawn } from 'node:child_process';
import { stat } from 'node:fs/promises';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { JournalWriter, quarantinePathFor, verifyJournal } from '../../src-main/store/journal/index.js';
import { tempFolder } from './helpers.js';

const burstScript = fileURLToPath(new URL('./fixtures/appendBurst.ts', import.meta.url));

/** Run the burst child until it has reported `killAfter` seqs, SIGKILL it, return the reported seqs. */
function burstUntilKilled(journalPath: string, killAfter: number): Promise<number[]> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, ['--import', 'tsx', burstScript, journalPath], { stdio: ['ignore', 'pipe', 'pipe'] });
    const reported: number[] = [];
    let buffered = '';
    let stderr = '';
    child.stderr.on('data', (chunk: Buffer) => (stderr += chunk.toString()));
    child.stdout.on('data', (chunk: Buffer) => {
      buffered += chunk.toString();
      const lines = buffered.split('\n');
      buffered = lines.pop() ?? '';
      for (const line of lines) if (/^\d+$/.test(line)) reported.push(Number(line));
      if (reported.length >= killAfter && child.exitCode === null) child.kill('SIGKILL');
    });
    child.on('error', reject);
    child.on('exit', (code, signal) => {
      if (signal === 'SIGKILL') resolve(reported);
      else reject(new Error(`burst child exited by itself (${code}): ${stderr}`));
    });
  });
}

describe('a writer killed mid-burst', () => {
  it('loses no entry it reported as taken, and the journal verifies once reopened', async () => {
    for (const killAfter of [7, 40, 120]) {
      const journalPath = path.join(await tempFolder(), 'runs', 'burst.journal');
      const reported = await burstUntilKilled(journalPath, killAfter);
      expect(reported.length).toBeGreaterThanOrEqual(killAfter);

      const { writer, entries, recovered } = await JournalWriter.open(journalPath);
      await writer.close();
      const seqs = new Set(entries.map((entry) => entry.seq));
      for (const seq of reported) expect(seqs.has(seq)).toBe(true);
      expect(entries.map((entry) => entry.seq)).toEqual(entries.map((_, index) => index));
      if (recovered !== null) expect((await stat(quarantinePathFor(journalPath))).size).toBeGreaterThan(0);
      expect(await verifyJournal(journalPath)).toMatchObject({ ok: true, entries: entries.length });
    }
  });
});
