/**
 * Bench cases for the run journal. `npm run bench` (a synchronous runner) takes `cases`:
 * - journal-append: one entry line (serialise, hash, write every byte, fsync), as the writer does;
 * - journal-reload-10k: read a 10,000-result journal, verify its chain, replay it, recompute the state.
 * The runner times synchronous work and prints no percentiles, so the real asynchronous
 * JournalWriter's append latency (median and p99) is measured when this file is run alone:
 * `npx tsx test/bench/cases/journal.ts`.
 */
import { fsyncSync, mkdirSync, mkdtempSync, openSync, readFileSync, rmSync, writeFileSync, writeSync } from 'node:fs';
import { mkdtemp, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import type { PlanSpec } from '../../../src-main/engine/index.js';
import { RunReplay, runState } from '../../../src-main/inspection/index.js';
import {
  GENESIS_HASH,
  JOURNAL_FORMAT,
  JournalWriter,
  PLAN_FORMAT,
  analyseJournal,
  entryLine,
  lineHash,
  type JournalEntry,
} from '../../../src-main/store/index.js';
import { benchCase } from '../bench-case.js';

const APPENDS = 500;
const RELOAD_RESULTS = 10_000;

function percentile(sorted: readonly number[], fraction: number): number {
  return sorted[Math.min(sorted.length - 1, Math.ceil(fraction * sorted.length) - 1)];
}

async function inTempFolder<Value>(work: (folder: string) => Promise<Value>): Promise<Value> {
  const folder = await mkdtemp(path.join(os.tmpdir(), 'tallyline-bench-'));
  try {
    return await work(folder);
  } finally {
    await rm(folder, { recursive: true, force: true });
  }
}

/** The real JournalWriter, one append at a time: latency from call to acknowledgement. */
export function writerAppendLatency(): Promise<Record<string, number>> {
  return inTempFolder(async (folder) => {
    const { writer } = await JournalWriter.create(path.join(folder, 'bench.journal'), 'bench', {});
    const times: number[] = [];
    for (let index = 0; index < APPENDS; index += 1) {
      const started = process.hrtime.bigint();
      await writer.append('result', 'bench', { itemId: `SN-${index}`, result: 'pass', category: null, note: null });
      times.push(Number(process.hrtime.bigint() - started) / 1e6);
    }
    await writer.close();
    times.sort((a, b) => a - b);
    return { appends: APPENDS, medianMs: percentile(times, 0.5), p99Ms: percentile(times, 0.99), maxMs: times.at(-1) ?? 0 };
  });
}

/** Wald plan whose acceptance and rejection lines a result pattern near the midline never leaves. */
const reloadSpec: PlanSpec = { model: 'passfail', p0: 0.01, p1: 0.1, alpha: 0.05, beta: 0.05, truncation: null, fit: 'wald' };
// Wald's midline slope s = ln((1-p0)/(1-p1)) / (ln(p1/p0) + ln((1-p0)/(1-p1))) for this plan.
const MIDLINE_SLOPE = Math.log(0.99 / 0.9) / (Math.log(10) + Math.log(0.99 / 0.9));

/** Write a valid 10,000-result journal in one go (the format, not the fsync path, is what reload reads). */
function writeLongRun(journalPath: string, runId: string): void {
  const start = new Date('2026-01-05T08:00:00.000Z').getTime();
  const plan = { format: PLAN_FORMAT, id: 'plan-bench', version: 1, name: 'bench', sourceId: 'src-bench', spec: reloadSpec, createdAt: new Date(start).toISOString() };
  const run = { id: runId, planId: plan.id, planVersion: 1, sourceId: 'src-bench', lot: 'L', lotSize: null, inspector: null, note: null, createdAt: plan.createdAt };
  const lines: string[] = [];
  let previous = GENESIS_HASH;
  let total = 0;
  const push = (kind: JournalEntry['kind'], payload: unknown): void => {
    const seq = lines.length;
    const line = entryLine({ seq, time: new Date(start + seq * 1000).toISOString(), offset: '+00:00', actor: 'bench', kind, payload, previous });
    lines.push(line);
    previous = lineHash(line);
  };
  push('open', { format: JOURNAL_FORMAT, run, plan, source: { id: 'src-bench', name: 'Bench' } });
  for (let n = 1; n <= RELOAD_RESULTS; n += 1) {
    // Fail whenever the count falls below the midline s n: the path stays between the two lines.
    const fail = total < MIDLINE_SLOPE * n;
    total += fail ? 1 : 0;
    push('result', { itemId: `SN-${n}`, result: fail ? 'fail' : 'pass', category: null, note: null });
  }
  writeFileSync(journalPath, lines.join('\n') + '\n');
}

/** A temp folder for the runner's cases (it has no teardown): removed when the process exits. */
function benchFolder(): string {
  const folder = mkdtempSync(path.join(os.tmpdir(), 'tallyline-bench-'));
  process.once('exit', () => rmSync(folder, { recursive: true, force: true }));
  return folder;
}

export const cases = [
  benchCase({
    name: 'journal-append',
    description: 'one run journal entry: serialise, SHA-256 link, write every byte, fsync (the writer\'s work per append)',
    setup: () => {
      const descriptor = openSync(path.join(benchFolder(), 'append.journal'), 'a');
      return { descriptor, seq: 0, previous: GENESIS_HASH };
    },
    run: (state) => {
      const line = entryLine({
        seq: state.seq,
        time: new Date().toISOString(),
        offset: '+00:00',
        actor: 'bench',
        kind: 'result',
        payload: { itemId: `SN-${state.seq}`, result: 'pass', category: null, note: null },
        previous: state.previous,
      });
      const bytes = Buffer.from(line + '\n');
      for (let written = 0; written < bytes.length; ) written += writeSync(state.descriptor, bytes, written);
      fsyncSync(state.descriptor);
      state.previous = lineHash(line);
      state.seq += 1;
      return state.seq;
    },
    repeat: 201,
  }),
  benchCase({
    name: 'journal-reload-10k',
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
      const state = runState(replay.header.plan.spec, replay.n, replay.total);
      if (analysis.problems.length > 0 || state.n !== RELOAD_RESULTS || state.decision !== 'continue') {
        throw new Error('the bench journal did not reload intact in the continue region');
      }
      return state.llr;
    },
    repeat: 9,
    warmup: 2,
  }),
];

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  process.stdout.write(`${JSON.stringify({ case: 'journal-writer-append', ...(await writerAppendLatency()) })}\n`);
}
