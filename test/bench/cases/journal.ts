/**
 * Bench cases for the run journal:
 * - journal-append: the real JournalWriter, one append from call to acknowledgement (written and
 *   fsync'd), median and p99;
 * - journal-reload-10k: read a 10,000-result journal, verify its chain, replay it, recompute the state.
 */
import { createHash } from 'node:crypto';
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import type { LinearCountSpec } from '../../../src-main/engine/index.js';
import { RunReplay } from '../../../src-main/inspection/index.js';
import { JournalWriter, analyseJournal } from '../../../src-main/store/index.js';
import { benchCase } from '../benchCase.js';
import { benchFolder, benchJournalText } from '../benchJournal.js';

const RELOAD_RESULTS = 10_000;

/** Wald plan whose acceptance and rejection lines a result pattern near the midline never leaves. */
const reloadSpec: LinearCountSpec = { model: 'passfail', p0: 0.01, p1: 0.1, alpha: 0.05, beta: 0.05, truncation: null, fit: 'wald' };
// Wald's midline slope s = ln((1-p0)/(1-p1)) / (ln(p1/p0) + ln((1-p0)/(1-p1))) for this plan.
const MIDLINE_SLOPE = Math.log(0.99 / 0.9) / (Math.log(10) + Math.log(0.99 / 0.9));

/** A valid 10,000-result journal whose path stays between the lines. */
function writeLongRun(journalPath: string, runId: string): void {
  const results: Array<'pass' | 'fail'> = [];
  let total = 0;
  for (let n = 1; n <= RELOAD_RESULTS; n += 1) {
    // Fail whenever the count falls below the midline s n: the path stays between the two lines.
    const fail = total < MIDLINE_SLOPE * n;
    total += fail ? 1 : 0;
    results.push(fail ? 'fail' : 'pass');
  }
  writeFileSync(journalPath, benchJournalText(runId, reloadSpec, results, Date.parse('2026-01-05T08:00:00.000Z')));
}

export const cases = [
  benchCase<{ writer: JournalWriter; seq: number }>({
    name: 'journal-append',
    description: 'one run journal entry through the real JournalWriter: serialise, SHA-256 link, write every byte, fsync, acknowledge',
    setup: async () => {
      const { writer } = await JournalWriter.create(path.join(benchFolder(), 'append.journal'), 'bench', {});
      return { writer, seq: 0 };
    },
    run: async (state) => {
      state.seq += 1;
      await state.writer.append('result', 'bench', { itemId: `SN-${state.seq}`, result: 'pass', category: null, note: null });
      return state.seq;
    },
    teardown: (state) => state.writer.close(),
    repeat: 501,
  }),
  benchCase({
    name: 'journal-reload-floor-10k',
    description: 'the least any verifying reload of the same 10,000-result run must do: read, split into lines, one SHA-256 and one JSON.parse per line',
    setup: () => {
      const journalPath = path.join(benchFolder(), 'run-floor.journal');
      writeLongRun(journalPath, 'run-floor');
      return journalPath;
    },
    run: (journalPath) => {
      const lines = readFileSync(journalPath, 'utf8').split('\n');
      let last = '';
      let parsed = 0;
      for (const line of lines) {
        if (line === '') continue;
        last = createHash('sha256').update(line).digest('hex');
        if (JSON.parse(line) !== null) parsed += 1;
      }
      if (parsed !== RELOAD_RESULTS + 1) throw new Error('the floor journal has the wrong number of lines');
      return last;
    },
    repeat: 9,
    warmup: 2,
  }),
  benchCase({
    name: 'journal-reload-10k',
    relativeTo: 'journal-reload-floor-10k',
    description: 'reload a 10,000-result run: read the journal, verify the hash chain, replay the entries, recompute the state',
    setup: () => {
      const folder = benchFolder();
      mkdirSync(folder, { recursive: true });
      const journalPath = path.join(folder, 'run-bench.journal');
      writeLongRun(journalPath, 'run-bench');
      return journalPath;
    },
    run: (journalPath) => {
      const analysis = analyseJournal(readFileSync(journalPath));
      const replay = RunReplay.fromEntries(analysis.entries);
      const state = replay.evidence.state();
      if (analysis.problems.length > 0 || state.n !== RELOAD_RESULTS || state.decision !== 'continue') {
        throw new Error('the bench journal did not reload intact in the continue region');
      }
      return state.llr;
    },
    repeat: 9,
    warmup: 2,
  }),
];

